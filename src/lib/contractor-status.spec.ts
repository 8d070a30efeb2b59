import { describe, expect, it } from 'vitest';
import {
	contractorStatuses,
	daysUntil,
	reminderDue,
	statusAfterExpiry,
	decisionMeta,
	decisionsFrom,
	decisionTarget,
	statusAfterEdit,
	vettingDecisions,
	type ContractorStatus,
	type VettingDecision
} from './contractor-status';

// Written out by hand, one row per status, one column per decision; null = refused.
// Reinstate is tested separately below because its target depends on what the suspension remembers.
const expected: Record<ContractorStatus, Record<Exclude<VettingDecision, 'reinstate'>, ContractorStatus | null>> = {
	draft: { approve: null, send_back: null, suspend: 'suspended' },
	awaiting_review: { approve: 'approved', send_back: 'sent_back', suspend: 'suspended' },
	approved: { approve: null, send_back: 'sent_back', suspend: 'suspended' },
	sent_back: { approve: null, send_back: null, suspend: 'suspended' },
	suspended: { approve: null, send_back: null, suspend: null },
	lapsed: { approve: null, send_back: null, suspend: 'suspended' }
};
const clean = { before: null, credentialsChanged: false };

describe('vetting decisions, every (status, decision) pair', () => {
	for (const status of contractorStatuses) {
		for (const decision of vettingDecisions.filter((d) => d !== 'reinstate') as Exclude<VettingDecision, 'reinstate'>[]) {
			it(`${status} × ${decision} → ${expected[status][decision] ?? 'refused'}`, () => {
				expect(decisionTarget(status, decision, clean)).toBe(expected[status][decision]);
			});
		}
		if (status !== 'suspended') {
			it(`${status} × reinstate → refused`, () => {
				expect(decisionTarget(status, 'reinstate', { before: 'approved', credentialsChanged: false })).toBeNull();
			});
		}
	}

	// suspended × reinstate: back where the account stood, or to review when credentials changed.
	const reinstate: [ContractorStatus | null, boolean, ContractorStatus][] = [
		['draft', false, 'draft'], // never submitted stays never submitted: a suspension is no shortcut to approval
		['draft', true, 'awaiting_review'], // submitted during the suspension: first submission goes to the queue
		['awaiting_review', false, 'awaiting_review'],
		['awaiting_review', true, 'awaiting_review'],
		['approved', false, 'approved'],
		['approved', true, 'awaiting_review'], // new licence or insurance nobody has checked
		['sent_back', false, 'sent_back'],
		['sent_back', true, 'awaiting_review'],
		['lapsed', false, 'lapsed'], // still expired: reinstating does not renew a licence
		['lapsed', true, 'awaiting_review'],
		[null, false, 'awaiting_review'] // a suspension that remembers nothing goes to the queue, never to approved
	];
	for (const [before, changed, to] of reinstate) {
		it(`suspended (from ${before ?? 'unknown'}${changed ? ', credentials changed' : ''}) × reinstate → ${to}`, () => {
			expect(decisionTarget('suspended', 'reinstate', { before, credentialsChanged: changed })).toBe(to);
		});
	}

	it('offers exactly the decisions the table allows, and asks a reason for send back and suspend only', () => {
		expect(Object.fromEntries(contractorStatuses.map((s) => [s, decisionsFrom(s)]))).toEqual({
			draft: ['suspend'],
			awaiting_review: ['approve', 'send_back', 'suspend'],
			approved: ['send_back', 'suspend'],
			sent_back: ['suspend'],
			suspended: ['reinstate'],
			lapsed: ['suspend']
		});
		expect(vettingDecisions.filter((d) => decisionMeta[d].reason)).toEqual(['send_back', 'suspend']);
	});

	it('reaches approved only by approving an account awaiting review, or reinstating an approved one untouched', () => {
		const ways = new Set<string>();
		for (const s of contractorStatuses)
			for (const d of vettingDecisions)
				for (const before of [null, ...contractorStatuses])
					for (const changed of [false, true])
						if (decisionTarget(s, d, { before, credentialsChanged: changed }) === 'approved')
							ways.add(d === 'reinstate' ? `${s}:${d}:${before}:${changed}` : `${s}:${d}`);
		expect([...ways].sort()).toEqual(['awaiting_review:approve', 'suspended:reinstate:approved:false']);
	});
});

describe('profile saves, every (status, credentials changed or not) pair', () => {
	const expectedEdit: [ContractorStatus, boolean, ContractorStatus][] = [
		['draft', false, 'awaiting_review'], // the first submission always enters the queue
		['draft', true, 'awaiting_review'],
		['awaiting_review', false, 'awaiting_review'],
		['awaiting_review', true, 'awaiting_review'],
		['approved', false, 'approved'], // a new phone number needs no review
		['approved', true, 'awaiting_review'],
		['sent_back', false, 'awaiting_review'], // answering a send-back returns to the queue
		['sent_back', true, 'awaiting_review'],
		['suspended', false, 'suspended'], // only an admin lifts a suspension
		['suspended', true, 'suspended'],
		['lapsed', false, 'lapsed'], // a new phone number does not renew an expired licence
		['lapsed', true, 'awaiting_review'] // renewed: an admin checks the new dates and files
	];
	for (const [from, changed, to] of expectedEdit) {
		it(`${from} + save${changed ? ' with new credentials' : ''} → ${to}`, () => {
			expect(statusAfterEdit(from, changed)).toBe(to);
		});
	}
	it('covers every status', () => {
		expect(new Set(expectedEdit.map(([s]) => s))).toEqual(new Set(contractorStatuses));
	});
});

describe('credential expiry, every status', () => {
	const expectedExpiry: Record<ContractorStatus, ContractorStatus> = {
		draft: 'draft',
		awaiting_review: 'awaiting_review', // the reviewer sees the date; approving an expired one is refused
		approved: 'lapsed', // stops receiving leads until renewed
		sent_back: 'sent_back',
		suspended: 'suspended',
		lapsed: 'lapsed'
	};
	for (const s of contractorStatuses) {
		it(`${s} × credential expired → ${expectedExpiry[s]}`, () => {
			expect(statusAfterExpiry(s)).toBe(expectedExpiry[s]);
		});
	}
	it('lapsed is left only by renewing (review) or a suspension', () => {
		const out = new Set<string>();
		for (const d of vettingDecisions) {
			const to = decisionTarget('lapsed', d, clean);
			if (to) out.add(to);
		}
		for (const changed of [false, true]) out.add(statusAfterEdit('lapsed', changed));
		out.add(statusAfterExpiry('lapsed'));
		expect([...out].sort()).toEqual(['awaiting_review', 'lapsed', 'suspended']);
	});
	it('counts days across a month end and picks the reminder due', () => {
		expect(daysUntil('2027-03-01', '2027-02-27')).toBe(2);
		expect(daysUntil('2027-02-27', '2027-03-01')).toBe(-2);
		expect([31, 30, 8, 7, 1, 0, -1].map(reminderDue)).toEqual([null, 30, 30, 7, 7, 7, null]);
	});
});
