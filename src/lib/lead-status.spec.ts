import { describe, expect, it } from 'vitest';
import { leadStatuses, type LeadStatus } from './leads';
import { leadActions, leadTarget, requestState, statusesMovedBy, threadOpen, type LeadAction } from './lead-status';

// Written out by hand: one row per lead state, one column per step; null = refused.
const _ = null;
// One row per state, as a table reads (kept out of the formatter).
// prettier-ignore
const expected: Record<LeadStatus, Record<LeadAction, LeadStatus | null>> = {
	//              view       bid         withdraw     decline     accept  accept_other    close       expire      complete  release     reopen
	new: { view: 'viewed', bid: 'bid_sent', withdraw: _, decline: 'declined', accept: _, accept_other: 'not_selected', close: 'closed', expire: 'expired', complete: _, release: _, reopen: 'new' },
	viewed: { view: 'viewed', bid: 'bid_sent', withdraw: _, decline: 'declined', accept: _, accept_other: 'not_selected', close: 'closed', expire: 'expired', complete: _, release: _, reopen: 'viewed' },
	bid_sent: { view: 'bid_sent', bid: 'bid_sent', withdraw: 'withdrawn', decline: 'declined', accept: 'won', accept_other: 'not_selected', close: 'closed', expire: 'bid_sent', complete: _, release: _, reopen: 'bid_sent' },
	declined: { view: 'declined', bid: _, withdraw: _, decline: _, accept: _, accept_other: 'declined', close: 'declined', expire: 'declined', complete: _, release: _, reopen: 'declined' },
	won: { view: 'won', bid: _, withdraw: _, decline: _, accept: _, accept_other: _, close: _, expire: _, complete: 'done', release: 'released', reopen: _ },
	not_selected: { view: 'not_selected', bid: _, withdraw: _, decline: _, accept: _, accept_other: _, close: 'not_selected', expire: 'not_selected', complete: _, release: _, reopen: 'bid_sent' },
	withdrawn: { view: 'withdrawn', bid: _, withdraw: _, decline: _, accept: _, accept_other: 'withdrawn', close: 'withdrawn', expire: 'withdrawn', complete: _, release: _, reopen: 'withdrawn' },
	released: { view: 'released', bid: _, withdraw: _, decline: _, accept: _, accept_other: _, close: 'released', expire: 'released', complete: _, release: _, reopen: 'released' },
	expired: { view: 'expired', bid: _, withdraw: _, decline: _, accept: _, accept_other: 'expired', close: 'expired', expire: 'expired', complete: _, release: _, reopen: 'expired' },
	closed: { view: 'closed', bid: _, withdraw: _, decline: _, accept: _, accept_other: _, close: 'closed', expire: 'closed', complete: _, release: _, reopen: 'closed' },
	done: { view: 'done', bid: _, withdraw: _, decline: _, accept: _, accept_other: _, close: _, expire: _, complete: _, release: _, reopen: _ }
};

describe('lead states, every (state, step) pair', () => {
	for (const s of leadStatuses) {
		for (const a of leadActions) {
			it(`${s} × ${a} → ${expected[s][a] ?? 'refused'}`, () => {
				expect(leadTarget(s, a)).toBe(expected[s][a]);
			});
		}
	}

	it('reaches won only by accepting a bid, and done only from won', () => {
		const into = (target: LeadStatus) =>
			leadStatuses.flatMap((s) => leadActions.filter((a) => leadTarget(s, a) === target && s !== target).map((a) => `${s}:${a}`));
		expect(into('won')).toEqual(['bid_sent:accept']);
		expect(into('done')).toEqual(['won:complete']);
		expect(into('expired')).toEqual(['new:expire', 'viewed:expire']);
	});

	it('closing a request moves the open leads only; the clock moves only leads nobody answered', () => {
		expect(statusesMovedBy('close', leadStatuses)).toEqual(['new', 'viewed', 'bid_sent']);
		expect(statusesMovedBy('expire', leadStatuses)).toEqual(['new', 'viewed']);
		expect(statusesMovedBy('accept_other', leadStatuses)).toEqual(['new', 'viewed', 'bid_sent']);
	});

	it('keeps threads open for open leads and the hired firm only', () => {
		expect(leadStatuses.filter(threadOpen)).toEqual(['new', 'viewed', 'bid_sent', 'won', 'done']);
	});
});

describe('request state, read from its leads', () => {
	const cases: [LeadStatus[], ReturnType<typeof requestState>][] = [
		[[], null],
		[['new', 'declined'], 'open'],
		[['expired', 'declined', 'withdrawn'], 'closed'],
		[['closed', 'closed'], 'closed'],
		[['won', 'not_selected'], 'hired'],
		[['done', 'not_selected', 'expired'], 'done'],
		[['released', 'bid_sent'], 'open']
	];
	for (const [leads, state] of cases) {
		it(`[${leads.join(', ')}] → ${state ?? 'not sent'}`, () => {
			expect(requestState(leads)).toBe(state);
		});
	}
});
