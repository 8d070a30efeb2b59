import type { VettingDecision } from '$lib/contractor-status';
import { notice, type Mail } from './templates';

const vettingText: Record<VettingDecision, { subject: string; line: string; action: string; path: string }> = {
	approve: {
		subject: 'Your Stakeline pro account is approved',
		line: 'We checked your licence and insurance. From now on, homeowners in your service area can send you their slab plans.',
		action: 'Open the pro desk',
		path: '/pro'
	},
	request_changes: {
		subject: 'Your Stakeline profile needs a change',
		line: 'We looked at your profile and need something changed before we can approve it.',
		action: 'Update my profile',
		path: '/pro/profile'
	},
	suspend: {
		subject: 'Your Stakeline pro account is suspended',
		line: 'Your account is suspended: you receive no new leads, and open bids were withdrawn.',
		action: 'Open the pro desk',
		path: '/pro'
	},
	reinstate: {
		subject: 'Your Stakeline pro account is active again',
		line: 'The suspension is lifted. Homeowners in your service area can send you their plans again.',
		action: 'Open the pro desk',
		path: '/pro'
	}
};

/** Tells a contractor what an admin decided, with the reason when one was given. */
export function vettingDecisionMail(name: string, decision: VettingDecision, reason: string | null, origin: string): Mail {
	const t = vettingText[decision];
	return notice({
		subject: t.subject,
		name,
		lines: [t.line, ...(reason ? [`Note from the reviewer: ${reason}`] : [])],
		action: t.action,
		url: origin + t.path,
		footer: 'You receive this because you have a contractor account on Stakeline.'
	});
}

const footer = 'You receive this because you use Stakeline. Reply inside Stakeline, not to this e-mail.';
const simple = (subject: string, name: string, lines: string[], action: string, url: string): Mail => notice({ subject, name, lines, action, url, footer });

export const newLeadMail = (name: string, town: string, planName: string, url: string) =>
	simple(`New lead near ${town}`, name, [`A homeowner near ${town} sent you the plan “${planName}” and asks for a bid.`], 'Open the lead', url);

export const newerRevisionMail = (name: string, town: string, revision: number, url: string) =>
	simple(
		`A newer plan revision near ${town}`,
		name,
		[`The homeowner re-sent their plan as revision ${revision}. Your lead still shows the revision you received; check whether your bid needs a change.`],
		'Open the lead',
		url
	);

export const newBidMail = (name: string, business: string, planName: string, updated: boolean, url: string) =>
	simple(
		updated ? `${business} changed their bid` : `New bid from ${business}`,
		name,
		[updated ? `${business} changed their bid for “${planName}”.` : `${business} sent a bid for “${planName}”.`],
		'Compare the bids',
		url
	);

export const bidDecisionMail = (name: string, won: boolean, town: string, url: string) =>
	won
		? simple(`Your bid near ${town} was accepted`, name, ['The homeowner accepted your bid. Their contact details are now on the lead page.'], 'Open the lead', url)
		: simple(`Your bid near ${town} was not selected`, name, ['The homeowner chose another bid for this plan. Thank you for bidding.'], 'Open the lead', url);

export const newMessageMail = (name: string, from: string, url: string) =>
	simple(`New message from ${from}`, name, [`${from} wrote to you about a slab plan on Stakeline.`], 'Read the message', url);
