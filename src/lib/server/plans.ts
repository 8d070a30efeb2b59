import { and, desc, eq, sql } from 'drizzle-orm';
import { estimate, type PlanIssue, type PlanResult } from '$lib/plan';
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
	const r = p.result as PlanResult;
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
export async function findOwnPlan(id: string, ownerId: string): Promise<Plan | undefined> {
	const [found] = await db.select().from(plan).where(and(eq(plan.id, id), eq(plan.ownerId, ownerId)));
	return found;
}

/** `conn` lets a caller create the plan inside its own transaction (the idempotent API create). */
export async function createPlan(ownerId: string, data: { name: string; postcode?: string; input: unknown }, conn: Pick<Db, 'insert'> = db): Promise<Plan> {
	const result = compute(data.input);
	const [created] = await conn
		.insert(plan)
		.values({ ownerId, name: data.name, postcode: data.postcode || null, input: data.input, result })
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
		.values({ ownerId, name: `${source.name} (copy)`.slice(0, 100), postcode: source.postcode, input: source.input, result: source.result })
		.returning();
	return copy;
}

/** What the API and pages send to the browser. */
export function planView(p: Plan): PlanRecord {
	return { id: p.id, name: p.name, postcode: p.postcode ?? '', revision: p.revision, input: p.input, result: p.result as PlanResult, createdAt: p.createdAt, updatedAt: p.updatedAt };
}
