import { and, eq, lt, sql } from 'drizzle-orm';
import { db } from './db';
import { plan, planCreateKey, type Plan } from './db/schema';
import { createPlan } from './plans';

/** Keys are kept a day: long enough for any client's retries. */
const KEEP = sql`now() - interval '1 day'`;

export const KEY_RULE = /^[A-Za-z0-9_.:-]{8,100}$/;
export const KEY_MESSAGE = 'The Idempotency-Key header must be 8 to 100 letters, digits or _ . : - characters.';

/**
 * Creates the plan once per (owner, key): the key row and the plan commit together, and a retry
 * with the same key waits on the first (an advisory lock on the pair) and then gets its plan.
 */
export async function createPlanOnce(ownerId: string, key: string, data: Parameters<typeof createPlan>[1]): Promise<{ plan: Plan; replayed: boolean }> {
	return db.transaction(async (tx) => {
		await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`${ownerId}:${key}`}, 0))`);
		await tx.delete(planCreateKey).where(and(eq(planCreateKey.ownerId, ownerId), lt(planCreateKey.createdAt, KEEP)));
		const [seen] = await tx
			.select({ plan })
			.from(planCreateKey)
			.innerJoin(plan, eq(plan.id, planCreateKey.planId))
			.where(and(eq(planCreateKey.ownerId, ownerId), eq(planCreateKey.key, key)));
		if (seen) return { plan: seen.plan, replayed: true };
		const created = await createPlan(ownerId, data, tx);
		await tx.insert(planCreateKey).values({ ownerId, key, planId: created.id });
		return { plan: created, replayed: false };
	});
}
