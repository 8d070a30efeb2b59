import { redirect } from '@sveltejs/kit';
import { signUpSchema } from '$lib/schemas/account';
import { parseForm } from '$lib/server/forms';
import { homeFor, safeRedirect } from '$lib/server/guards';
import { normalizeEmail, signUpOrNotify } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load = (({ locals, url }) => {
	if (locals.user) redirect(303, homeFor(locals.user.role));
	return {
		role: url.searchParams.get('role') === 'contractor' ? 'contractor' : 'homeowner',
		redirectTo: url.searchParams.get('redirectTo') ?? ''
	};
}) satisfies PageServerLoad;

export const actions = {
	// Confirm-first: no session here, and the same answer and the same work whether or not the
	// address has an account (see signUpOrNotify); the e-mailed link signs a new account in.
	default: async (event) => {
		const { data, values, failure } = await parseForm(event.request, signUpSchema);
		if (failure) return failure;
		const next = data.role === 'contractor' ? '/pro' : safeRedirect(values.redirectTo, homeFor(data.role));
		await signUpOrNotify(data, event.url.origin, next);
		return { sent: true, email: normalizeEmail(data.email) };
	}
} satisfies Actions;
