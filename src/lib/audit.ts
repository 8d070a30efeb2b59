import { decisionMeta, vettingDecisions } from './contractor-status';

/** Admin actions: the vetting decisions and account access. Add new ones here (and a label). */
export const auditActions = [...vettingDecisions, 'disable_account', 'enable_account'] as const;
export type AuditAction = (typeof auditActions)[number];

export const auditActionLabels: Record<AuditAction, string> = {
	approve: decisionMeta.approve.label,
	send_back: decisionMeta.send_back.label,
	suspend: decisionMeta.suspend.label,
	reinstate: decisionMeta.reinstate.label,
	disable_account: 'Disable account',
	enable_account: 'Enable account'
};

/** Account actions are about any account; the vetting ones about a contractor's business. */
export const isAccountAction = (a: AuditAction) => a === 'disable_account' || a === 'enable_account';
