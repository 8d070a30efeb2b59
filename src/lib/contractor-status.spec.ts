import { describe, expect, it } from 'vitest';
import { contractorStatuses, decisionsFrom, statusAfterEdit, vettingMoves } from './contractor-status';

describe('contractor status', () => {
	it('goes back to review when an approved account changes licence or insurance, not otherwise', () => {
		expect(statusAfterEdit('approved', true)).toBe('awaiting_review');
		expect(statusAfterEdit('approved', false)).toBe('approved');
	});

	it('returns a changes-requested account to review on any save, and keeps a suspension', () => {
		expect(statusAfterEdit('changes_requested', false)).toBe('awaiting_review');
		expect(statusAfterEdit('suspended', true)).toBe('suspended');
		expect(statusAfterEdit('awaiting_review', true)).toBe('awaiting_review');
	});

	it('offers the decisions that fit each state', () => {
		expect(Object.fromEntries(contractorStatuses.map((s) => [s, decisionsFrom(s)]))).toEqual({
			awaiting_review: ['approve', 'request_changes', 'suspend'],
			approved: ['request_changes', 'suspend'],
			changes_requested: ['suspend'],
			suspended: ['reinstate']
		});
		expect(vettingMoves.request_changes.reason && vettingMoves.suspend.reason).toBe(true);
	});
});
