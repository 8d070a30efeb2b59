import { redirect } from '@sveltejs/kit';
import { signInSchema } from '$lib/schemas/account';
import { startSession } from '$lib/server/auth';
import { formError, parseForm } from '$lib/server/forms';
import { homeFor, safeRedirect } from '$lib/server/guards';
import { verifyPassword } from '$lib/server/password';
import { clearSignInFailures, formatWait, recordSignInFailure, signInWait } from '$lib/server/throttle';
import { findUserByEmail } from '$lib/server/users';
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
		const wait = await signInWait(data.email, ip);
		if (wait > 0) return formError(values, `Too many failed sign-ins. For your safety, please wait ${formatWait(wait)} and try again.`, {}, 429);

		const user = await findUserByEmail(data.email);
		if (!user || !(await verifyPassword(user.passwordHash, data.password))) {
			await recordSignInFailure(data.email, ip);
			return formError(values, 'That e-mail and password do not match an account.', { password: 'Check your password, or reset it.' });
		}
		await clearSignInFailures(data.email);
		await startSession(event, user.id);
		redirect(303, safeRedirect(values.redirectTo, homeFor(user.role)));
	}
} satisfies Actions;
