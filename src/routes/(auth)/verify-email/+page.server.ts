import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { plainText } from '$lib/plan/text';
import { startSession } from '$lib/server/auth';
import { consumeEmailToken, peekEmailToken } from '$lib/server/email-tokens';
import { formError, parseForm } from '$lib/server/forms';
import { homeFor, safeRedirect } from '$lib/server/guards';
import { findUserById, markEmailVerified } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

const confirmSchema = z.object({
	token: plainText().min(1, 'This confirmation link is not complete.').max(100, 'This confirmation link is not complete.'),
	next: plainText().max(500, 'Use at most 500 characters.').default('')
});

// Opening the link only shows a button: mail scanners that fetch links must not use it up (nor sign in).
export const load = (async ({ url, locals }) => {
	const token = url.searchParams.get('token') ?? '';
	return {
		token,
		next: url.searchParams.get('next') ?? '',
		valid: token !== '' && (await peekEmailToken(token, 'verify_email')) !== null,
		signedIn: locals.user !== null
	};
}) satisfies PageServerLoad;

export const actions = {
	// The link reached the address: the account is confirmed, and a visitor who is not signed in is
	// signed in to it (sign-up gives no session until this point).
	default: async (event) => {
		const { data, values, failure } = await parseForm(event.request, confirmSchema);
		if (failure) return failure;
		const userId = await consumeEmailToken(data.token, 'verify_email');
		const user = userId ? await findUserById(userId) : undefined;
		if (!user) return formError(values, 'This confirmation link has expired or was used already.');
		await markEmailVerified(user.id);
		if (event.locals.user) return { verified: true };
		await startSession(event, user.id);
		redirect(303, safeRedirect(data.next, homeFor(user.role)));
	}
} satisfies Actions;
