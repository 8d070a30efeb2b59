import { asc, count, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor, user } from '$lib/server/db/schema';
import { requireRole } from '$lib/server/guards';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	const byRole = await db.select({ role: user.role, n: count() }).from(user).groupBy(user.role);
	// Only profiles sent for review are in the queue; sign-ups still filling theirs in are counted.
	const waiting = await db
		.select({
			id: user.id,
			name: user.name,
			email: user.email,
			businessName: contractor.businessName,
			since: contractor.reviewRequestedAt,
			emailVerifiedAt: user.emailVerifiedAt
		})
		.from(contractor)
		.innerJoin(user, eq(user.id, contractor.userId))
		.where(eq(contractor.status, 'awaiting_review'))
		.orderBy(asc(contractor.reviewRequestedAt));
	const [unfinished] = await db.select({ n: count() }).from(contractor).where(eq(contractor.status, 'draft'));
	return { counts: Object.fromEntries(byRole.map((r) => [r.role, r.n])) as Record<string, number>, waiting, unfinished: unfinished.n };
}) satisfies PageServerLoad;
