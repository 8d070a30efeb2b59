import { describe, expect, it } from 'vitest';
import { billingEvents, billingStatuses, billingTarget, canOpenLead, deliveryPaused, type BillingEvent, type BillingStatus } from './billing-status';

// The expected result of every (state, event) pair, written out by hand: the table must match it.
const expected: Record<BillingStatus, Record<BillingEvent, BillingStatus>> = {
	none: { subscribed: 'active', pack_paid: 'none', invoice_paid: 'none', payment_failed: 'none', subscription_ended: 'none' },
	active: { subscribed: 'active', pack_paid: 'active', invoice_paid: 'active', payment_failed: 'past_due', subscription_ended: 'cancelled' },
	past_due: { subscribed: 'past_due', pack_paid: 'past_due', invoice_paid: 'active', payment_failed: 'past_due', subscription_ended: 'cancelled' },
	cancelled: { subscribed: 'active', pack_paid: 'cancelled', invoice_paid: 'cancelled', payment_failed: 'cancelled', subscription_ended: 'cancelled' }
};

describe('billing state table', () => {
	for (const s of billingStatuses)
		for (const e of billingEvents)
			it(`${s} + ${e} → ${expected[s][e]}`, () => {
				expect(billingTarget(s, e)).toBe(expected[s][e]);
			});

	it('pauses delivery only while a payment is overdue', () => {
		expect(billingStatuses.filter(deliveryPaused)).toEqual(['past_due']);
	});

	it('opens a lead with included leads left or a credit, never while overdue', () => {
		expect(canOpenLead({ status: 'active', leadsUsed: 7, credits: 0 }, 8)).toBe(true);
		expect(canOpenLead({ status: 'active', leadsUsed: 8, credits: 0 }, 8)).toBe(false);
		expect(canOpenLead({ status: 'active', leadsUsed: 8, credits: 1 }, 8)).toBe(true);
		expect(canOpenLead({ status: 'none', leadsUsed: 0, credits: 0 }, 8)).toBe(false);
		expect(canOpenLead({ status: 'cancelled', leadsUsed: 0, credits: 2 }, 8)).toBe(true);
		expect(canOpenLead({ status: 'past_due', leadsUsed: 0, credits: 5 }, 8)).toBe(false);
	});
});
