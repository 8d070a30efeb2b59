import { redirect } from '@sveltejs/kit';
import { resetPasswordSchema } from '$lib/schemas/account';
import { invalidateUserSessions } from '$lib/server/auth';
import { consumeEmailToken, peekEmailToken } from '$lib/server/email-tokens';
import { formError, parseForm } from '$lib/server/forms';
import { markEmailVerified, setPassword } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load = (async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	return { token, valid: token !== '' && (await peekEmailToken(token, 'reset_password')) !== null };
}) satisfies PageServerLoad;

export const actions = {
	default: async ({ request }) => {
		const { data, values, failure } = await parseForm(request, resetPasswordSchema);
		if (failure) return failure;
		const userId = await consumeEmailToken(data.token, 'reset_password');
		if (!userId) return formError(values, 'This reset link has expired or was used already. Ask for a new one.');
		await setPassword(userId, data.password);
		// The link reached the address, which proves it is the owner's.
		await markEmailVerified(userId);
		// A reset means the old password may be known to someone else: end every session.
		await invalidateUserSessions(userId);
		redirect(303, '/signin?reset=1');
	}
} satisfies Actions;
