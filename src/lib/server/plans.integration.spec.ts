// Saved plans on the real PostgreSQL test database.
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { computePlan, ENGINE_VERSION } from '$lib/plan';
import { db } from './db';
import { plan } from './db/schema';
import { createPlan, deletePlan, duplicatePlan, findOwnPlan, listPlans, PlanInputInvalid, recomputeOutdatedPlans, StaleRevision, updatePlan } from './plans';
import { createUser } from './users';
import { useTestDatabase } from './integration-setup';
import { rect } from '$lib/plan/test-plans';

useTestDatabase();

const owner = () => createUser({ name: 'Plan Owner', email: `plans-${crypto.randomUUID()}@it.stakeline.test`, password: 'plans-password', role: 'homeowner' });
const input = (length = 12) => ({ units: 'imperial', sections: [{ outline: rect(0, 0, length, 10) }] });
/** A bow tie: its outline crosses itself, which the schema refuses. */
const bowTie = {
	units: 'imperial',
	sections: [
		{
			outline: [
				[0, 0],
				[10, 10],
				[10, 0],
				[0, 10]
			]
		}
	]
};

describe('saved plans', () => {
	it('record the engine version of their result; an older one is recomputed from the input', async () => {
		const me = await owner();
		const p = await createPlan(me.id, { name: 'Versioned', input: input() });
		expect(p.engineVersion).toBe(ENGINE_VERSION);
		// What an older engine left: another result (here a 12 × 10 ft slab's for a 16 × 10 ft input), version 0.
		await db
			.update(plan)
			.set({ input: input(16), engineVersion: 0 })
			.where(eq(plan.id, p.id));
		const bad = await createPlan(me.id, { name: 'Now refused', input: input() });
		await db.update(plan).set({ input: bowTie, engineVersion: 0 }).where(eq(plan.id, bad.id));

		const { updated, refused } = await recomputeOutdatedPlans(1);
		expect(updated).toBeGreaterThanOrEqual(1);
		expect(refused).toContain(bad.id);
		const now = (await findOwnPlan(p.id, me.id))!;
		expect(now.engineVersion).toBe(ENGINE_VERSION);
		expect(now.result.area.squareFeet).toBeCloseTo(160, 6); // 16 × 10 ft
		expect(now.revision).toBe(p.revision); // the owner changed nothing
		const kept = (await findOwnPlan(bad.id, me.id))!;
		expect(kept.engineVersion).toBe(0);
		expect(kept.result).toEqual(bad.result);
		expect((await recomputeOutdatedPlans()).updated).toBe(0);
	});

	it('store the input and the result the server computed from it', async () => {
		const me = await owner();
		const p = await createPlan(me.id, { name: 'Back patio', input: input() });
		expect(p.revision).toBe(1);
		// The stored result is the engine's for the input, whatever the client sent alongside.
		expect(p.result).toEqual(JSON.parse(JSON.stringify(computePlan(input()))));
	});

	it('refuse invalid input with paths under input', async () => {
		const me = await owner();
		const err = await createPlan(me.id, { name: 'Bow tie', input: bowTie }).catch((e) => e);
		expect(err).toBeInstanceOf(PlanInputInvalid);
		expect((err as PlanInputInvalid).issues[0].path).toMatch(/^input\.sections/);
	});

	it('save only on top of the current revision (two tabs cannot overwrite each other)', async () => {
		const me = await owner();
		const p = await createPlan(me.id, { name: 'Two tabs', input: input() });
		const first = await updatePlan(p.id, me.id, { revision: 1, input: input(14) });
		expect(first?.revision).toBe(2);
		const stale = await updatePlan(p.id, me.id, { revision: 1, input: input(20) }).catch((e) => e);
		expect(stale).toBeInstanceOf(StaleRevision);
		expect((stale as StaleRevision).current.revision).toBe(2);
		const now = await findOwnPlan(p.id, me.id);
		expect(now!.result.area.squareFeet).toBeCloseTo(140, 6); // 14 × 10 ft, not 20 × 10
	});

	it('belong to their owner only', async () => {
		const me = await owner();
		const other = await owner();
		const p = await createPlan(me.id, { name: 'Mine', input: input() });
		expect(await findOwnPlan(p.id, other.id)).toBeUndefined();
		expect(await updatePlan(p.id, other.id, { revision: 1, name: 'Taken' })).toBeUndefined();
		expect(await deletePlan(p.id, other.id)).toBe(false);
		expect(await duplicatePlan(p.id, other.id)).toBeUndefined();
		expect((await listPlans(other.id)).map((x) => x.id)).not.toContain(p.id);
		expect((await findOwnPlan(p.id, me.id))?.name).toBe('Mine');
	});

	it('duplicate and delete', async () => {
		const me = await owner();
		const p = await createPlan(me.id, { name: 'Shed pad', input: input() });
		const copy = await duplicatePlan(p.id, me.id);
		expect(copy?.name).toBe('Shed pad (copy)');
		expect(copy?.input).toEqual(p.input);
		expect(await deletePlan(p.id, me.id)).toBe(true);
		expect((await listPlans(me.id)).map((x) => x.name)).toEqual(['Shed pad (copy)']);
	});
});
