import { error, redirect } from '@sveltejs/kit';
import { openLeadFor } from '$lib/server/billing/accounts'; // billing
import { extraLead, price } from '$lib/billing-plans';
import { fullResult, planFigures } from '$lib/plan-figures';
import { specRows } from '$lib/plan-view/specRows';
import { defaultDistanceUnit, todayIn } from '$lib/reader';
import { bidSchemaFor, declineSchema, messageSchema } from '$lib/schemas/leads';
import { contractorDistanceUnit, requireApprovedContractor } from '$lib/server/contractors';
import { formError, parseForm } from '$lib/server/forms';
import { requireRole } from '$lib/server/guards';
import { contractorLead, declineLead, expireLeadsNow, LeadRefused, markLeadSeen } from '$lib/server/leads';
import { saveBid, withdrawBid } from '$lib/server/bids';
import { postMessage, threadOf } from '$lib/server/messages';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const user = requireRole(event, 'contractor');
	await event.parent(); // approved only
	await expireLeadsNow({ contractorId: user.id }, event.url.origin);
	const found = await contractorLead(user.id, event.params.id);
	if (!found) error(404, 'No such lead');
	// billing: opening the details uses an included lead or a credit; without either the billing page shows what the lead is
	// (and, on a running plan, offers to open it as an extra lead at its price: never charged by just following a link).
	const access = await openLeadFor(user.id, event.params.id);
	if (access === 'locked' || access === 'extra') redirect(303, `/pro/billing?lead=${event.params.id}`);
	await markLeadSeen(user.id, event.params.id);
	// Ids of the homeowner stay on the server, like their name.
	const { snapshot, homeownerId: _h, contractorId: _c, ...lead } = found.lead;
	const result = fullResult(snapshot.result);
	const [unit, messages] = await Promise.all([contractorDistanceUnit(user.id), threadOf(event.params.id)]);
	return {
		lead: { ...lead, status: lead.status === 'new' ? ('viewed' as const) : lead.status },
		// The spec sheet's rows are worked out here: the browser then needs no engine on this page.
		plan: {
			name: snapshot.name,
			specRows: specRows(snapshot.input, result),
			figures: planFigures(snapshot.input, snapshot.result),
			result,
			photoIds: snapshot.photoIds ?? []
		},
		bid: found.bid,
		homeowner: found.homeowner,
		asked: found.asked,
		// As on the leads list: the unit the contractor chose, else their language's.
		unit: unit ?? defaultDistanceUnit(event.locals.reader.locale),
		messages,
		viewerId: user.id
	};
}) satisfies PageServerLoad;

/** Runs a lead step, turning a refusal into a 409 with its message and a missing lead into a 404. */
async function step(values: Record<string, string>, run: () => Promise<boolean>, done: Record<string, true>) {
	try {
		if (!(await run())) error(404, 'No such lead');
	} catch (err) {
		if (err instanceof LeadRefused) return formError(values, err.message, {}, 409);
		throw err;
	}
	return done;
}

/** billing: bidding or writing needs the lead's details open (using an included lead or a credit when not yet). */
async function billingGate(contractorId: string, leadId: string, values: Record<string, string>) {
	const access = await openLeadFor(contractorId, leadId);
	if (access === null) error(404, 'No such lead');
	if (access === 'locked')
		return formError(values, 'Opening this lead needs a plan with leads left or a lead credit, and a paid-up account: see Billing.', {}, 402);
	if (access === 'extra')
		return formError(
			values,
			`You have used this period’s included leads: open this lead as an extra lead (${price(extraLead.cents)} on your next invoice) on the Billing page first.`,
			{},
			402
		);
	return null;
}

export const actions = {
	bid: async (event) => {
		const user = await requireApprovedContractor(event);
		const { data, values, failure } = await parseForm(
			event.request,
			bidSchemaFor(() => todayIn(event.locals.reader.timeZone))
		);
		if (failure) return failure;
		const locked = await billingGate(user.id, event.params.id, values); // billing
		if (locked) return locked;
		return step(values, () => saveBid(user.id, event.params.id, data, event.url.origin), { bidSaved: true });
	},
	withdraw: async (event) => {
		const user = await requireApprovedContractor(event);
		return step({}, () => withdrawBid(user.id, event.params.id, event.url.origin), { withdrawn: true });
	},
	decline: async (event) => {
		const user = await requireApprovedContractor(event);
		const { data, values, failure } = await parseForm(event.request, declineSchema);
		if (failure) return failure;
		return step(values, () => declineLead(user.id, event.params.id, data.reason), { declined: true });
	},
	message: async (event) => {
		const user = await requireApprovedContractor(event);
		const { data, values, failure } = await parseForm(event.request, messageSchema);
		if (failure) return failure;
		const locked = await billingGate(user.id, event.params.id, values); // billing
		if (locked) return locked;
		return step(values, () => postMessage(user, event.params.id, data.body, event.url.origin), { messageSent: true });
	}
} satisfies Actions;
