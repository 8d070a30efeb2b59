import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import { POUR_LOG_LIMITS, type PourRecord } from '$lib/plan/pour-log';
import { db } from './db';
import { plan, pourRecord } from './db/schema';
import { scheduleCuringReminders } from './reminders';

type Conn = Parameters<Parameters<typeof db.transaction>[0]>[0] | typeof db;

/** Records that can change the logged pour date, and with it the curing reminder days. */
const DATING = new Set<PourRecord['kind']>(['start', 'batch', 'undo']);

/** Every record of a plan, oldest first. */
export async function listPourRecords(planId: string, conn: Conn = db): Promise<PourRecord[]> {
	const rows = await conn
		.select({ record: pourRecord.record })
		.from(pourRecord)
		.where(eq(pourRecord.planId, planId))
		.orderBy(asc(pourRecord.at), asc(pourRecord.key));
	return rows.map((r) => r.record as PourRecord);
}

export type SaveOutcome = { ok: true; stored: number; keys: string[] } | { ok: false; status: number; message: string };

/**
 * Stores the records once each: a key the plan already holds is skipped (a retry or a replayed
 * queue), so the answer lists every key sent as safe to forget. The count check and the inserts run
 * under a lock on the plan, so two devices sending at once cannot pass the limit together.
 */
export async function savePourRecords(planId: string, records: PourRecord[]): Promise<SaveOutcome> {
	return db.transaction(async (tx) => {
		await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`pour:${planId}`}, 0))`);
		const keys = [...new Set(records.map((r) => r.key))];
		const held = await tx
			.select({ key: pourRecord.key })
			.from(pourRecord)
			.where(and(eq(pourRecord.planId, planId), inArray(pourRecord.key, keys)));
		const seen = new Set(held.map((h) => h.key));
		const fresh = records.filter((r) => !seen.has(r.key) && seen.add(r.key));
		const [{ n }] = await tx
			.select({ n: sql<number>`count(*)::int` })
			.from(pourRecord)
			.where(eq(pourRecord.planId, planId));
		if (n + fresh.length > POUR_LOG_LIMITS.perPlan)
			return { ok: false as const, status: 413, message: `A plan's pour log can hold at most ${POUR_LOG_LIMITS.perPlan} records.` };
		if (fresh.length)
			await tx
				.insert(pourRecord)
				.values(fresh.map((r) => ({ planId, key: r.key, kind: r.kind, pour: 'pour' in r ? r.pour : null, at: new Date(r.at), record: r })))
				.onConflictDoNothing({ target: [pourRecord.planId, pourRecord.key] });
		// A logged start moves the curing reminders to the real pour date, in this same transaction.
		if (fresh.some((r) => DATING.has(r.kind))) {
			const [row] = await tx.select().from(plan).where(eq(plan.id, planId));
			if (row?.curingReminders) await scheduleCuringReminders(tx, row);
		}
		return { ok: true as const, stored: fresh.length, keys };
	});
}
