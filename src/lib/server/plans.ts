import { and, asc, desc, eq, lt, notInArray, sql } from 'drizzle-orm';
import { ENGINE_VERSION, estimate, type PlanIssue, type PlanResult } from '$lib/plan';
import { db, type Db } from '$lib/server/db';
import { lead, plan, planPhoto, type Plan } from '$lib/server/db/schema';
import { cancelCuringReminders, scheduleCuringReminders } from './reminders';
import { storage } from './storage';
import type { PlanRecord } from '$lib/planner/types';

export class PlanInputInvalid extends Error {
	constructor(readonly issues: PlanIssue[]) {
		super('The plan input is not valid.');
	}
}

export class StaleRevision extends Error {
	constructor(readonly current: Plan) {
		super('This plan was changed elsewhere since you opened it.');
	}
}

/** The server always recomputes: numbers sent by a browser are never stored. */
function compute(input: unknown, prefix = 'input'): PlanResult {
	const outcome = estimate(input);
	if (!outcome.ok) throw new PlanInputInvalid(outcome.errors.map((e) => ({ ...e, path: e.path ? `${prefix}.${e.path}` : prefix })));
	return outcome.plan;
}

export type PlanSummary = Pick<Plan, 'id' | 'name' | 'postcode' | 'revision' | 'createdAt' | 'updatedAt'> & {
	units: PlanResult['units'];
	area: PlanResult['area']['squareFeet'];
	areaM2: number;
	volume: PlanResult['volume']['order'];
};

export function summarize(p: Plan): PlanSummary {
	const r = p.result;
	return {
		id: p.id,
		name: p.name,
		postcode: p.postcode,
		revision: p.revision,
		createdAt: p.createdAt,
		updatedAt: p.updatedAt,
		units: r.units,
		area: r.area.squareFeet,
		areaM2: r.area.squareMeters,
		volume: r.volume.order
	};
}

export async function listPlans(ownerId: string): Promise<Plan[]> {
	return db.select().from(plan).where(eq(plan.ownerId, ownerId)).orderBy(desc(plan.updatedAt));
}

/** The plan, only when it belongs to ownerId: someone else's plan is simply not found. */
// Every plan page reads the plan by id and owner: prepared once (drizzle builds the SQL text once).
const ownPlan = db
	.select()
	.from(plan)
	.where(and(eq(plan.id, sql.placeholder('id')), eq(plan.ownerId, sql.placeholder('owner'))))
	.prepare('own_plan');
const ownPlanHeader = db
	.select({ id: plan.id, name: plan.name, postcode: plan.postcode, revision: plan.revision, createdAt: plan.createdAt, updatedAt: plan.updatedAt })
	.from(plan)
	.where(and(eq(plan.id, sql.placeholder('id')), eq(plan.ownerId, sql.placeholder('owner'))))
	.prepare('own_plan_header');

export async function findOwnPlan(id: string, ownerId: string): Promise<Plan | undefined> {
	const [found] = await ownPlan.execute({ id, owner: ownerId });
	return found;
}

/** The plan's name and revision without its input and result, only when it belongs to ownerId. */
export async function findOwnPlanHeader(id: string, ownerId: string) {
	const [found] = await ownPlanHeader.execute({ id, owner: ownerId });
	return found ? { ...found, postcode: found.postcode ?? '' } : undefined;
}

/** `conn` lets a caller create the plan inside its own transaction (the idempotent API create). */
export async function createPlan(ownerId: string, data: { name: string; postcode?: string; input: unknown }, conn: Pick<Db, 'insert'> = db): Promise<Plan> {
	const result = compute(data.input);
	const [created] = await conn
		.insert(plan)
		.values({ ownerId, name: data.name, postcode: data.postcode || null, input: data.input, result, engineVersion: ENGINE_VERSION })
		.returning();
	return created;
}

/**
 * Saves an edit made on top of `revision`. The compare-and-set in the WHERE clause means two
 * tabs cannot overwrite each other: the second gets StaleRevision with the current plan.
 */
