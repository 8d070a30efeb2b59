import { redirect } from '@sveltejs/kit';
import { signUpSchema } from '$lib/schemas/account';
import { parseForm } from '$lib/server/forms';
import { homeFor, safeRedirect } from '$lib/server/guards';
import { createUser, EmailTakenError, inBackground, normalizeEmail, sendSignUpAttemptMail, sendVerificationMail } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load = (({ locals, url }) => {
	if (locals.user) redirect(303, homeFor(locals.user.role));
	return {
		role: url.searchParams.get('role') === 'contractor' ? 'contractor' : 'homeowner',
		redirectTo: url.searchParams.get('redirectTo') ?? ''
	};
}) satisfies PageServerLoad;

export const actions = {
	// Confirm-first: no session here. A new address gets a confirmation link that signs the account in;
	// a taken one gets a note to its owner. The answer is the same either way, and neither waits on mail.
	default: async (event) => {
		const { data, values, failure } = await parseForm(event.request, signUpSchema);
		if (failure) return failure;
		const next = data.role === 'contractor' ? '/pro' : safeRedirect(values.redirectTo, homeFor(data.role));
		try {
			// Hashes the password before the insert, so a taken address costs the same time as a new one.
			const user = await createUser(data);
			inBackground('verification mail', sendVerificationMail(user, event.url.origin, next));
		} catch (err) {
			if (!(err instanceof EmailTakenError)) throw err;
			inBackground('sign-up attempt mail', sendSignUpAttemptMail(data.email, event.url.origin, next));
		}
		return { sent: true, email: normalizeEmail(data.email) };
	}
} satisfies Actions;
