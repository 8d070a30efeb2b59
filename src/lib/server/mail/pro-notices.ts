import type { ContractorStatus, VettingDecision } from '$lib/contractor-status';
import type { MailKind } from '$lib/mail-kinds';
import { notice, type Mail } from './templates';

const vettingText: Record<VettingDecision, { subject: string; line: string; action: string; path: string }> = {
	approve: {
		subject: 'Your Stakeline pro account is approved',
		line: 'We checked your licence and insurance. From now on, homeowners in your service area can send you their slab plans.',
		action: 'Open the pro desk',
		path: '/pro'
	},
	send_back: {
		subject: 'Your Stakeline profile was sent back',
		line: 'We looked at your profile and need something from you before we can approve it. The reason is also on your profile page.',
		action: 'Update my profile',
		path: '/pro/profile'
	},
	suspend: {
		subject: 'Your Stakeline pro account is suspended',
		line: 'Your account is suspended: you receive no new leads, and your open leads and bids are on hold. The homeowners concerned are told that Stakeline suspended the account, not that you withdrew.',
		action: 'Open the pro desk',
		path: '/pro'
	},
	reinstate: {
		subject: 'Your Stakeline pro account is active again',
		line: 'The suspension is lifted.',
		action: 'Open the pro desk',
		path: '/pro'
	}
};

/** Where a reinstated account stands now; reinstating does not skip a review. */
const afterReinstate: Partial<Record<ContractorStatus, string>> = {
	approved: 'Homeowners in your service area can send you their plans again, and your leads that are still open are back on your desk.',
	awaiting_review: 'Your licence or insurance changed while the account was suspended, so an administrator checks them before leads come back.',
	sent_back: 'Your profile is still sent back: please make the change asked for earlier.',
	draft: 'Finish your business profile and send it for review to receive leads.',
	lapsed: 'Your licence or insurance is still past its expiry date: upload the renewed document with its new date to receive leads again.'
};

/** Tells a contractor what an admin decided, with the reason when one was given. */
export function vettingDecisionMail(name: string, decision: VettingDecision, to: ContractorStatus, reason: string | null, origin: string): Mail {
	const t = vettingText[decision];
	const next = decision === 'reinstate' ? afterReinstate[to] : undefined;
	return notice({
		subject: t.subject,
		name,
		lines: [t.line, ...(next ? [next] : []), ...(reason ? [`Note from the reviewer: ${reason}`] : [])],
		action: t.action,
		url: origin + t.path,
		footer: 'You receive this because you have a contractor account on Stakeline.'
	});
}

const footer = 'You receive this because you use Stakeline. Reply inside Stakeline, not to this e-mail. Choose which e-mails you get on your account page.';
const simple = (kind: MailKind | undefined, subject: string, name: string, lines: string[], action: string, url: string): Mail =>
	notice({ subject, name, lines, action, url, footer, kind });

export const newLeadMail = (name: string, town: string, planName: string, respondBy: string, url: string) =>
	simple(
		'new_lead',
		`New lead near ${town}`,
		name,
		[`A homeowner near ${town} sent you the plan “${planName}” and asks for a bid. Please bid or decline by ${respondBy}; after that date the lead closes.`],
		'Open the lead',
		url
	);

export const newerRevisionMail = (name: string, town: string, revision: number, url: string) =>
	simple(
		'new_lead',
		`A newer plan revision near ${town}`,
		name,
		[`The homeowner re-sent their plan as revision ${revision}. Your lead still shows the revision you received; check whether your bid needs a change.`],
		'Open the lead',
		url
	);

export const newBidMail = (name: string, business: string, planName: string, updated: boolean, url: string) =>
	simple(
		'bid_update',
		updated ? `${business} changed their bid` : `New bid from ${business}`,
		name,
		[updated ? `${business} changed their bid for “${planName}”.` : `${business} sent a bid for “${planName}”.`],
		'Compare the bids',
		url
	);

/** To each firm a plan was sent to, when the homeowner hires one: won, not selected, or (no bid sent) closed. */
export const bidDecisionMail = (name: string, outcome: 'won' | 'not_selected' | 'hired_other', town: string, url: string) =>
	outcome === 'won'
		? simple(
				'bid_result',
				`Your bid near ${town} was accepted`,
				name,
				['The homeowner accepted your bid. Their contact details are now on the lead page.'],
				'Open the lead',
				url
			)
		: outcome === 'not_selected'
			? simple(
					'bid_result',
					`Your bid near ${town} was not selected`,
					name,
					['The homeowner chose another bid for this plan. Thank you for bidding.'],
					'Open the lead',
					url
				)
			: simple(
					'bid_result',
					`A lead near ${town} is closed: another firm was hired`,
					name,
					['The homeowner hired another firm for this plan before you sent a bid, so the lead is closed. Nothing else changes on your account.'],
					'Open the lead',
					url
				);

export const newMessageMail = (name: string, from: string, url: string) =>
	simple('message', `New message from ${from}`, name, [`${from} wrote to you about a slab plan on Stakeline.`], 'Read the message', url);

export const bidWithdrawnMail = (name: string, business: string, planName: string, url: string) =>
	simple(
		'bid_update',
		`${business} withdrew their bid`,
		name,
		[`${business} withdrew their bid for “${planName}”. Their other bids and messages stay as they were.`],
		'Compare the bids',
		url
	);

/**
 * To a homeowner whose contractor Stakeline suspended or sent back to review: it was our decision,
 * not the contractor's, and what it means for their bid or the accepted job.
 */
