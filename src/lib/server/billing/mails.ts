import { monthlyPlan } from '$lib/billing-plans';
import { notice } from '../mail/templates';

// Billing notices: untagged, so they always go (they are about money and the account).
const footer = 'You receive this because you have a contractor account on Stakeline. Homeowners never pay Stakeline.';
const billingUrl = (origin: string) => `${origin}/pro/billing`;

export const planActiveMail = (name: string, origin: string) =>
	notice({
		subject: `Your ${monthlyPlan.name} plan is active`,
		name,
		lines: [`Thank you. Your plan includes ${monthlyPlan.leadsIncluded} leads each month: opening a lead’s details uses one. A lead that expires unanswered, or that the homeowner closes before any bid, gives its lead back.`],
		action: 'See your billing',
		url: billingUrl(origin),
		footer
	});

export const paymentFailedMail = (name: string, origin: string) =>
	notice({
		subject: 'Your Stakeline payment did not go through',
		name,
		lines: ['The payment for your plan failed. Until it is paid, new leads are paused and you cannot open lead details. Leads you opened already stay open to you.', 'Update your payment method to pay the overdue invoice.'],
		action: 'Update payment method',
		url: billingUrl(origin),
		footer
	});

export const planEndedMail = (name: string, origin: string) =>
	notice({
		subject: 'Your Stakeline plan has ended',
		name,
		lines: ['Your plan has ended. You still receive leads and see their town, size and scope, but opening their details needs a plan or a lead credit.'],
		action: 'Choose a plan',
		url: billingUrl(origin),
		footer
	});

export const leadPackPaidMail = (name: string, leads: number, origin: string) =>
	notice({
		subject: `${leads} lead credits added`,
		name,
		lines: [`Thank you. ${leads} lead credits were added to your account; each one opens one lead’s details.`],
		action: 'See your billing',
		url: billingUrl(origin),
		footer
	});
