import { eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import { billingTarget, type BillingEvent } from '$lib/billing-status';
import { leadPack } from '$lib/billing-plans';
import { db } from '$lib/server/db';
import { billingAccount, billingEvent, user } from '$lib/server/db/schema';
import { queueMail } from '../mail';
import type { Mail } from '../mail/templates';
import { lockAccount, type Tx } from './accounts';
import { payments, webhookSecret } from './client';
import {
	finalInvoiceMail,
	invoicePaidMail,
	invoiceWords,
	leadPackPaidMail,
	paymentFailedMail,
	paymentRecoveredMail,
	planActiveMail,
	planEndedMail
} from './mails';

/** Largest webhook body accepted; the provider's events are a few kilobytes. */
export const WEBHOOK_MAX_BYTES = 256 * 1024;

export class BadSignature extends Error {}

/** Checks the provider's signature (and its timestamp, within 5 minutes) with the SDK's own helper. */
export function verifyEvent(payload: string, signature: string | null): Stripe.Event {
	if (!signature) throw new BadSignature('The request has no signature header.');
	try {
		return payments().webhooks.constructEvent(payload, signature, webhookSecret());
	} catch (err) {
		throw new BadSignature(err instanceof Error ? err.message : 'The signature does not match.');
	}
}

export type WebhookOutcome = { result: 'applied' | 'replayed' | 'ignored'; contractorId: string | null; status?: string };

const idOf = (v: string | { id: string } | null | undefined) => (typeof v === 'string' ? v : (v?.id ?? null));

/** Which contractor an event concerns: by our own reference on a checkout, else by the provider's customer id. */
async function contractorOf(tx: Tx, event: Stripe.Event): Promise<string | null> {
	const o = event.data.object as { object?: string; customer?: string | { id: string } | null; client_reference_id?: string | null };
	const customer = idOf(o.customer);
	if (customer) {
		const [a] = await tx.select({ id: billingAccount.contractorId }).from(billingAccount).where(eq(billingAccount.customerId, customer));
		if (a) return a.id;
	}
	return null;
}

/** The plan invoice's subscription and billed period (the provider moved these around between versions; both places read). */
function invoicePeriod(inv: Stripe.Invoice) {
	const line = inv.lines?.data?.[0];
	const sub = inv.parent?.subscription_details?.subscription ?? null;
	const start = line?.period?.start ?? inv.period_start;
	const end = line?.period?.end ?? inv.period_end;
	return { subscriptionId: idOf(sub), start: new Date(start * 1000), end: new Date(end * 1000) };
}

/** What an invoice bills: the total, whether the plan is on it, and how many extra leads (lines made from an extra lead's item carry its lead id). */
function invoiceContents(inv: Stripe.Invoice) {
	const lines = inv.lines?.data ?? [];
	const extraLeads = lines.filter((l) => !!l.metadata?.leadId).length;
	return { totalCents: inv.total, plan: lines.length > extraLeads, extraLeads };
}

/**
 * Applies one verified event in one transaction: its id is stored first, so a replay finds it and
 * changes nothing; the account row is locked; the state moves only as the billing table says; the
 * contractor's notice is queued in the same transaction.
 */
export async function applyEvent(event: Stripe.Event, origin: string): Promise<WebhookOutcome> {
	const out = await db.transaction(async (tx): Promise<WebhookOutcome> => {
		const contractorId = await contractorOf(tx, event);
		const fresh = await tx
			.insert(billingEvent)
			.values({ id: event.id, type: event.type, contractorId })
			.onConflictDoNothing()
			.returning({ id: billingEvent.id });
		if (!fresh.length) return { result: 'replayed', contractorId };
		if (!contractorId) return { result: 'ignored', contractorId };
		const a = await lockAccount(tx, contractorId);
		const [who] = await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, contractorId));
		const now = new Date();
		let step: BillingEvent | null = null;
		const set: Partial<typeof billingAccount.$inferInsert> = {};
		let mail: Mail | null = null;

		if (event.type === 'checkout.session.completed') {
			const s = event.data.object;
			const kind = s.metadata?.kind;
			if (s.mode === 'subscription' && kind === 'plan') {
				step = 'subscribed';
				const newPlan = a.status === 'none' || a.status === 'cancelled';
				if (newPlan) {
					Object.assign(set, { subscriptionId: idOf(s.subscription), cancelAtPeriodEnd: false });
					// The period comes with the plan's first invoice (invoice.paid); until then it starts now.
					if (a.subscriptionId !== idOf(s.subscription)) Object.assign(set, { periodStart: now, periodEnd: null, leadsUsed: 0 });
					mail = planActiveMail(who.name, origin);
				}
			} else if (s.mode === 'payment' && kind === 'pack' && s.payment_status === 'paid') {
				step = 'pack_paid';
				const leads = Math.min(Math.max(Number(s.metadata?.leads ?? leadPack.leads) || 0, 0), 100);
				set.credits = a.credits + leads;
				mail = leadPackPaidMail(who.name, leads, origin);
			}
		} else if (event.type === 'invoice.paid' || event.type === 'invoice.payment_failed') {
			const inv = event.data.object;
			const p = invoicePeriod(inv);
			const what = invoiceWords(invoiceContents(inv));
			const paid = event.type === 'invoice.paid';
			// Only the plan's invoices move the plan; a lead pack's invoice has no subscription.
			if (p.subscriptionId && (!a.subscriptionId || a.subscriptionId === p.subscriptionId)) {
				if (a.status === 'cancelled') {
					// The final invoice of a plan that ended (extra leads it still owed): the plan stays ended; the contractor is told.
					mail = finalInvoiceMail(who.name, what, paid, origin);
				} else if (paid) {
					step = 'invoice_paid';
					Object.assign(set, { subscriptionId: p.subscriptionId, periodStart: p.start, periodEnd: p.end });
					// A new period starts the lead count again; the first invoice after checkout (no period yet) keeps it, and its receipt is the plan-active notice.
					const renewal = a.periodEnd !== null && a.periodEnd.getTime() !== p.end.getTime();
					if (renewal) set.leadsUsed = 0;
					if (a.status === 'past_due') mail = paymentRecoveredMail(who.name, what, origin);
					else if (a.periodEnd !== null) mail = invoicePaidMail(who.name, what, origin);
				} else {
					step = 'payment_failed';
					if (a.status === 'active') mail = paymentFailedMail(who.name, what, origin);
				}
			}
		} else if (event.type === 'customer.subscription.deleted') {
			const sub = event.data.object;
			if (a.subscriptionId === sub.id) {
				step = 'subscription_ended';
				set.cancelAtPeriodEnd = false;
				if (a.status !== 'cancelled') mail = planEndedMail(who.name, origin);
			}
		}
		if (!step) {
			if (mail && who) await queueMail(who.email, mail, tx);
			return { result: mail ? 'applied' : 'ignored', contractorId };
		}
		const status = billingTarget(a.status, step);
		await tx
			.update(billingAccount)
			.set({ ...set, status, updatedAt: now })
			.where(eq(billingAccount.contractorId, contractorId));
		if (mail && who) await queueMail(who.email, mail, tx);
		return { result: 'applied', contractorId, status };
	});
	return out;
}