export function contractorPausedMail(name: string, business: string, planName: string, why: 'suspended' | 'review' | 'lapsed', accepted: boolean, url: string) {
	const what =
		why === 'suspended'
			? `Stakeline has suspended the account of ${business} while we look into a concern. This is our decision; the contractor did not withdraw.`
			: why === 'lapsed'
				? `The licence or insurance that ${business} gave Stakeline has passed its expiry date. Until they renew it and we check the new one, they cannot be hired through Stakeline; they did not withdraw.`
				: `Stakeline is checking the licence or insurance of ${business} again. This is our check; the contractor did not withdraw.`;
	const effect = accepted
		? `You accepted their bid for “${planName}”, so the job is on hold. You can wait for us, or reopen bidding on your bids page.`
		: `Their bid or lead for “${planName}” stays on your page, but it cannot be accepted until the account is active again.`;
	const subject =
		why === 'suspended'
			? `${business} is suspended for now`
			: why === 'lapsed'
				? `${business}: licence or insurance expired`
				: `${business} is under review for now`;
	return simple(undefined, subject, name, [what, effect, 'We will e-mail you when this changes.'], 'Open your bids', url);
}

export const contractorActiveAgainMail = (name: string, business: string, planName: string, url: string) =>
	simple(
		undefined,
		`${business} is active again`,
		name,
		[`The account of ${business} is active again. Their bid or lead for “${planName}” is open as before.`],
		'Open your bids',
		url
	);

export const jobReleasedMail = (name: string, town: string, url: string) =>
	simple(
		'bid_result',
		`A job near ${town} was released`,
		name,
		['While your account was suspended, the homeowner released the job they had accepted your bid for and reopened bidding. Your bid is closed.'],
		'Open the lead',
		url
	);

export const biddingReopenedMail = (name: string, town: string, url: string) =>
	simple(
		'bid_result',
		`Bidding reopened near ${town}`,
		name,
		['The homeowner reopened bidding on a plan you bid for. Your bid is open again and can be accepted.'],
		'Open the lead',
		url
	);

export const profileSubmittedMail = (name: string, business: string, url: string) =>
	notice({
		subject: `A contractor profile is waiting for review: ${business}`,
		name,
		lines: [`${business} sent their profile for review.`],
		action: 'Open the vetting queue',
		url,
		footer: 'You receive this because you are a Stakeline administrator.',
		kind: 'review_queue'
	});

/**
 * Notices of the lead and credential life cycle. Lead notices carry the kind of the bid mail they
 * belong with, so they can be turned off with it; credential notices always go (an account that
 * lapses stops receiving leads, which its owner must not miss).
 */
const credentialName = { licence: 'licence', insurance: 'insurance' } as const;

export const credentialReminderMail = (name: string, kind: 'licence' | 'insurance', expiresOn: string, daysLeft: number, url: string) =>
	notice({
		subject: `Your ${credentialName[kind]} on Stakeline expires in ${daysLeft} ${daysLeft === 1 ? 'day' : 'days'}`,
		name,
		lines: [
			`The ${credentialName[kind]} on your Stakeline profile expires on ${expiresOn}.`,
			'On that day your account stops receiving leads, and homeowners cannot accept your bids, until you upload the renewed document with its new date and an administrator checks it.'
		],
		action: 'Renew on my profile',
		url,
		footer: 'You receive this because you have a contractor account on Stakeline.'
	});

export const credentialLapsedMail = (name: string, kinds: ('licence' | 'insurance')[], url: string) =>
	notice({
		subject: `Your ${kinds.map((k) => credentialName[k]).join(' and ')} on Stakeline has expired`,
		name,
		lines: [
			`The ${kinds.map((k) => credentialName[k]).join(' and ')} on your Stakeline profile has expired, so your account receives no new leads and homeowners cannot accept your bids for now.`,
			'Upload the renewed document with its new expiry date: an administrator checks it, and your leads come back once it is approved. The homeowners with your open bids are told why.'
		],
		action: 'Renew on my profile',
		url,
		footer: 'You receive this because you have a contractor account on Stakeline.'
	});

export const leadExpiredMail = (name: string, town: string, respondBy: string, url: string) =>
	simple(
		'bid_result',
		`A lead near ${town} expired`,
		name,
		[`You did not bid or decline by ${respondBy}, the respond-by date, so the lead is closed. The homeowner was told you did not reply in time.`],
		'Open the lead',
		url
	);

export const leadsUnansweredMail = (name: string, planName: string, businesses: string[], respondBy: string, url: string) =>
	simple(
		'bid_update',
		businesses.length === 1 ? `${businesses[0]} did not reply in time` : `${businesses.length} contractors did not reply in time`,
		name,
		[
			`${businesses.join(', ')} did not bid or decline on “${planName}” by ${respondBy}, so ${businesses.length === 1 ? 'that request is' : 'those requests are'} closed. Bids you already have are not affected.`
		],
		'Open your bids',
		url
	);

export const requestClosedMail = (name: string, town: string, hadBid: boolean, url: string) =>
	simple(
		'bid_result',
		`A request near ${town} was closed`,
		name,
		[`The homeowner closed their request without hiring anyone${hadBid ? '; your bid is closed and nobody else was chosen' : ''}. Thank you for your time.`],
		'Open the lead',
		url
	);

export const jobDoneMail = (name: string, town: string, url: string) =>
	simple(
		'bid_result',
		`The job near ${town} is marked done`,
		name,
		['The homeowner marked the job done. Thank you for the work. The lead and its messages stay on your desk for your records.'],
		'Open the lead',
		url
	);
