/** A contractor account's vetting states and the admin decisions that move between them. */
export const contractorStatuses = ['awaiting_review', 'approved', 'changes_requested', 'suspended'] as const;
export type ContractorStatus = (typeof contractorStatuses)[number];

export const statusLabels: Record<ContractorStatus, string> = {
	awaiting_review: 'Awaiting review',
	approved: 'Approved',
	changes_requested: 'Changes requested',
	suspended: 'Suspended'
};

export const vettingDecisions = ['approve', 'request_changes', 'suspend', 'reinstate'] as const;
export type VettingDecision = (typeof vettingDecisions)[number];

/** From which states each decision may be taken, where it leads, and whether it needs a reason. */
export const vettingMoves: Record<VettingDecision, { from: readonly ContractorStatus[]; to: ContractorStatus; reason: boolean; label: string }> = {
	approve: { from: ['awaiting_review'], to: 'approved', reason: false, label: 'Approve' },
	request_changes: { from: ['awaiting_review', 'approved'], to: 'changes_requested', reason: true, label: 'Request changes' },
	suspend: { from: ['awaiting_review', 'approved', 'changes_requested'], to: 'suspended', reason: true, label: 'Suspend' },
	reinstate: { from: ['suspended'], to: 'approved', reason: false, label: 'Reinstate' }
};

export const decisionsFrom = (status: ContractorStatus) => vettingDecisions.filter((d) => vettingMoves[d].from.includes(status));

/**
 * The status after a contractor saves the profile. A changed licence or insurance needs a fresh
 * look, so an approved account goes back to review; answering a change request sends it back too.
 * A suspension stays until an admin lifts it.
 */
export function statusAfterEdit(current: ContractorStatus, credentialsChanged: boolean): ContractorStatus {
	if (current === 'suspended') return 'suspended';
	if (current === 'changes_requested') return 'awaiting_review';
	if (current === 'approved') return credentialsChanged ? 'awaiting_review' : 'approved';
	return 'awaiting_review';
}
