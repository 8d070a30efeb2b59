import { requestResetSchema } from '$lib/schemas/account';
import { formError, parseForm } from '$lib/server/forms';
import { countMailRequest, formatWait } from '$lib/server/throttle';
import { findUserByEmail, inBackground, sendPasswordResetMail } from '$lib/server/users';
import type { Actions } from './$types';

export const actions = {
	default: async ({ request, url, getClientAddress }) => {
		const { data, values, failure } = await parseForm(request, requestResetSchema);
		if (failure) return failure;
		// Counted per address whether or not it has an account, so the limit reveals nothing either.
		const allowed = await countMailRequest(data.email, getClientAddress());
		if (!allowed.ok) return formError(values, `Too many e-mails asked for. Please wait ${formatWait(allowed.waitMs)}.`, {}, 429);
		const user = await findUserByEmail(data.email);
		// Sent in the background and answered the same way, so neither the words nor the time tell who has an account.
		if (user) inBackground('password reset mail', sendPasswordResetMail(user, url.origin));
		return { sent: true, values };
	}
} satisfies Actions;
