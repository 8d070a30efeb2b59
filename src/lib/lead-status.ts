/**
 * A lead's life as one table: every state a lead can be in, every step either side (or the clock)
 * can take, and where each step leads. The server looks every change up here; nothing else moves
 * a lead. A request (one plan sent to several firms) has no state of its own: it is what its
 * leads are, as `requestState` reads it.
 */
import type { LeadStatus } from './leads';

export const leadActions = [
	'view', // the contractor opens the lead
	'bid', // the contractor sends or changes a bid
	'withdraw', // the contractor withdraws their open bid
	'decline', // the contractor declines the lead
	'accept', // the homeowner accepts this lead's bid
	'accept_other', // the homeowner accepts another firm's bid for the same plan
	'close', // the homeowner closes the request without hiring anyone
	'expire', // the respond-by date passed
	'complete', // the homeowner marks the job done
	'release', // the homeowner releases the job while Stakeline has the hired firm on hold
	'reopen' // bidding reopened after a release: a still-valid bid that was not selected is open again
] as const;
export type LeadAction = (typeof leadActions)[number];

/** `same`: the step does not concern this lead and leaves it as it is; a missing cell is refused. */
type Cell = LeadStatus | 'same';

export const leadTable: Record<LeadStatus, Partial<Record<LeadAction, Cell>>> = {
	new: { view: 'viewed', bid: 'bid_sent', decline: 'declined', accept_other: 'not_selected', close: 'closed', expire: 'expired', reopen: 'same' },
	viewed: { view: 'same', bid: 'bid_sent', decline: 'declined', accept_other: 'not_selected', close: 'closed', expire: 'expired', reopen: 'same' },
	// A firm that bid answered in time: the respond-by date no longer concerns it (its bid has its own valid-until).
	bid_sent: {
		view: 'same',
		bid: 'bid_sent',
		withdraw: 'withdrawn',
		decline: 'declined',
		accept: 'won',
		accept_other: 'not_selected',
		close: 'closed',
		expire: 'same',
		reopen: 'same'
	},
	declined: { view: 'same', accept_other: 'same', close: 'same', expire: 'same', reopen: 'same' },
	won: { view: 'same', complete: 'done', release: 'released' },
	not_selected: { view: 'same', close: 'same', expire: 'same', reopen: 'bid_sent' },
	withdrawn: { view: 'same', accept_other: 'same', close: 'same', expire: 'same', reopen: 'same' },
	released: { view: 'same', close: 'same', expire: 'same', reopen: 'same' },
	expired: { view: 'same', accept_other: 'same', close: 'same', expire: 'same', reopen: 'same' },
	closed: { view: 'same', close: 'same', expire: 'same', reopen: 'same' },
	done: { view: 'same' }
};

/** Where `action` takes a lead in `status`, or null when the table refuses it. */
export function leadTarget(status: LeadStatus, action: LeadAction): LeadStatus | null {
	const cell = leadTable[status][action];
	if (!cell) return null;
	return cell === 'same' ? status : cell;
}

/** The leads `action` actually changes, among `statuses` (those whose target differs). */
export const statusesMovedBy = (action: LeadAction, statuses: readonly LeadStatus[]) =>
	statuses.filter((s) => {
		const to = leadTarget(s, action);
		return to !== null && to !== s;
	});

/** Still waiting on someone: the contractor can answer, the homeowner can accept. */
export const openLeadStatuses: readonly LeadStatus[] = ['new', 'viewed', 'bid_sent'];
export const isOpenLead = (s: LeadStatus) => openLeadStatuses.includes(s);

/** Leads whose thread still takes messages: the open ones and the hired firm's (also after the job). */
export const threadOpen = (s: LeadStatus) => isOpenLead(s) || s === 'won' || s === 'done';

export type RequestState = 'open' | 'hired' | 'done' | 'closed';
export const requestStateLabels: Record<RequestState, string> = {
	open: 'Open for bids',
	hired: 'Contractor hired',
	done: 'Job done',
	closed: 'Closed without hiring'
};

/** What a plan's request is, read from its leads: hired or done once a bid was accepted, open while any lead is. */
export function requestState(statuses: readonly LeadStatus[]): RequestState | null {
	if (!statuses.length) return null;
	if (statuses.includes('done')) return 'done';
	if (statuses.includes('won')) return 'hired';
	if (statuses.some(isOpenLead)) return 'open';
	return 'closed';
}
