import { requestResetSchema } from '$lib/schemas/account';
import { parseForm } from '$lib/server/forms';
import { findUserByEmail, sendPasswordResetMail } from '$lib/server/users';
import type { Actions } from './$types';

export const actions = {
	default: async ({ request, url }) => {
		const { data, values, failure } = await parseForm(request, requestResetSchema);
		if (failure) return failure;
		const user = await findUserByEmail(data.email);
		if (user) await sendPasswordResetMail(user, url.origin);
		// The same answer either way, so the form does not reveal who has an account.
		return { sent: true, values };
	}
} satisfies Actions;
