import { describe, expect, it } from 'vitest';
import {
	billingEvents,
	billingStatuses,
	billingTarget,
	canOpenLead,
	deliveryPaused,
	leadAllowance,
	type BillingEvent,
	type BillingStatus,
	type LeadAllowance
} from './billing-status';

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

	// What one more lead would use, for every state × (included leads left or not) × (credit or not) × (billable or not), written out by hand.
	const uses: [BillingStatus, boolean, boolean, boolean, LeadAllowance][] = [
		// status, included left, credit, billable → use
		['none', false, false, false, 'none'],
		['none', false, false, true, 'none'],
		['none', false, true, false, 'credit'],
		['none', false, true, true, 'credit'],
		['active', true, false, false, 'included'],
		['active', true, true, true, 'included'],
		['active', false, true, true, 'credit'],
		['active', false, true, false, 'credit'],
		['active', false, false, true, 'extra'],
		['active', false, false, false, 'none'],
		['past_due', true, true, true, 'none'],
		['past_due', false, false, true, 'none'],
		['cancelled', false, false, true, 'none'],
		['cancelled', false, true, true, 'credit']
	];
	for (const [status, left, credit, billable, use] of uses)
		it(`${status}, ${left ? 'included leads left' : 'none included left'}, ${credit ? 'a credit' : 'no credit'}, ${billable ? 'billable' : 'not billable'} → ${use}`, () => {
			expect(leadAllowance({ status, leadsUsed: left ? 3 : 8, credits: credit ? 1 : 0, billable }, 8)).toBe(use);
		});

	it('never counts an extra lead as one the account may open without asking', () => {
		expect(canOpenLead({ status: 'active', leadsUsed: 8, credits: 0 }, 8)).toBe(false);
		expect(leadAllowance({ status: 'active', leadsUsed: 8, credits: 0 }, 8)).toBe('none');
	});
});
