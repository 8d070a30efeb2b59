import { requireUser } from '$lib/server/guards';
import type { LayoutServerLoad } from './$types';

export const load = ((event) => {
	requireUser(event);
}) satisfies LayoutServerLoad;
