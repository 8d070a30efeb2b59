import { json } from '@sveltejs/kit';
import { createPlanSchema } from '$lib/schemas/plan-record';
import { badRequest, readBody, requireApiRole } from '$lib/server/api';
import { createPlan, listPlans, PlanInputInvalid, planView, summarize } from '$lib/server/plans';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals }) => {
	const me = requireApiRole(locals, 'homeowner');
	return json({ plans: (await listPlans(me.id)).map(summarize) });
};

export const POST: RequestHandler = async ({ locals, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	const body = await readBody(request, createPlanSchema);
	if ('response' in body) return body.response;
	try {
		const created = await createPlan(me.id, body.data);
		return json({ plan: planView(created) }, { status: 201, headers: { location: `/api/plans/${created.id}` } });
	} catch (err) {
		if (err instanceof PlanInputInvalid) return badRequest(err.issues);
		throw err;
	}
};
