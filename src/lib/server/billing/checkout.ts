import { and, eq, isNull } from 'drizzle-orm';
import type Stripe from 'stripe';
import { currency, leadPack, monthlyPlan } from '$lib/billing-plans';
import { db } from '$lib/server/db';
import { billingAccount } from '$lib/server/db/schema';
import { billingAccountOf } from './accounts';
import { payments } from './client';

/** A step the account's state does not allow; the message says why. */
export class BillingRefused extends Error {}

type Who = { id: string; email: string; name: string };
const billingPage = (origin: string) => `${origin}/pro/billing`;

/** The provider's customer for this contractor, created on first use (a second tab's customer loses the race and is not used). */
async function customerFor(who: Who) {
	const a = await billingAccountOf(who.id);
	if (a.customerId) return a.customerId;
	const c = await payments().customers.create({ email: who.email, name: who.name, metadata: { contractorId: who.id } });
	await db.insert(billingAccount).values({ contractorId: who.id }).onConflictDoNothing();
	await db
		.update(billingAccount)
		.set({ customerId: c.id, updatedAt: new Date() })
		.where(and(eq(billingAccount.contractorId, who.id), isNull(billingAccount.customerId)));
	return (await billingAccountOf(who.id)).customerId!;
}

/** A hosted checkout for the monthly plan; returns the provider's page to send the contractor to. */
export async function startPlanCheckout(who: Who, origin: string) {
	const a = await billingAccountOf(who.id);
	if (a.status === 'active' || a.status === 'past_due') throw new BillingRefused('You have a plan already.');
	const customer = await customerFor(who);
	const s = await payments().checkout.sessions.create({
		mode: 'subscription',
		customer,
		client_reference_id: who.id,
		metadata: { contractorId: who.id, kind: 'plan' },
		subscription_data: { metadata: { contractorId: who.id } },
		line_items: [
			{
				quantity: 1,
				price_data: { currency, unit_amount: monthlyPlan.monthlyCents, recurring: { interval: 'month' }, product_data: { name: monthlyPlan.name } }
			}
		],
		success_url: `${billingPage(origin)}?checkout=done&session={CHECKOUT_SESSION_ID}`,
		cancel_url: `${billingPage(origin)}?checkout=cancelled`
	});
	return checkoutUrl(s);
}

/** A hosted checkout for a pack of lead credits. */
export async function startPackCheckout(who: Who, origin: string) {
	const a = await billingAccountOf(who.id);
	if (a.status === 'past_due') throw new BillingRefused('Your plan’s payment is overdue: update your payment method first.');
	const customer = await customerFor(who);
	const s = await payments().checkout.sessions.create({
		mode: 'payment',
		customer,
		client_reference_id: who.id,
		metadata: { contractorId: who.id, kind: 'pack', leads: String(leadPack.leads) },
		invoice_creation: { enabled: true },
		line_items: [{ quantity: leadPack.leads, price_data: { currency, unit_amount: leadPack.perLeadCents, product_data: { name: leadPack.name } } }],
		success_url: `${billingPage(origin)}?checkout=pack&session={CHECKOUT_SESSION_ID}`,
		cancel_url: `${billingPage(origin)}?checkout=cancelled`
	});
	return checkoutUrl(s);
}

/** The provider's page to save a new card (a setup-mode checkout); an overdue invoice is retried with it. */
export async function startCardUpdate(who: Who, origin: string) {
	const a = await billingAccountOf(who.id);
	if (!a.customerId || !a.subscriptionId) throw new BillingRefused('There is no plan to update a payment method for.');
	const s = await payments().checkout.sessions.create({
		mode: 'setup',
		currency,
		customer: a.customerId,
		client_reference_id: who.id,
		metadata: { contractorId: who.id, kind: 'card' },
		success_url: `${billingPage(origin)}?checkout=card`,
		cancel_url: `${billingPage(origin)}?checkout=cancelled`
	});
	return checkoutUrl(s);
}

function checkoutUrl(s: Stripe.Checkout.Session) {
	if (!s.url) throw new Error('The payment provider returned a checkout session without a page.');
	return s.url;
}

/** Ends the plan at the end of the period already paid for (or takes that back). */
export async function setCancelAtPeriodEnd(contractorId: string, cancel: boolean) {
	const a = await billingAccountOf(contractorId);
	if (!a.subscriptionId || (a.status !== 'active' && a.status !== 'past_due')) throw new BillingRefused('There is no running plan to change.');
	const sub = await payments().subscriptions.update(a.subscriptionId, { cancel_at_period_end: cancel });
	await db
		.update(billingAccount)
		.set({ cancelAtPeriodEnd: sub.cancel_at_period_end, updatedAt: new Date() })
		.where(eq(billingAccount.contractorId, contractorId));
	return sub.cancel_at_period_end;
}

export type InvoiceRow = {
	id: string;
	number: string | null;
	status: string | null;
	amountCents: number;
	currency: string;
	created: Date;
	description: string | null;
	/** Each line when there is more than one (the plan and extra leads). */
	lines: { description: string | null; amountCents: number }[];
	url: string | null;
};

/** The contractor's invoices, newest first, as the provider has them (at most 24). */
export async function invoicesOf(contractorId: string): Promise<InvoiceRow[]> {
	const a = await billingAccountOf(contractorId);
	if (!a.customerId) return [];
	const list = await payments().invoices.list({ customer: a.customerId, limit: 24 });
	return list.data.map((i) => ({
		id: i.id ?? '',
		number: i.number,
		status: i.status,
		amountCents: i.total,
		currency: i.currency,
		created: new Date(i.created * 1000),
		description: i.lines?.data?.[0]?.description ?? null,
		lines: (i.lines?.data ?? []).length > 1 ? i.lines.data.map((l) => ({ description: l.description, amountCents: l.amount })) : [],
		url: i.hosted_invoice_url ?? null
	}));
}
