import { and, count, desc, eq, sql, type SQL } from 'drizzle-orm';
import { z } from 'zod';
import { auditActions } from '$lib/audit';
import { db } from '$lib/server/db';
import { auditLog } from '$lib/server/db/schema';
import { requireRole } from '$lib/server/guards';
import { pageFrom } from '$lib/paging';
import type { PageServerLoad } from './$types';

const day = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/)
	.refine((d) => !Number.isNaN(Date.parse(d)));
/** The filters from the address; anything malformed is ignored rather than refused. */
const filterSchema = z.object({
	actor: z.uuid().catch(''),
	action: z.enum(auditActions).or(z.literal('')).catch(''),
	from: day.or(z.literal('')).catch(''),
	to: day.or(z.literal('')).catch('')
});

export const load = (async (event) => {
	requireRole(event, 'admin');
	const p = event.url.searchParams;
	const f = filterSchema.parse({ actor: p.get('actor') ?? '', action: p.get('action') ?? '', from: p.get('from') ?? '', to: p.get('to') ?? '' });
	const paging = pageFrom(event.url, 50);
	// Days are the admin's own calendar days, in their time zone.
	const localDay = sql`(${auditLog.createdAt} AT TIME ZONE ${event.locals.reader.timeZone})::date`;
	const filters: SQL[] = [];
	if (f.actor) filters.push(eq(auditLog.actorId, f.actor));
	if (f.action) filters.push(eq(auditLog.action, f.action));
	if (f.from) filters.push(sql`${localDay} >= ${f.from}::date`);
	if (f.to) filters.push(sql`${localDay} <= ${f.to}::date`);
	const where = filters.length ? and(...filters) : undefined;
	const entries = await db.select().from(auditLog).where(where).orderBy(desc(auditLog.createdAt)).limit(paging.size).offset(paging.offset);
	const [{ n }] = await db.select({ n: count() }).from(auditLog).where(where);
	const actors = await db
		.selectDistinctOn([auditLog.actorId], { id: auditLog.actorId, name: auditLog.actorName })
		.from(auditLog)
		.where(sql`${auditLog.actorId} IS NOT NULL`)
		.orderBy(auditLog.actorId, desc(auditLog.createdAt));
	actors.sort((a, b) => a.name.localeCompare(b.name));
	return { entries, total: n, filters: f, actors: actors as { id: string; name: string }[], ...paging, swapped: !!(f.from && f.to && f.from > f.to) };
}) satisfies PageServerLoad;
