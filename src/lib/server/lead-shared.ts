import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { LeadStatus } from '$lib/leads';
import { leadTarget } from '$lib/lead-status';
import { db } from '$lib/server/db';
import { bid, contractor, jobContact, lead, plan, user } from '$lib/server/db/schema';

// What leads.ts, bids.ts and messages.ts share. Nothing here imports the ZIP table (matching.ts),
// so the root layout's unread count (messages.ts) loads without it.
/** A step that does not fit the lead's or bid's state; the message says why. */
export class LeadRefused extends Error {}

export type Actor = { id: string; name: string };
export type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

export const leadUrl = (origin: string, leadId: string) => `${origin}/pro/leads/${leadId}`;
export const bidsUrl = (origin: string, planId: string) => `${origin}/plans/${planId}/bids`;

/** The job's site address and phone, as the homeowner gave them. */
export type JobContactInput = { siteAddress: string; phone: string };

export async function saveJobContact(tx: Tx, planId: string, c: JobContactInput) {
	const now = new Date();
	await tx
		.insert(jobContact)
		.values({ planId, ...c, updatedAt: now })
		.onConflictDoUpdate({ target: jobContact.planId, set: { ...c, updatedAt: now } });
}

/** The address and phone stored for the plan, for its owner's forms; null when none yet. */
export async function jobContactOf(planId: string) {
	const [c] = await db.select({ siteAddress: jobContact.siteAddress, phone: jobContact.phone }).from(jobContact).where(eq(jobContact.planId, planId));
	return c ?? null;
}

/** Refuses `action` on a lead the table does not allow it for, with the reason in words. */
export function step(status: LeadStatus, action: Parameters<typeof leadTarget>[1], refusal: string): LeadStatus {
	const to = leadTarget(status, action);
	if (!to) throw new LeadRefused(refusal);
	return to;
}

export const today = () => new Date().toISOString().slice(0, 10);
/** SQL: the contractor's licence and insurance dates have not passed (a missing date is not an expired one). */
export const credentialsCurrentSql = (day: string) =>
	sql`(coalesce(${contractor.licenceExpiresOn}, 'infinity'::date) >= ${day}::date and coalesce(${contractor.insuranceExpiresOn}, 'infinity'::date) >= ${day}::date)`;

/**
 * SQL: true when the account `userId` names was disabled by an admin. One definition for every
 * place that must treat such a contractor as gone: matching, the bids page, accepting a bid.
 */
export const accountDisabledSql = (userId: SQL | typeof contractor.userId) =>
	sql<boolean>`exists (select 1 from ${user} where ${user.id} = ${userId} and ${user.disabledAt} is not null)`;

/** Name and e-mail of each lead's contractor, with the lead's town, in one query. */
export const leadContractors = (tx: Tx, leadIds: string[]) =>
	leadIds.length
		? tx
				.select({ leadId: lead.id, town: lead.town, name: user.name, email: user.email })
				.from(lead)
				.innerJoin(user, eq(user.id, lead.contractorId))
				.where(inArray(lead.id, leadIds))
		: Promise.resolve([]);

/**
 * The owner's plan row, locked FOR UPDATE: the homeowner's decisions on one plan (send, accept,
 * release, close, done) run one after the other. Undefined when the plan is not theirs.
 */
export async function lockOwnPlan(tx: Tx, ownerId: string, planId: string) {
	const [p] = await tx
		.select()
		.from(plan)
		.where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId)))
		.for('update');
	return p;
}

/** The owner's plan, locked against a concurrent accept; refused once a bid is accepted. */
export async function lockOpenPlan(tx: Tx, ownerId: string, planId: string) {
	const p = await lockOwnPlan(tx, ownerId, planId);
	if (!p) return null;
	const [accepted] = await tx
		.select({ id: bid.id })
		.from(bid)
		.where(and(eq(bid.planId, planId), eq(bid.status, 'accepted')));
	if (accepted) throw new LeadRefused('You accepted a bid for this plan already.');
	const [done] = await tx
		.select({ id: lead.id })
		.from(lead)
		.where(and(eq(lead.planId, planId), eq(lead.status, 'done')));
	if (done) throw new LeadRefused('You marked the job for this plan done.');
	return p;
}

/**
 * Locks the contractor's lead for a change. The plan is taken FOR KEY SHARE, which waits for an
 * accept in progress (FOR UPDATE) but not for the homeowner's ordinary plan saves.
 */
export async function lockOwnLead(tx: Tx, contractorId: string, leadId: string) {
	const [l] = await tx
		.select()
		.from(lead)
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	if (!l) return null;
	await tx.select({ id: plan.id }).from(plan).where(eq(plan.id, l.planId)).for('key share');
	const [fresh] = await tx.select().from(lead).where(eq(lead.id, leadId)).for('update');
	const [b] = await tx.select().from(bid).where(eq(bid.leadId, leadId));
	return { lead: fresh, bid: b ?? null };
}

export const homeownerOf = async (tx: Tx, id: string) => (await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, id)))[0];
