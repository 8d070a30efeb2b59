/** Lead and bid states, shared by the pages of both sides. */
export const leadStatuses = ['new', 'viewed', 'bid_sent', 'declined', 'won', 'not_selected', 'withdrawn', 'released', 'expired', 'closed', 'done'] as const;
export type LeadStatus = (typeof leadStatuses)[number];
export const leadStatusLabels: Record<LeadStatus, string> = {
	new: 'New',
	viewed: 'Viewed',
	bid_sent: 'Bid sent',
	declined: 'Declined',
	won: 'Won',
	not_selected: 'Not selected',
	withdrawn: 'Withdrawn',
	released: 'Released during suspension',
	expired: 'No reply by the respond-by date',
	closed: 'Request closed without hiring',
	done: 'Job done'
};

/** `released`: the homeowner reopened bidding while the accepted contractor's account was suspended. */
/** `closed`: the homeowner closed the request without hiring anyone. */
export const bidStatuses = ['open', 'accepted', 'not_selected', 'withdrawn', 'released', 'closed'] as const;
export type BidStatus = (typeof bidStatuses)[number];
export const bidStatusLabels: Record<BidStatus, string> = {
	open: 'Open',
	accepted: 'Accepted',
	not_selected: 'Not selected',
	withdrawn: 'Withdrawn',
	released: 'Released during suspension',
	closed: 'Request closed without hiring'
};

export const timeframes = ['soon', 'within_month', 'within_season', 'flexible'] as const;
export type Timeframe = (typeof timeframes)[number];
export const timeframeLabels: Record<Timeframe, string> = {
	soon: 'In the next two weeks',
	within_month: 'Within a month',
	within_season: 'This season',
	flexible: 'No fixed date'
};

/** The latest day the homeowner wants the work done by, from the day the plan was sent; null = no fixed date. */
export const timeframeDays: Record<Timeframe, number | null> = { soon: 14, within_month: 31, within_season: 90, flexible: null };
export function wantedBy(sentAt: Date, timeframe: Timeframe): string | null {
	const days = timeframeDays[timeframe];
	return days === null ? null : new Date(sentAt.getTime() + days * 86_400_000).toISOString().slice(0, 10);
}

/**
 * Days a contractor has to answer a lead (bid or decline) before it expires: shorter when the
 * homeowner wants the work soon. Our own choice, no published source.
 */
export const respondDays: Record<Timeframe, number> = { soon: 3, within_month: 7, within_season: 14, flexible: 14 };
export const respondBy = (sentAt: Date, timeframe: Timeframe) => new Date(sentAt.getTime() + respondDays[timeframe] * 86_400_000).toISOString().slice(0, 10);

/** The surface finish the homeowner asks for. */
export const finishes = ['broom', 'float', 'trowel', 'decide_with_contractor'] as const;
export type Finish = (typeof finishes)[number];
export const finishLabels: Record<Finish, string> = {
	broom: 'Broom finish (non-slip)',
	float: 'Float finish',
	trowel: 'Smooth trowel finish',
	decide_with_contractor: 'To decide with the contractor'
};

/** What covers the ground now and must come out before the forms go in. */
export const existingSurfaces = ['grass_soil', 'gravel', 'pavers', 'old_concrete'] as const;
export type ExistingSurface = (typeof existingSurfaces)[number];
export const existingSurfaceLabels: Record<ExistingSurface, string> = {
	grass_soil: 'Grass or bare soil (strip sod and topsoil)',
	gravel: 'Gravel',
	pavers: 'Pavers or flagstones',
	old_concrete: 'Old concrete (break out and haul away)'
};

export const lineItemKinds = ['labour', 'materials', 'base', 'forms', 'removal', 'other'] as const;
export type LineItemKind = (typeof lineItemKinds)[number];
export const lineItemLabels: Record<LineItemKind, string> = {
	labour: 'Labour',
	materials: 'Materials',
	base: 'Base',
	forms: 'Forms',
	removal: 'Removal and haul-away',
	other: 'Other'
};

/** At most this many contractors per send, so a homeowner is not flooded with calls. */
export const MAX_CONTRACTORS_PER_SEND = 5;

/** A bid past its valid-until date can no longer be accepted or edited. */
export const isExpired = (validUntil: string, today = new Date().toISOString().slice(0, 10)) => validUntil < today;
