import { fail } from '@sveltejs/kit';
import { isMailKind, mailKindsFor } from '$lib/mail-kinds';
import { defaultDistanceUnit } from '$lib/reader';
import { changeEmailSchema, changePasswordSchema, distanceUnitSchema } from '$lib/schemas/account';
import { invalidateUserSessions, startSession } from '$lib/server/auth';
import { contractorDistanceUnit, setContractorDistanceUnit } from '$lib/server/contractors';
import { formError, parseForm } from '$lib/server/forms';
import { requireRole, requireUser } from '$lib/server/guards';
import { verifyPassword } from '$lib/server/password';
import { countMailRequest, formatWait } from '$lib/server/throttle';
import { EmailChangeRefused, EmailTakenError, findUserById, requestEmailChange, sendVerificationMail, setMailOptOut, setPassword } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const me = requireUser(event);
	return {
		mailKinds: mailKindsFor(me.role),
		mailOptOut: me.mailOptOut,
		distanceUnit: me.role === 'contractor' ? ((await contractorDistanceUnit(me.id)) ?? ('auto' as const)) : null,
		localeUnit: defaultDistanceUnit(event.locals.reader.locale)
	};
}) satisfies PageServerLoad;

export const actions = {
	password: async (event) => {
		const me = requireUser(event);
		const { data, values, failure } = await parseForm(event.request, changePasswordSchema);
		if (failure) return failure;
		const user = await findUserById(me.id);
		if (!user || !(await verifyPassword(user.passwordHash, data.current))) {
			return formError(values, 'Please correct the fields marked below.', { current: 'That is not your current password.' });
		}
		await setPassword(user.id, data.password);
		// Every other browser signed in with the old password is signed out; this one stays in.
		await invalidateUserSessions(user.id);
		await startSession(event, user.id);
		return { passwordChanged: true };
	},
	resend: async (event) => {
		const me = requireUser(event);
		if (me.emailVerifiedAt) return fail(400, { message: 'Your e-mail is already confirmed.' });
		const allowed = await countMailRequest(me.email, event.getClientAddress());
		if (!allowed.ok) return fail(429, { message: `Too many confirmation e-mails sent. Please wait ${formatWait(allowed.waitMs)}.` });
		await sendVerificationMail(me, event.url.origin);
		return { resent: true };
	},
	email: async (event) => {
		const me = requireUser(event);
		const { data, values, failure } = await parseForm(event.request, changeEmailSchema);
		if (failure) return fail(failure.status, { ...failure.data, section: 'email' });
		const fields = (message: string, errors: Record<string, string>) => fail(400, { errors, values, message, section: 'email' });
		const user = await findUserById(me.id);
		if (!user || !(await verifyPassword(user.passwordHash, data.current)))
			return fields('Please correct the fields marked below.', { current: 'That is not your current password.' });
		const allowed = await countMailRequest(me.email, event.getClientAddress());
		if (!allowed.ok) return fields(`Too many e-mails sent. Please wait ${formatWait(allowed.waitMs)}.`, {});
		try {
			await requestEmailChange(user, data.email, event.url.origin);
		} catch (err) {
			if (err instanceof EmailTakenError) return fields('Please correct the fields marked below.', { email: 'Another account uses this address.' });
			if (err instanceof EmailChangeRefused) return fields('Please correct the fields marked below.', { email: err.message });
			throw err;
		}
		return { emailChangeSent: data.email.trim().toLowerCase() };
	},
	notices: async (event) => {
		const me = requireUser(event);
		const form = await event.request.formData();
		const on = new Set(form.getAll('on').filter((v): v is string => typeof v === 'string'));
		// Only this role's switches count; an unknown name in the form changes nothing.
		const off = mailKindsFor(me.role).filter((k) => !on.has(k));
		if ([...on].some((k) => !isMailKind(k))) return fail(400, { message: 'Unknown kind of e-mail.', section: 'notices' });
		await setMailOptOut(me.id, off);
		// The page's load reads the switches from the session's user (read before this action), and
		// runs again in this same request when the form was posted without scripts.
		me.mailOptOut = off;
		return { noticesSaved: true };
	},
	distance: async (event) => {
		const me = requireRole(event, 'contractor');
		const { data, failure } = await parseForm(event.request, distanceUnitSchema);
		if (failure) return fail(failure.status, { ...failure.data, section: 'distance' });
		await setContractorDistanceUnit(me.id, data.distanceUnit === 'auto' ? null : data.distanceUnit);
		return { distanceSaved: true };
	}
} satisfies Actions;
