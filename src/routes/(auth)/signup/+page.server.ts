import { redirect } from '@sveltejs/kit';
import { signUpSchema } from '$lib/schemas/account';
import { startSession } from '$lib/server/auth';
import { formError, parseForm } from '$lib/server/forms';
import { homeFor, safeRedirect } from '$lib/server/guards';
import { createUser, EmailTakenError, inBackground, sendVerificationMail } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load = (({ locals, url }) => {
	if (locals.user) redirect(303, homeFor(locals.user.role));
	return {
		role: url.searchParams.get('role') === 'contractor' ? 'contractor' : 'homeowner',
		redirectTo: url.searchParams.get('redirectTo') ?? ''
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const { data, values, failure } = await parseForm(event.request, signUpSchema);
		if (failure) return failure;
		let user;
		try {
			user = await createUser(data);
		} catch (err) {
			if (err instanceof EmailTakenError) return formError(values, 'Please correct the fields marked below.', { email: err.message + ' Sign in instead?' });
			throw err;
		}
		// In the background, so a new address costs no more time than a taken one.
		inBackground('verification mail', sendVerificationMail(user, event.url.origin));
		await startSession(event, user.id);
		redirect(303, user.role === 'contractor' ? '/pro' : safeRedirect(values.redirectTo, homeFor(user.role)));
	}
} satisfies Actions;
