import { fail } from '@sveltejs/kit';
import { changePasswordSchema } from '$lib/schemas/account';
import { invalidateUserSessions, startSession } from '$lib/server/auth';
import { formError, parseForm } from '$lib/server/forms';
import { requireUser } from '$lib/server/guards';
import { verifyPassword } from '$lib/server/password';
import { countMailRequest, formatWait } from '$lib/server/throttle';
import { findUserById, sendVerificationMail, setPassword } from '$lib/server/users';
import type { Actions } from './$types';

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
	}
} satisfies Actions;
