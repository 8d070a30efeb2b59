import { requireRole } from '$lib/server/guards';
import type { LayoutServerLoad } from './$types';

export const load = ((event) => {
	requireRole(event, 'homeowner');
}) satisfies LayoutServerLoad;
