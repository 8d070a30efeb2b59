/**
 * A contractor's billing account as one table: every state, every event from the payment
 * provider, and where each event leads. Webhook handling looks every change up here.
 */
export const billingStatuses = ['none', 'active', 'past_due', 'cancelled'] as const;
export type BillingStatus = (typeof billingStatuses)[number];

export const billingEvents = [
	'subscribed', // checkout for the monthly plan completed
	'pack_paid', // checkout for a lead pack completed (adds credits; the plan is unchanged)
	'invoice_paid', // a plan invoice was paid (a new period starts)
	'payment_failed', // a plan invoice could not be paid
	'subscription_ended' // the provider ended the subscription (cancelled at period end, or unpaid)
] as const;
export type BillingEvent = (typeof billingEvents)[number];

/** Every (state, event) pair has a cell; `same` keeps the state (the event may still record something, e.g. credits). */
export const billingTable: Record<BillingStatus, Record<BillingEvent, BillingStatus | 'same'>> = {
	none: { subscribed: 'active', pack_paid: 'same', invoice_paid: 'same', payment_failed: 'same', subscription_ended: 'same' },
	active: { subscribed: 'same', pack_paid: 'same', invoice_paid: 'same', payment_failed: 'past_due', subscription_ended: 'cancelled' },
	past_due: { subscribed: 'same', pack_paid: 'same', invoice_paid: 'active', payment_failed: 'same', subscription_ended: 'cancelled' },
	cancelled: { subscribed: 'active', pack_paid: 'same', invoice_paid: 'same', payment_failed: 'same', subscription_ended: 'same' }
};

export function billingTarget(status: BillingStatus, event: BillingEvent): BillingStatus {
	const cell = billingTable[status][event];
	return cell === 'same' ? status : cell;
}

export const billingStatusLabels: Record<BillingStatus, string> = {
	none: 'No plan',
	active: 'Active',
	past_due: 'Payment overdue',
	cancelled: 'Cancelled'
};

/** Whether new leads are delivered: everyone but an account whose payment failed. */
export const deliveryPaused = (s: BillingStatus) => s === 'past_due';

/**
 * Whether the account may open one more lead's details: a past-due account may not; otherwise an
 * active plan with included leads left, or a credit.
 */
export function canOpenLead(a: { status: BillingStatus; leadsUsed: number; credits: number }, leadsIncluded: number) {
	const use = leadAllowance(a, leadsIncluded);
	return use === 'included' || use === 'credit';
}

/**
 * What opening one more lead's details would use, in this order: one of the period's included
 * leads, else a prepaid credit, else (a running plan only, with a subscription at the provider to bill it) an
 * extra lead at the per-lead price on the next invoice, which the contractor must agree to first;
 * 'none' when nothing allows it (no plan and no credit, or a payment overdue).
 */
export type LeadAllowance = 'included' | 'credit' | 'extra' | 'none';
export function leadAllowance(a: { status: BillingStatus; leadsUsed: number; credits: number; billable?: boolean }, leadsIncluded: number): LeadAllowance {
	if (a.status === 'past_due') return 'none';
	if (a.status === 'active' && a.leadsUsed < leadsIncluded) return 'included';
	if (a.credits > 0) return 'credit';
	if (a.status === 'active' && a.billable === true) return 'extra';
	return 'none';
}
