import { asc, count, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor, user } from '$lib/server/db/schema';
import type { PageServerLoad } from './$types';

export const load = (async () => {
	const byRole = await db.select({ role: user.role, n: count() }).from(user).groupBy(user.role);
	const waiting = await db
		.select({ name: user.name, email: user.email, businessName: contractor.businessName, since: contractor.createdAt })
		.from(contractor)
		.innerJoin(user, eq(user.id, contractor.userId))
		.where(eq(contractor.status, 'awaiting_review'))
		.orderBy(asc(contractor.createdAt));
	return { counts: Object.fromEntries(byRole.map((r) => [r.role, r.n])) as Record<string, number>, waiting };
}) satisfies PageServerLoad;
