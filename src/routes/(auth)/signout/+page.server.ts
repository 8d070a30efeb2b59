import { redirect } from '@sveltejs/kit';
import * as auth from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

export const load = (({ locals }) => {
	if (!locals.user) redirect(303, '/');
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		if (event.locals.session) await auth.invalidateSession(event.locals.session.id);
		auth.deleteSessionTokenCookie(event);
		redirect(303, '/');
	}
} satisfies Actions;
