import { fail } from '@sveltejs/kit';
import { and, eq, sql } from 'drizzle-orm';
import { planFigures } from '$lib/plan-figures';
import { db } from '$lib/server/db';
import { lead } from '$lib/server/db/schema';
import { billingAccountOf, entitlement } from '$lib/server/billing/accounts';
import { BillingRefused, invoicesOf, setCancelAtPeriodEnd, startCardUpdate, startPackCheckout, startPlanCheckout } from '$lib/server/billing/checkout';
import { BillingUnavailable } from '$lib/server/billing/client';
import { requireApprovedContractor } from '$lib/server/contractors';
import { requireRole } from '$lib/server/guards';
import { errorSummary, log } from '$lib/server/log';
import type { Actions, PageServerLoad } from './$types';

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
	let teaser = null;
	if (/^[0-9a-f-]{36}$/i.test(leadId)) {
		const [l] = await db
			.select({ id: lead.id, town: lead.town, scope: lead.scope, timeframe: lead.timeframe, respondBy: lead.respondBy, input: sql<unknown>`${lead.snapshot}->'input'`, result: sql<unknown>`${lead.snapshot}->'result'` })
			.from(lead)
			.where(and(eq(lead.id, leadId), eq(lead.contractorId, user.id)));
		if (l) {
			const f = planFigures(l.input, l.result);
			teaser = { id: l.id, town: l.town, scope: l.scope, timeframe: l.timeframe, respondBy: l.respondBy, squareFeet: f.area?.squareFeet ?? null, squareMeters: f.area?.squareMeters ?? null, units: f.units };
		}
	}
	return {
		approved: contractor.status === 'approved',
		account: {
			status: account.status,
			cancelAtPeriodEnd: account.cancelAtPeriodEnd,
			periodStart: account.periodStart?.toISOString() ?? null,
			periodEnd: account.periodEnd?.toISOString() ?? null,
			leadsUsed: account.leadsUsed,
			credits: account.credits,
			hasSubscription: !!account.subscriptionId
		},
		entitlement: entitlement(account),
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
		if (err instanceof BillingUnavailable) return { ok: false as const, failure: fail(503, { message: 'Payments are not set up on this server yet; nothing was charged.' }) };
		log.error({ err: errorSummary(err) }, 'billing: the payment provider refused or did not answer');
		return { ok: false as const, failure: fail(503, { message: 'The payment provider did not answer. Nothing was charged; please try again in a minute.' }) };
	}
}

const who = (u: { id: string; email: string; name: string }) => ({ id: u.id, email: u.email, name: u.name });

export const actions = {
	subscribe: async (event) => {
		const user = await requireApprovedContractor(event);
		const r = await step(() => startPlanCheckout(who(user), event.url.origin));
		return r.ok ? { checkoutUrl: r.value } : r.failure;
	},
	buyPack: async (event) => {
		const user = await requireApprovedContractor(event);
		const r = await step(() => startPackCheckout(who(user), event.url.origin));
		return r.ok ? { checkoutUrl: r.value } : r.failure;
	},
	updateCard: async (event) => {
		const user = await requireApprovedContractor(event);
		const r = await step(() => startCardUpdate(who(user), event.url.origin));
		return r.ok ? { checkoutUrl: r.value } : r.failure;
	},
	cancel: async (event) => {
		const user = await requireApprovedContractor(event);
		const r = await step(() => setCancelAtPeriodEnd(user.id, true));
		return r.ok ? { changed: 'cancel' as const } : r.failure;
	},
	resume: async (event) => {
		const user = await requireApprovedContractor(event);
		const r = await step(() => setCancelAtPeriodEnd(user.id, false));
		return r.ok ? { changed: 'resume' as const } : r.failure;
	}
} satisfies Actions;
