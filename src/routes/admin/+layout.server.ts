import { count, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor } from '$lib/server/db/schema';
import { requireRole } from '$lib/server/guards';
import type { LayoutServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	// The queue's length, shown on every admin page so a new submission is not missed.
	const [{ n }] = await db.select({ n: count() }).from(contractor).where(eq(contractor.status, 'awaiting_review'));
	return { queueCount: n };
}) satisfies LayoutServerLoad;