export async function updatePlan(
	id: string,
	ownerId: string,
	data: { revision: number; name?: string; postcode?: string; input?: unknown }
): Promise<Plan | undefined> {
	const current = await findOwnPlan(id, ownerId);
	if (!current) return undefined;
	const changes: Partial<Plan> = {};
	if (data.name !== undefined) changes.name = data.name;
	if (data.postcode !== undefined) changes.postcode = data.postcode || null;
	if (data.input !== undefined) {
		changes.input = data.input;
		changes.result = compute(data.input);
		changes.engineVersion = ENGINE_VERSION;
	}
	// A new pour date (or anything that moves the curing days) moves the reminder jobs with the save.
	const saved = await db.transaction(async (tx) => {
		const [row] = await tx
			.update(plan)
			.set({ ...changes, revision: sql`${plan.revision} + 1`, updatedAt: new Date() })
			.where(and(eq(plan.id, id), eq(plan.ownerId, ownerId), eq(plan.revision, data.revision)))
			.returning();
		if (row && data.input !== undefined && row.curingReminders) await scheduleCuringReminders(tx, row);
		return row;
	});
	if (!saved) throw new StaleRevision((await findOwnPlan(id, ownerId)) ?? current);
	return saved;
}

export class PlanHasLeads extends Error {
	constructor() {
		super('Contractors have this plan, with their bids and messages; it stays so their records do too.');
	}
}

/** Deletes a plan and its photos' bytes; a plan already sent to contractors is kept for them. */
export async function deletePlan(id: string, ownerId: string): Promise<boolean> {
	const own = await findOwnPlan(id, ownerId);
	if (!own) return false;
	const [sent] = await db.select({ id: lead.id }).from(lead).where(eq(lead.planId, id)).limit(1);
	if (sent) throw new PlanHasLeads();
	const photos = await db.select().from(planPhoto).where(eq(planPhoto.planId, id));
	await db.transaction(async (tx) => {
		await cancelCuringReminders(tx, id);
		await tx.delete(plan).where(and(eq(plan.id, id), eq(plan.ownerId, ownerId)));
	});
	await Promise.all(photos.flatMap((p) => [storage().delete(p.storageKey), storage().delete(p.thumbKey)]));
	return true;
}

export async function duplicatePlan(id: string, ownerId: string): Promise<Plan | undefined> {
	const source = await findOwnPlan(id, ownerId);
	if (!source) return undefined;
	const [copy] = await db
		.insert(plan)
		.values({
			ownerId,
			name: `${source.name} (copy)`.slice(0, 100),
			postcode: source.postcode,
			input: source.input,
			result: source.result,
			engineVersion: source.engineVersion
		})
		.returning();
	return copy;
}

/** What the API and pages send to the browser. */
export function planView(p: Plan): PlanRecord {
	return {
		id: p.id,
		name: p.name,
		postcode: p.postcode ?? '',
		revision: p.revision,
		input: p.input,
		result: p.result,
		createdAt: p.createdAt,
		updatedAt: p.updatedAt
	};
}

/**
 * Recomputes stored results that an older engine wrote (engine_version below ENGINE_VERSION), from
 * their saved input, a batch of `batch` plans at a time until none is left. Run it after raising
 * ENGINE_VERSION, e.g. `node -e` on the built server or from a one-off script; safe to run again
 * or on several servers at once. The revision and updated-at stay: the homeowner changed nothing,
 * and a tab open on the plan keeps saving on top of it. A result row is only written if the plan
 * is still at the version it was read at, so an edit saved meanwhile is never overwritten.
 *
 * An input the current engine refuses (a limit tightened since) keeps its old result and version;
 * those plans are counted in `refused` and the homeowner sees the error on their next save.
 */
export async function recomputeOutdatedPlans(batch = 100): Promise<{ updated: number; refused: string[] }> {
	let updated = 0;
	const refused: string[] = [];
	for (;;) {
		const rows = await db
			.select({ id: plan.id, input: plan.input, revision: plan.revision, engineVersion: plan.engineVersion })
			.from(plan)
			.where(and(lt(plan.engineVersion, ENGINE_VERSION), refused.length ? notInArray(plan.id, refused) : undefined))
			.orderBy(asc(plan.id))
			.limit(batch);
		if (!rows.length) return { updated, refused };
		for (const r of rows) {
			const outcome = estimate(r.input);
			if (!outcome.ok) {
				refused.push(r.id);
				continue;
			}
			const done = await db
				.update(plan)
				.set({ result: outcome.plan, engineVersion: ENGINE_VERSION })
				.where(and(eq(plan.id, r.id), eq(plan.revision, r.revision), eq(plan.engineVersion, r.engineVersion)))
				.returning({ id: plan.id });
			updated += done.length;
		}
	}
}
