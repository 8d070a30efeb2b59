import { and, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { canOpenLead, type BillingStatus } from '$lib/billing-status';
import { monthlyPlan } from '$lib/billing-plans';
import { isOpenLead } from '$lib/lead-status';
import { planFigures } from '$lib/plan-figures';
import { db } from '$lib/server/db';
import { billingAccount, lead, leadCharge } from '$lib/server/db/schema';

export type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];
type Exec = Tx | typeof db;

export type BillingAccount = typeof billingAccount.$inferSelect;

const blank = (contractorId: string): BillingAccount => ({
	contractorId,
	customerId: null,
	subscriptionId: null,
	status: 'none',
	cancelAtPeriodEnd: false,
	periodStart: null,
	periodEnd: null,
	leadsUsed: 0,
	credits: 0,
	updatedAt: new Date(0)
});

/** The contractor's billing account, or an empty one (status none) when they never had one. */
export async function billingAccountOf(contractorId: string, exec: Exec = db): Promise<BillingAccount> {
	const [a] = await exec.select().from(billingAccount).where(eq(billingAccount.contractorId, contractorId));
	return a ?? blank(contractorId);
}

/** The account as pages show it (dates as ISO strings). */
export const accountView = (a: BillingAccount) => ({
	status: a.status,
	cancelAtPeriodEnd: a.cancelAtPeriodEnd,
	periodStart: a.periodStart?.toISOString() ?? null,
	periodEnd: a.periodEnd?.toISOString() ?? null,
	leadsUsed: a.leadsUsed,
	credits: a.credits
});

/** The account row, created when missing and locked for the rest of the transaction. */
export async function lockAccount(tx: Tx, contractorId: string): Promise<BillingAccount> {
	await tx.insert(billingAccount).values({ contractorId }).onConflictDoNothing();
	const [a] = await tx.select().from(billingAccount).where(eq(billingAccount.contractorId, contractorId)).for('update');
	return a;
}

/** SQL for the matching query: the contractor's payment is not overdue (overdue accounts get no new leads). */
export const billingAllowsDelivery = (contractorId: AnyPgColumn | SQL) =>
	sql`not exists (select 1 from ${billingAccount} where ${billingAccount.contractorId} = ${contractorId} and ${billingAccount.status} = 'past_due')`;

/** What the account allows right now, in words a contractor reads on the pro desk and the billing page. */
export function entitlement(a: Pick<BillingAccount, 'status' | 'leadsUsed' | 'credits'>) {
	const includedLeft = a.status === 'active' ? Math.max(0, monthlyPlan.leadsIncluded - a.leadsUsed) : 0;
	return { status: a.status as BillingStatus, includedLeft, credits: a.credits, canOpen: canOpenLead(a, monthlyPlan.leadsIncluded), paused: a.status === 'past_due' };
}

export type LeadAccess = 'open' | 'locked';

/**
 * Opens a lead's details to its contractor. A lead opened before stays open. Otherwise an open lead
 * uses one of the period's included leads, else a credit, in one transaction with the account row
 * locked (two tabs cannot both take the last one); a closed lead costs nothing to look at while the
 * account could pay for it. Returns 'locked' when the account allows neither, or null for a lead
 * that is not this contractor's.
 */
export async function openLeadFor(contractorId: string, leadId: string): Promise<LeadAccess | null> {
	return db.transaction(async (tx) => {
		const [l] = await tx.select({ status: lead.status }).from(lead).where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
		if (!l) return null;
		const [charged] = await tx.select({ leadId: leadCharge.leadId }).from(leadCharge).where(eq(leadCharge.leadId, leadId));
		if (charged) return 'open';
		const a = await lockAccount(tx, contractorId);
		if (!canOpenLead(a, monthlyPlan.leadsIncluded)) return 'locked';
		if (!isOpenLead(l.status)) return 'open';
		const included = a.status === 'active' && a.leadsUsed < monthlyPlan.leadsIncluded;
		const inserted = await tx
			.insert(leadCharge)
			.values({ leadId, contractorId, kind: included ? 'included' : 'credit', periodStart: included ? a.periodStart : null })
			.onConflictDoNothing()
			.returning({ leadId: leadCharge.leadId });
		if (inserted.length)
			await tx
				.update(billingAccount)
				.set(included ? { leadsUsed: a.leadsUsed + 1, updatedAt: new Date() } : { credits: a.credits - 1, updatedAt: new Date() })
				.where(eq(billingAccount.contractorId, contractorId));
		return 'open';
	});
}

/** Which of these leads the contractor has opened (their details stay open to them). */
export async function openedLeadIds(contractorId: string, leadIds: string[]) {
	if (!leadIds.length) return new Set<string>();
	const rows = await db.select({ id: leadCharge.leadId }).from(leadCharge).where(and(eq(leadCharge.contractorId, contractorId), inArray(leadCharge.leadId, leadIds)));
	return new Set(rows.map((r) => r.id));
}

/**
 * Gives back what these leads used (the lead expired unanswered, or the homeowner closed the
 * request before any bid), once each, in the caller's transaction: an included lead of the current
 * period is no longer counted; one from an earlier period, or a credit, comes back as a credit.
 */
export async function refundLeadCharges(tx: Tx, leadIds: string[], reason: 'expired' | 'closed') {
	if (!leadIds.length) return 0;
	const charges = await tx
		.update(leadCharge)
		.set({ refundedAt: new Date(), refundReason: reason })
		.where(and(inArray(leadCharge.leadId, leadIds), isNull(leadCharge.refundedAt)))
		.returning();
	for (const c of charges) {
		const a = await lockAccount(tx, c.contractorId);
		const samePeriod = c.kind === 'included' && a.status !== 'none' && c.periodStart?.getTime() === a.periodStart?.getTime() && a.leadsUsed > 0;
		await tx
			.update(billingAccount)
			.set(samePeriod ? { leadsUsed: a.leadsUsed - 1, updatedAt: new Date() } : { credits: a.credits + 1, updatedAt: new Date() })
			.where(eq(billingAccount.contractorId, c.contractorId));
	}
	return charges.length;
}

/** Lead charges of a contractor in the current period and overall, for the billing and admin pages. */
export async function chargeSummary(contractorId: string) {
	const [r] = await db
		.select({
			total: sql<number>`count(*)::int`,
			refunded: sql<number>`count(${leadCharge.refundedAt})::int`
		})
		.from(leadCharge)
		.where(eq(leadCharge.contractorId, contractorId));
	return r ?? { total: 0, refunded: 0 };
}

/** What a contractor without a plan may see of their lead: town, scope, timing and the slab's size. Null when not theirs. */
export async function leadTeaser(contractorId: string, leadId: string) {
	const [l] = await db
		.select({ id: lead.id, town: lead.town, scope: lead.scope, timeframe: lead.timeframe, respondBy: lead.respondBy, input: sql<unknown>`${lead.snapshot}->'input'`, result: sql<unknown>`${lead.snapshot}->'result'` })
		.from(lead)
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	if (!l) return null;
	const f = planFigures(l.input, l.result);
	return { id: l.id, town: l.town, scope: l.scope, timeframe: l.timeframe, respondBy: l.respondBy, squareFeet: f.area?.squareFeet ?? null, squareMeters: f.area?.squareMeters ?? null, units: f.units };
}
