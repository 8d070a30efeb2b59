import { desc, eq } from 'drizzle-orm';
import { monthlyPlan } from '$lib/billing-plans';
import { db } from '$lib/server/db';
import { billingEvent, leadCharge } from '$lib/server/db/schema';
import { accountView, billingAccountOf, chargeSummary, extraLeadsThisPeriod } from './accounts';

/** A contractor's billing state as an admin sees it: account, lead charges and the latest provider events. */
export async function adminBillingView(contractorId: string) {
	const a = await billingAccountOf(contractorId);
	const charges = await chargeSummary(contractorId);
	const recentCharges = await db
		.select({
			leadId: leadCharge.leadId,
			kind: leadCharge.kind,
			chargedAt: leadCharge.chargedAt,
			refundedAt: leadCharge.refundedAt,
			refundReason: leadCharge.refundReason,
			extraState: leadCharge.extraState
		})
		.from(leadCharge)
		.where(eq(leadCharge.contractorId, contractorId))
		.orderBy(desc(leadCharge.chargedAt))
		.limit(10);
	const events = await db
		.select({ id: billingEvent.id, type: billingEvent.type, receivedAt: billingEvent.receivedAt })
		.from(billingEvent)
		.where(eq(billingEvent.contractorId, contractorId))
		.orderBy(desc(billingEvent.receivedAt))
		.limit(10);
	return {
		...accountView(a),
		customerId: a.customerId,
		subscriptionId: a.subscriptionId,
		leadsIncluded: monthlyPlan.leadsIncluded,
		charges,
		extraLeads: await extraLeadsThisPeriod(a),
		recentCharges: recentCharges.map((c) => ({ ...c, chargedAt: c.chargedAt.toISOString(), refundedAt: c.refundedAt?.toISOString() ?? null })),
		events: events.map((e) => ({ ...e, receivedAt: e.receivedAt.toISOString() }))
	};
}
