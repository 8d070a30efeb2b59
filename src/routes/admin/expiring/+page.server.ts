import { EXPIRING_WINDOW_DAYS, expiringCredentials } from '$lib/server/credentials';
import { requireRole } from '$lib/server/guards';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	return {
		rows: await expiringCredentials(),
		windowDays: EXPIRING_WINDOW_DAYS
	};
}) satisfies PageServerLoad;
