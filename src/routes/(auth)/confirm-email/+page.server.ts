import { confirmEmailChangeSchema } from '$lib/schemas/account';
import { formError, parseForm } from '$lib/server/forms';
import { confirmEmailChange, EmailChangeRefused } from '$lib/server/users';
import type { Actions, PageServerLoad } from './$types';

// The link only shows a button: mail scanners that open links must not use it up.
export const load = (({ url }) => ({ token: url.searchParams.get('token') ?? '' })) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const { data, values, failure } = await parseForm(event.request, confirmEmailChangeSchema);
		if (failure) return failure;
		try {
			const u = await confirmEmailChange(data.token, event.url.origin);
			return { changedTo: u.email };
		} catch (err) {
			if (err instanceof EmailChangeRefused) return formError(values, err.message);
			throw err;
		}
	}
} satisfies Actions;
