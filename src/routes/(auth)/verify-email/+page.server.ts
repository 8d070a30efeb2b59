import { consumeEmailToken } from '$lib/server/email-tokens';
import { markEmailVerified } from '$lib/server/users';
import type { PageServerLoad } from './$types';

export const load = (async ({ url, locals }) => {
	const token = url.searchParams.get('token');
	const userId = token ? await consumeEmailToken(token, 'verify_email') : null;
	if (userId) await markEmailVerified(userId);
	return { verified: userId !== null, signedIn: locals.user !== null };
}) satisfies PageServerLoad;
