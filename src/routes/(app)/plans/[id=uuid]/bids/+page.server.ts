import { error } from '@sveltejs/kit';
import { MAX_CONTRACTORS_PER_SEND } from '$lib/leads';
import { planFigures } from '$lib/plan-figures';
import { serviceKinds, type ServiceKind } from '$lib/schemas/contractor';
import { acceptSchema, getBidsSchema } from '$lib/schemas/leads';
import { formError, parseForm, validateForm } from '$lib/server/forms';
import { requireRole } from '$lib/server/guards';
import { readerLocale } from '$lib/components/plan/format';
import { announceRevision, closeRequest, completeJob, expireLeadsNow, jobContactOf, LeadRefused, leadsForPlan, sendLeads } from '$lib/server/leads';
import { acceptBid, reopenBidding } from '$lib/server/bids';
import { findOwnPlan } from '$lib/server/plans';
import { matchContractors, placeOf } from '$lib/server/matching';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

/** The signed-in homeowner's own plan, or a 404 that says nothing about other people's plans. */
async function ownPlan(event: RequestEvent | Parameters<PageServerLoad>[0]) {
	const user = requireRole(event, 'homeowner');
	const p = await findOwnPlan(event.params.id, user.id); // the [id=uuid] matcher checked the id
	if (!p) error(404, 'No such plan');
	return { user, plan: p };
}

export const load = (async (event) => {
	const { plan } = await ownPlan(event);
	const s = event.url.searchParams.get('scope') ?? '';
	const scope: ServiceKind = (serviceKinds as readonly string[]).includes(s) ? (s as ServiceKind) : 'whole_job';
	const place = placeOf(plan.postcode);
	// Leads past their respond-by date expire now, not only at the next sweep.
	await expireLeadsNow({ planId: plan.id }, event.url.origin);
	const leads = await leadsForPlan(plan.id);
	const already = new Set(leads.map((l) => l.lead.contractorId));
	const matches = place ? await matchContractors(place, scope) : [];
	return {
		plan: { id: plan.id, name: plan.name, postcode: plan.postcode, revision: plan.revision, figures: planFigures(plan.input, plan.result) },
		town: place?.town ?? null,
		scope,
		matches: matches.map((m) => ({ ...m, alreadySent: already.has(m.id) })),
		leads,
		contact: await jobContactOf(plan.id),
		locale: readerLocale(event.request.headers.get('accept-language')),
		max: MAX_CONTRACTORS_PER_SEND
	};
}) satisfies PageServerLoad;

export const actions = {
	send: async (event) => {
		const { user, plan } = await ownPlan(event);
		const { data, values, failure } = validateForm(await event.request.formData(), getBidsSchema, ['contractors']);
		if (failure) return failure;
		try {
			const sent = await sendLeads(user, plan.id, data, event.url.origin);
			return { sent: sent!.created };
		} catch (err) {
			if (err instanceof LeadRefused) return formError(values, err.message, {}, 409);
			throw err;
		}
	},
	announce: async (event) => {
		const { user, plan } = await ownPlan(event);
		try {
			return { announced: (await announceRevision(user, plan.id, event.url.origin)) ?? 0 };
		} catch (err) {
			if (err instanceof LeadRefused) return formError({}, err.message, {}, 409);
			throw err;
		}
	},
	accept: async (event) => {
		const { user, plan } = await ownPlan(event);
		const { data, values, failure } = await parseForm(event.request, acceptSchema);
		if (failure) return failure;
		try {
			if (!(await acceptBid(user.id, plan.id, data.bid, event.url.origin, { siteAddress: data.siteAddress, phone: data.phone }))) error(404, 'No such bid');
		} catch (err) {
			if (err instanceof LeadRefused) return formError(values, err.message, {}, 409);
			throw err;
		}
		return { accepted: true };
	},
	reopen: async (event) => {
		const { user, plan } = await ownPlan(event);
		try {
			const out = await reopenBidding(user.id, plan.id, event.url.origin);
			if (!out) error(404, 'No such plan');
			return { reopened: out.reopened };
		} catch (err) {
			if (err instanceof LeadRefused) return formError({}, err.message, {}, 409);
			throw err;
		}
	},
	close: async (event) => {
		const { user, plan } = await ownPlan(event);
		try {
			const out = await closeRequest(user.id, plan.id, event.url.origin);
			if (!out) error(404, 'No such plan');
			return { closed: out.closed };
		} catch (err) {
			if (err instanceof LeadRefused) return formError({}, err.message, {}, 409);
			throw err;
		}
	},
	done: async (event) => {
		const { user, plan } = await ownPlan(event);
		try {
			if (!(await completeJob(user.id, plan.id, event.url.origin))) error(404, 'No such plan');
			return { done: true };
		} catch (err) {
			if (err instanceof LeadRefused) return formError({}, err.message, {}, 409);
			throw err;
		}
	}
} satisfies Actions;
