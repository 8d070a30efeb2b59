import { codesOf } from './codes';

/**
 * The lead's closed sets, each code with the words both sides' pages show for it. The codes, in the
 * order written, are what the database enums, the form schemas and the selects take.
 */
const words = {
	/** Lead states, shared by the pages of both sides. */
	leadStatus: {
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
	},
	/**
	 * Bid states. `released`: the homeowner reopened bidding while the accepted contractor's account
	 * was suspended. `closed`: the homeowner closed the request without hiring anyone.
	 */
	bidStatus: {
		open: 'Open',
		accepted: 'Accepted',
		not_selected: 'Not selected',
		withdrawn: 'Withdrawn',
		released: 'Released during suspension',
		closed: 'Request closed without hiring'
	},
	timeframe: {
		soon: 'In the next two weeks',
		within_month: 'Within a month',
		within_season: 'This season',
		flexible: 'No fixed date'
	},
	/** The surface finish the homeowner asks for. */
	finish: {
		broom: 'Broom finish (non-slip)',
		float: 'Float finish',
		trowel: 'Smooth trowel finish',
		decide_with_contractor: 'To decide with the contractor'
	},
	/** What covers the ground now and must come out before the forms go in. */
	existingSurface: {
		grass_soil: 'Grass or bare soil (strip sod and topsoil)',
		gravel: 'Gravel',
		pavers: 'Pavers or flagstones',
		old_concrete: 'Old concrete (break out and haul away)'
	},
	lineItem: {
		labour: 'Labour',
		materials: 'Materials',
		base: 'Base',
		forms: 'Forms',
		removal: 'Removal and haul-away',
		other: 'Other'
	}
};
type Words = typeof words;

export type LeadStatus = keyof Words['leadStatus'];
export type BidStatus = keyof Words['bidStatus'];
export type Timeframe = keyof Words['timeframe'];
export type Finish = keyof Words['finish'];
export type ExistingSurface = keyof Words['existingSurface'];
export type LineItemKind = keyof Words['lineItem'];

export const leadStatuses = codesOf(words.leadStatus);
export const bidStatuses = codesOf(words.bidStatus);
export const timeframes = codesOf(words.timeframe);
export const finishes = codesOf(words.finish);
export const existingSurfaces = codesOf(words.existingSurface);
export const lineItemKinds = codesOf(words.lineItem);

export const {
	leadStatus: leadStatusLabels,
	bidStatus: bidStatusLabels,
	timeframe: timeframeLabels,
	finish: finishLabels,
	existingSurface: existingSurfaceLabels,
	lineItem: lineItemLabels
} = words;

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

/** At most this many contractors per send, so a homeowner is not flooded with calls. */
export const MAX_CONTRACTORS_PER_SEND = 5;

/** A bid past its valid-until date can no longer be accepted or edited. */
export const isExpired = (validUntil: string, today = new Date().toISOString().slice(0, 10)) => validUntil < today;
