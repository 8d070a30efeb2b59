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
