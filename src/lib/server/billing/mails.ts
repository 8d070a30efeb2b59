import { extraLead, monthlyPlan, price } from '$lib/billing-plans';
import { notice } from '../mail/templates';

// Billing notices. Receipts (plan started, payment received, credits added) carry the 'billing'
// kind, which a contractor may turn off on their account page; a failed payment, a plan that
// ended and leads resuming after an overdue payment change what the account can do, so they are
// untagged and always go.
const footer = 'You receive this because you have a contractor account on Stakeline. Homeowners never pay Stakeline.';
const receiptFooter = `${footer} You can turn off billing receipts on your account page.`;
const billingUrl = (origin: string) => `${origin}/pro/billing`;
const leads = (n: number) => `${n} extra ${n === 1 ? 'lead' : 'leads'}`;

/** What an invoice was for, in a few words: "$51 for Slab Desk monthly and 2 extra leads". */
export function invoiceWords(o: { totalCents: number; plan: boolean; extraLeads: number }) {
	const parts = [...(o.plan ? [monthlyPlan.name] : []), ...(o.extraLeads ? [leads(o.extraLeads)] : [])];
	return `${price(o.totalCents)}${parts.length ? ` for ${parts.join(' and ')}` : ''}`;
}

export const planActiveMail = (name: string, origin: string) =>
	notice({
		subject: `Your ${monthlyPlan.name} plan is active`,
		name,
		lines: [
			`Thank you. Your plan includes ${monthlyPlan.leadsIncluded} leads each month: opening a lead’s details uses one. Beyond those, a lead costs ${price(extraLead.cents)} on your next invoice, and you are asked before each one. A lead that expires unanswered, or that the homeowner closes before any bid, gives its lead back.`
		],
		action: 'See your billing',
		url: billingUrl(origin),
		footer: receiptFooter,
		kind: 'billing'
	});

export const invoicePaidMail = (name: string, what: string, origin: string) =>
	notice({
		subject: 'Your Stakeline payment was received',
		name,
		lines: [`Thank you. We received ${what}. A new billing period has started, with ${monthlyPlan.leadsIncluded} leads included.`],
		action: 'See your invoices',
		url: billingUrl(origin),
		footer: receiptFooter,
		kind: 'billing'
	});

export const finalInvoiceMail = (name: string, what: string, paid: boolean, origin: string) =>
	notice({
		subject: paid ? 'Your final Stakeline invoice was paid' : 'Your final Stakeline invoice is unpaid',
		name,
		lines: paid
			? [`Your plan has ended; its final invoice, ${what}, was paid. Nothing more is due.`]
			: [
					`Your plan has ended; its final invoice, ${what}, could not be paid with the card on file. Update your payment method on your billing page: the invoice is retried with the new card at once.`
				],
		action: 'See your invoices',
		url: billingUrl(origin),
		footer: paid ? receiptFooter : footer,
		kind: paid ? 'billing' : undefined
	});

export const paymentRecoveredMail = (name: string, what: string, origin: string) =>
	notice({
		subject: 'Your Stakeline payment went through: leads resume',
		name,
		lines: [`Thank you. We received ${what}, so your account is paid up. New leads are delivered again and you can open lead details.`],
		action: 'See your billing',
		url: billingUrl(origin),
		footer
	});

export const paymentFailedMail = (name: string, what: string, origin: string) =>
	notice({
		subject: 'Your Stakeline payment did not go through',
		name,
		lines: [
			`The payment of ${what} failed. Until it is paid, new leads are paused and you cannot open lead details. Leads you opened already stay open to you.`,
			'Update your payment method to pay the overdue invoice.'
		],
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

export const leadPackPaidMail = (name: string, count: number, origin: string) =>
	notice({
		subject: `${count} lead credits added`,
		name,
		lines: [`Thank you. ${count} lead credits were added to your account; each one opens one lead’s details.`],
		action: 'See your billing',
		url: billingUrl(origin),
		footer: receiptFooter,
		kind: 'billing'
	});
