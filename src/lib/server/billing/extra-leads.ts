import { and, eq, sql } from 'drizzle-orm';
import { currency, extraLead } from '$lib/billing-plans';
import { db } from '$lib/server/db';
import { billingAccount, lead, leadCharge } from '$lib/server/db/schema';
import { log } from '../log';
import { lockAccount } from './accounts';
import { payments } from './client';

/**
 * Brings one extra lead's invoice item at the provider in line with the charge row (the job
 * `sync_extra_lead`, queued when the lead is opened and again when it is given back):
 * - charged and not given back, no item yet: makes the item on the customer's subscription, so
 *   it goes on the plan's next invoice; the idempotency key is the lead's, so a retry after a
 *   lost answer makes no second item;
 * - given back before the item was made: nothing is billed;
 * - given back while the item waits for the next invoice: deletes it;
 * - given back after it was invoiced: a lead credit, once.
 * Safe to run any number of times: each step is guarded by the row's state.
 */
export async function syncExtraLead(leadId: string) {
	const [c] = await db.select().from(leadCharge).where(eq(leadCharge.leadId, leadId));
	if (!c || c.kind !== 'extra') return 'none';
	const [a] = await db.select().from(billingAccount).where(eq(billingAccount.contractorId, c.contractorId));
	if (!c.refundedAt) {
		if (c.extraState !== 'pending') return c.extraState;
		if (!a?.customerId) throw new Error(`extra lead ${leadId}: the account has no customer at the provider`);
		const [l] = await db.select({ town: lead.town }).from(lead).where(eq(lead.id, leadId));
		const item = await payments().invoiceItems.create(
			{
				customer: a.customerId,
				subscription: a.subscriptionId ?? undefined,
				amount: extraLead.cents,
				currency,
				description: `${extraLead.name}${l?.town ? ` (${l.town})` : ''}`,
				metadata: { leadId, contractorId: c.contractorId }
			},
			{ idempotencyKey: `extra-lead-${leadId}` }
		);
		await db
			.update(leadCharge)
			.set({ invoiceItemId: item.id, extraState: 'billed' })
			.where(and(eq(leadCharge.leadId, leadId), eq(leadCharge.extraState, 'pending')));
		return 'billed';
	}
	if (c.extraState === 'pending') {
		await db
			.update(leadCharge)
			.set({ extraState: 'removed' })
			.where(and(eq(leadCharge.leadId, leadId), eq(leadCharge.extraState, 'pending')));
		return 'removed';
	}
	if (c.extraState !== 'billed' || !c.invoiceItemId) return c.extraState;
	const item = await payments().invoiceItems.retrieve(c.invoiceItemId);
	if (!item.invoice) {
		await payments().invoiceItems.del(c.invoiceItemId);
		await db
			.update(leadCharge)
			.set({ extraState: 'removed' })
			.where(and(eq(leadCharge.leadId, leadId), eq(leadCharge.extraState, 'billed')));
		return 'removed';
	}
	// Invoiced already: the money is the provider's; the lead comes back as a credit, once.
	return db.transaction(async (tx) => {
		const done = await tx
			.update(leadCharge)
			.set({ extraState: 'credited' })
			.where(and(eq(leadCharge.leadId, leadId), eq(leadCharge.extraState, 'billed')))
			.returning({ id: leadCharge.leadId });
		if (done.length) {
			await lockAccount(tx, c.contractorId);
			await tx
				.update(billingAccount)
				.set({ credits: sql`${billingAccount.credits} + 1`, updatedAt: new Date() })
				.where(eq(billingAccount.contractorId, c.contractorId));
			log.info({ leadId }, 'billing: an invoiced extra lead was given back as a credit');
		}
		return 'credited' as const;
	});
}
