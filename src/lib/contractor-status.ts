import { codesOf } from './codes';

/**
 * A contractor account's vetting states and every way between them, as two tables: the admin's
 * decisions and the contractor's own profile saves. Nothing else changes a status.
 */
export const statusLabels = {
	draft: 'Not yet submitted',
	awaiting_review: 'Awaiting review',
	approved: 'Approved',
	sent_back: 'Sent back: documents needed',
	suspended: 'Suspended',
	lapsed: 'Licence or insurance expired'
};
export type ContractorStatus = keyof typeof statusLabels;
export const contractorStatuses = codesOf(statusLabels);

/** Button label, and whether the decision needs a reason the contractor will read. */
export const decisionMeta = {
	approve: { label: 'Approve', reason: false },
	send_back: { label: 'Send back', reason: true },
	suspend: { label: 'Suspend', reason: true },
	reinstate: { label: 'Reinstate', reason: false }
} satisfies Record<string, { label: string; reason: boolean }>;
export type VettingDecision = keyof typeof decisionMeta;
export const vettingDecisions = codesOf(decisionMeta);

/** `restore`: back to where the account stood when it was suspended (see `decisionTarget`). */
type DecisionCell = ContractorStatus | 'restore';

/**
 * Status × decision. A missing cell is a refused decision. Only an account awaiting review can be
 * approved, so nobody is approved without an admin looking at what they submitted last.
 */
export const decisionTable: Record<ContractorStatus, Partial<Record<VettingDecision, DecisionCell>>> = {
	draft: { suspend: 'suspended' },
	awaiting_review: { approve: 'approved', send_back: 'sent_back', suspend: 'suspended' },
	approved: { send_back: 'sent_back', suspend: 'suspended' },
	sent_back: { suspend: 'suspended' },
	suspended: { reinstate: 'restore' },
	// An expired credential is renewed by the contractor (a profile save), not waved through by an admin.
	lapsed: { suspend: 'suspended' }
};

/** What a suspension remembers so that reinstating it cannot skip the review. */
export type SuspensionMemory = { before: ContractorStatus | null; credentialsChanged: boolean };

/**
 * Where `decision` takes an account in `current`, or null when the table refuses it. Reinstating
 * returns to the status before the suspension; to review instead when the licence or insurance
 * changed during the suspension, since nobody has looked at the new ones.
 */
export function decisionTarget(current: ContractorStatus, decision: VettingDecision, memory: SuspensionMemory): ContractorStatus | null {
	const cell = decisionTable[current][decision];
	if (!cell) return null;
	if (cell !== 'restore') return cell;
	if (memory.credentialsChanged) return 'awaiting_review';
	// A suspension from before this table existed remembers nothing: the safe place is the queue.
	return memory.before && memory.before !== 'suspended' ? memory.before : 'awaiting_review';
}

export const decisionsFrom = (status: ContractorStatus) => vettingDecisions.filter((d) => decisionTable[status][d]);

/**
 * Status × profile save (same credentials / changed licence or insurance). The first save is the
 * submission and always enters the queue; a sent-back profile returns to it on any save; an
 * approved one only when the credentials changed. A suspension stays until an admin lifts it.
 */
export const editTable: Record<ContractorStatus, { same: ContractorStatus; credentials: ContractorStatus }> = {
	draft: { same: 'awaiting_review', credentials: 'awaiting_review' },
	awaiting_review: { same: 'awaiting_review', credentials: 'awaiting_review' },
	approved: { same: 'approved', credentials: 'awaiting_review' },
	sent_back: { same: 'awaiting_review', credentials: 'awaiting_review' },
	suspended: { same: 'suspended', credentials: 'suspended' },
	// Renewing means new dates or documents, which an admin checks before leads come back.
	lapsed: { same: 'lapsed', credentials: 'awaiting_review' }
};

export const statusAfterEdit = (current: ContractorStatus, credentialsChanged: boolean): ContractorStatus =>
	editTable[current][credentialsChanged ? 'credentials' : 'same'];

/**
 * Status × the clock passing a licence or insurance expiry date. Only an approved account changes:
 * it stops receiving leads until renewed. The others already receive none, and their review (or
 * reinstatement, then the next sweep) catches the date.
 */
export const expiryTable: Record<ContractorStatus, ContractorStatus> = {
	draft: 'draft',
	awaiting_review: 'awaiting_review',
	approved: 'lapsed',
	sent_back: 'sent_back',
	suspended: 'suspended',
	lapsed: 'lapsed'
};
export const statusAfterExpiry = (current: ContractorStatus): ContractorStatus => expiryTable[current];

/** Reminders go this many days before a licence or insurance expires (each once per date). */
export const reminderDays = [30, 7] as const;
export type ReminderDays = (typeof reminderDays)[number];

/** Whole days from `today` to `expiresOn` (ISO days; negative once passed). */
export const daysUntil = (expiresOn: string, today: string) =>
	Math.round((Date.parse(`${expiresOn}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);

/**
 * The reminder due for a date `daysLeft` away: the 7-day one inside a week, the 30-day one inside
 * a month, none otherwise (or once passed). A reminder skipped (the sweep did not run in time) is
 * not sent late when the next one is already due.
 */
export function reminderDue(daysLeft: number): ReminderDays | null {
	if (daysLeft < 0) return null;
	if (daysLeft <= 7) return 7;
	if (daysLeft <= 30) return 30;
	return null;
}
