import { error, fail, redirect } from '@sveltejs/kit';
import { accountView, billingAccountOf, entitlement, extraLeadsThisPeriod, leadTeaser, openLeadFor } from '$lib/server/billing/accounts';
import { BillingRefused, invoicesOf, setCancelAtPeriodEnd, startCardUpdate, startPackCheckout, startPlanCheckout } from '$lib/server/billing/checkout';
import { BillingUnavailable } from '$lib/server/billing/client';
import { requireApprovedContractor } from '$lib/server/contractors';
import { requireRole } from '$lib/server/guards';
import { errorSummary, log } from '$lib/server/log';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

const returns = {
	done: 'Payment received. Thank you.',
	pack: 'Payment received: your lead credits are added.',
	card: 'Your new payment method is saved.',
	cancelled: 'You left the payment page without paying; nothing was charged and nothing changed.'
} as const;

export const load = (async (event) => {
	const user = requireRole(event, 'contractor');
	const { contractor } = await event.parent();
	const account = await billingAccountOf(user.id);
	const back = event.url.searchParams.get('checkout') ?? '';
	// The lead the contractor tried to open, when they came here from it: what they may see of it without a plan.
	const leadId = event.url.searchParams.get('lead') ?? '';
	const teaser = contractor.status === 'approved' && /^[0-9a-f-]{36}$/i.test(leadId) ? await leadTeaser(user.id, leadId) : null;
	return {
		approved: contractor.status === 'approved',
		account: { ...accountView(account), hasSubscription: !!account.subscriptionId },
		entitlement: entitlement(account),
		extraLeads: await extraLeadsThisPeriod(account),
		returned: back in returns ? { kind: back as keyof typeof returns, message: returns[back as keyof typeof returns] } : null,
		teaser,
		// Streamed: the page shows at once and the invoices arrive from the provider after.
		invoices: invoicesOf(user.id)
			.then((rows) => ({ ok: true as const, rows: rows.map((r) => ({ ...r, created: r.created.toISOString() })) }))
			.catch((err) => {
				log.error({ err: errorSummary(err) }, 'billing: invoices could not be read from the payment provider');
				return { ok: false as const, rows: [] };
			})
	};
}) satisfies PageServerLoad;

/** Runs a billing step: a refusal is a 409 with its reason, a provider outage a 503 that says so. */
async function step<T>(run: () => Promise<T>) {
	try {
		return { ok: true as const, value: await run() };
	} catch (err) {
		if (err instanceof BillingRefused) return { ok: false as const, failure: fail(409, { message: err.message }) };
		if (err instanceof BillingUnavailable)
			return { ok: false as const, failure: fail(503, { message: 'Payments are not set up on this server yet; nothing was charged.' }) };
		log.error({ err: errorSummary(err) }, 'billing: the payment provider refused or did not answer');
		return { ok: false as const, failure: fail(503, { message: 'The payment provider did not answer. Nothing was charged; please try again in a minute.' }) };
	}
}

/** An action that opens a checkout on the provider's page and answers with its address. */
const toCheckout = (start: (who: { id: string; email: string; name: string }, origin: string) => Promise<string>) => async (event: RequestEvent) => {
	const user = await requireApprovedContractor(event);
	const r = await step(() => start({ id: user.id, email: user.email, name: user.name }, event.url.origin));
	return r.ok ? { checkoutUrl: r.value } : r.failure;
};

/** Cancel at period end, or take that back. */
const cancelAtEnd = (cancel: boolean) => async (event: RequestEvent) => {
	const user = await requireApprovedContractor(event);
	const r = await step(() => setCancelAtPeriodEnd(user.id, cancel));
	return r.ok ? { changed: cancel ? ('cancel' as const) : ('resume' as const) } : r.failure;
};

/** Opens a lead as an extra lead on the next invoice: the contractor pressed the button that names the price. */
const openAsExtra = async (event: RequestEvent) => {
	const user = await requireApprovedContractor(event);
	const leadId = String((await event.request.formData()).get('lead') ?? '');
	if (!/^[0-9a-f-]{36}$/i.test(leadId)) error(400, 'No lead was named.');
	const access = await openLeadFor(user.id, leadId, { agreeExtra: true });
	if (access === null) error(404, 'No such lead');
	if (access !== 'open')
		return fail(409, { message: 'This lead cannot be opened as an extra lead now: your plan is not running or its payment is overdue. Nothing was charged.' });
	redirect(303, `/pro/leads/${leadId}`);
};

export const actions = {
	openExtra: openAsExtra,
	subscribe: toCheckout(startPlanCheckout),
	buyPack: toCheckout(startPackCheckout),
	updateCard: toCheckout(startCardUpdate),
	cancel: cancelAtEnd(true),
	resume: cancelAtEnd(false)
} satisfies Actions;
