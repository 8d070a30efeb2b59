import { redirect } from '@sveltejs/kit';
import { signInSchema } from '$lib/schemas/account';
import { startSession } from '$lib/server/auth';
import { formError, parseForm } from '$lib/server/forms';
import { homeFor, safeRedirect } from '$lib/server/guards';
import { dummyHash, verifyPassword } from '$lib/server/password';
import { countSignInAttempt, formatWait, signInSucceeded } from '$lib/server/throttle';
import { DISABLED_MESSAGE, findUserByEmail } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

export const load = (({ locals, url }) => {
	const redirectTo = url.searchParams.get('redirectTo') ?? '';
	if (locals.user) redirect(303, safeRedirect(redirectTo, homeFor(locals.user.role)));
	return { redirectTo, reset: url.searchParams.has('reset') };
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const { data, values, failure } = await parseForm(event.request, signInSchema);
		if (failure) return failure;
		const ip = event.getClientAddress();
		// Counted before the password is checked, so parallel guesses cannot slip past the limit.
		const gate = await countSignInAttempt(data.email, ip);
		if (!gate.ok) {
			const when = `please wait ${formatWait(gate.waitMs)}`;
			return formError(
				values,
				`Too many sign-in attempts ${gate.scope === 'pair' ? 'from here' : 'on this account'}. For your safety, ${when}, or have a sign-in link e-mailed to you.`,
				{},
				429
			);
		}
		const user = await findUserByEmail(data.email);
		// An unknown address is checked against a dummy hash, so timing does not tell who has an account.
		const ok = await verifyPassword(user?.passwordHash ?? (await dummyHash()), data.password);
		// An account whose address was never confirmed answers like a wrong password: otherwise signing up
		// with an address and then signing in would tell whether the address had an account already.
		if (!user || !ok || !user.emailVerifiedAt)
			return formError(values, 'That e-mail and password do not match an account. Just signed up? Open the link we e-mailed you first.', {
				password: 'Check your password, or reset it.'
			});
		// Told only to someone who knows the password, so it reveals nothing to a guesser.
		if (user.disabledAt) return formError(values, DISABLED_MESSAGE, {}, 403);
		await signInSucceeded(data.email, ip);
		await startSession(event, user.id);
		redirect(303, safeRedirect(values.redirectTo, homeFor(user.role)));
	}
} satisfies Actions;
