import { count, desc } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { auditLog } from '$lib/server/db/schema';
import { requireRole } from '$lib/server/guards';
import { pageFrom } from '$lib/paging';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	const paging = pageFrom(event.url, 50);
	const entries = await db.select().from(auditLog).orderBy(desc(auditLog.createdAt)).limit(paging.size).offset(paging.offset);
	const [{ n }] = await db.select({ n: count() }).from(auditLog);
	return { entries, total: n, ...paging };
}) satisfies PageServerLoad;
