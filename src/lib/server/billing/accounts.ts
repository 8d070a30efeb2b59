import { and, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { extraLead } from '$lib/billing-plans';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { canOpenLead, leadAllowance, type BillingStatus } from '$lib/billing-status';
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

/** Whether the provider can bill an extra lead to this account (a subscription of its own there). */
export const billable = (a: Pick<BillingAccount, 'customerId' | 'subscriptionId'>) => !!a.customerId && !!a.subscriptionId;

/** What the account allows right now, in words a contractor reads on the pro desk and the billing page. */
export function entitlement(a: Pick<BillingAccount, 'status' | 'leadsUsed' | 'credits' | 'customerId' | 'subscriptionId'>) {
	const includedLeft = a.status === 'active' ? Math.max(0, monthlyPlan.leadsIncluded - a.leadsUsed) : 0;
	const next = leadAllowance({ ...a, billable: billable(a) }, monthlyPlan.leadsIncluded);
	return {
		status: a.status as BillingStatus,
		includedLeft,
		credits: a.credits,
		canOpen: canOpenLead(a, monthlyPlan.leadsIncluded),
		/** The next lead opens as an extra lead on the next invoice, once the contractor agrees. */
		extra: next === 'extra',
		paused: a.status === 'past_due'
	};
}

export type LeadAccess = 'open' | 'locked' | 'extra';

/** The job that makes (or takes back) an extra lead's invoice item at the provider; one queue per contractor keeps them in order. */
export const SYNC_EXTRA_LEAD = 'sync_extra_lead';
const queueExtraLeadSync = (tx: Tx, leadId: string, contractorId: string) =>
	tx.execute(sql`SELECT graphile_worker.add_job(${SYNC_EXTRA_LEAD}, json_build_object('leadId', ${leadId}::text),
		queue_name := ${`billing:${contractorId}`}, max_attempts := 25, job_key := ${`extra-lead:${leadId}`})`);

/**
 * Opens a lead's details to its contractor. A lead opened before stays open. Otherwise an open lead
 * uses one of the period's included leads, else a credit, in one transaction with the account row
 * locked (two tabs cannot both take the last one); a closed lead costs nothing to look at while the
 * account could pay for it. Beyond those, a running plan may open it as an extra lead billed on the
 * next invoice: only with `agreeExtra` (the contractor pressed the button that names the price),
 * otherwise the answer is 'extra' and nothing is charged. The invoice item is made by a job queued
 * in the same transaction, so a provider outage delays the charge, never the lead. Returns 'locked'
 * when the account allows none of these, or null for a lead that is not this contractor's.
 */
export async function openLeadFor(contractorId: string, leadId: string, o: { agreeExtra?: boolean } = {}): Promise<LeadAccess | null> {
	return db.transaction(async (tx) => {
		const [l] = await tx
			.select({ status: lead.status })
			.from(lead)
			.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
		if (!l) return null;
		const [charged] = await tx.select({ leadId: leadCharge.leadId }).from(leadCharge).where(eq(leadCharge.leadId, leadId));
		if (charged) return 'open';
		const a = await lockAccount(tx, contractorId);
		const use = leadAllowance({ ...a, billable: billable(a) }, monthlyPlan.leadsIncluded);
		if (use === 'none') return 'locked';
		if (!isOpenLead(l.status)) return 'open';
		if (use === 'extra' && !o.agreeExtra) return 'extra';
		const inserted = await tx
			.insert(leadCharge)
			.values({ leadId, contractorId, kind: use, periodStart: use === 'credit' ? null : a.periodStart, extraState: use === 'extra' ? 'pending' : null })
			.onConflictDoNothing()
			.returning({ leadId: leadCharge.leadId });
		if (!inserted.length) return 'open';
		if (use === 'included')
			await tx
				.update(billingAccount)
				.set({ leadsUsed: a.leadsUsed + 1, updatedAt: new Date() })
				.where(eq(billingAccount.contractorId, contractorId));
		else if (use === 'credit')
			await tx
				.update(billingAccount)
				.set({ credits: a.credits - 1, updatedAt: new Date() })
				.where(eq(billingAccount.contractorId, contractorId));
		else await queueExtraLeadSync(tx, leadId, contractorId);
		return 'open';
	});
}

/** Extra leads opened in the account's current period and not given back, with what they add to the next invoice. */
export async function extraLeadsThisPeriod(a: Pick<BillingAccount, 'contractorId' | 'periodStart' | 'status'>, exec: Exec = db) {
	if (a.status === 'none' || !a.periodStart) return { count: 0, cents: 0 };
	const [r] = await exec
		.select({ n: sql<number>`count(*)::int` })
		.from(leadCharge)
		.where(
			and(eq(leadCharge.contractorId, a.contractorId), eq(leadCharge.kind, 'extra'), eq(leadCharge.periodStart, a.periodStart), isNull(leadCharge.refundedAt))
		);
	const count = r?.n ?? 0;
	return { count, cents: count * extraLead.cents };
}

/** Which of these leads the contractor has opened (their details stay open to them). */
export async function openedLeadIds(contractorId: string, leadIds: string[]) {
	if (!leadIds.length) return new Set<string>();
	const rows = await db
		.select({ id: leadCharge.leadId })
		.from(leadCharge)
		.where(and(eq(leadCharge.contractorId, contractorId), inArray(leadCharge.leadId, leadIds)));
	return new Set(rows.map((r) => r.id));
}

/**
 * Gives back what these leads used (the lead expired unanswered, or the homeowner closed the
 * request before any bid), once each, in the caller's transaction: an included lead of the current
 * period is no longer counted; one from an earlier period, or a credit, comes back as a credit; an
 * extra lead's invoice item is taken off the next invoice by the sync job (or, when it was invoiced
 * already, the job gives a credit).
 */
export async function refundLeadCharges(tx: Tx, leadIds: string[], reason: 'expired' | 'closed') {
	if (!leadIds.length) return 0;
	const charges = await tx
		.update(leadCharge)
		.set({ refundedAt: new Date(), refundReason: reason })
		.where(and(inArray(leadCharge.leadId, leadIds), isNull(leadCharge.refundedAt)))
		.returning();
	for (const c of charges) {
		if (c.kind === 'extra') {
			await queueExtraLeadSync(tx, c.leadId, c.contractorId);
			continue;
		}
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
		.select({
			id: lead.id,
			town: lead.town,
			scope: lead.scope,
			timeframe: lead.timeframe,
			respondBy: lead.respondBy,
			input: sql<unknown>`${lead.snapshot}->'input'`,
			result: sql<unknown>`${lead.snapshot}->'result'`
		})
		.from(lead)
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	if (!l) return null;
	const f = planFigures(l.input, l.result);
	return {
		id: l.id,
		town: l.town,
		scope: l.scope,
		timeframe: l.timeframe,
		respondBy: l.respondBy,
		squareFeet: f.area?.squareFeet ?? null,
		squareMeters: f.area?.squareMeters ?? null,
		units: f.units
	};
}
