import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { plainText } from '$lib/plan/text';
import { requestResetSchema } from '$lib/schemas/account';
import { startSession } from '$lib/server/auth';
import { consumeEmailToken, peekEmailToken } from '$lib/server/email-tokens';
import { formError, parseForm } from '$lib/server/forms';
import { homeFor } from '$lib/server/guards';
import { countMailRequest, formatWait } from '$lib/server/throttle';
import { findUserByEmail, findUserById, inBackground, markEmailVerified, sendSignInLinkMail, DISABLED_MESSAGE } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

const tokenSchema = z.object({ token: plainText().min(1, 'This sign-in link is not complete.').max(100, 'This sign-in link is not complete.') });

export const load = (async ({ url, locals }) => {
	if (locals.user) redirect(303, homeFor(locals.user.role));
	const token = url.searchParams.get('token') ?? '';
	// Opening the link only shows a button: mail scanners that fetch links must not use it up.
	return { token, valid: token !== '' && (await peekEmailToken(token, 'sign_in')) !== null, email: url.searchParams.get('email') ?? '' };
}) satisfies PageServerLoad;

export const actions = {
	send: async (event) => {
		const { data, values, failure } = await parseForm(event.request, requestResetSchema);
		if (failure) return failure;
		const allowed = await countMailRequest(data.email, event.getClientAddress());
		if (!allowed.ok) return formError(values, `Too many e-mails asked for. Please wait ${formatWait(allowed.waitMs)}.`, {}, 429);
		const user = await findUserByEmail(data.email);
		// Sent in the background and answered the same way, so neither the words nor the time tell who has an account.
		if (user) inBackground('sign-in link mail', sendSignInLinkMail(user, event.url.origin));
		return { sent: true, values };
	},
	use: async (event) => {
		const { data, values, failure } = await parseForm(event.request, tokenSchema);
		if (failure) return failure;
		const userId = await consumeEmailToken(data.token, 'sign_in');
		const user = userId ? await findUserById(userId) : undefined;
		if (!user) return formError(values, 'This sign-in link has expired or was used already. Ask for a new one.');
		if (user.disabledAt) return formError(values, DISABLED_MESSAGE, {}, 403);
		// The link reached the address, which proves it is the owner's.
		if (!user.emailVerifiedAt) await markEmailVerified(user.id);
		await startSession(event, user.id);
		redirect(303, homeFor(user.role));
	}
} satisfies Actions;
