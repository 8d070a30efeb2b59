import { error, json } from '@sveltejs/kit';
import { updatePlanSchema } from '$lib/schemas/plan-record';
import { badRequest, readBody, requireApiRole } from '$lib/server/api';
import { deletePlan, findOwnPlan, PlanHasLeads, PlanInputInvalid, planView, StaleRevision, updatePlan } from '$lib/server/plans';
import type { RequestHandler } from './$types';

function notFound(): never {
	error(404, 'No such plan.');
}

export const GET: RequestHandler = async ({ locals, params }) => {
	const me = requireApiRole(locals, 'homeowner');
	const found = await findOwnPlan(params.id, me.id);
	if (!found) notFound();
	return json({ plan: planView(found) });
};

export const PATCH: RequestHandler = async ({ locals, params, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	const body = await readBody(request, updatePlanSchema);
	if ('response' in body) return body.response;
	try {
		const saved = await updatePlan(params.id, me.id, body.data);
		if (!saved) notFound();
		return json({ plan: planView(saved) });
	} catch (err) {
		if (err instanceof PlanInputInvalid) return badRequest(err.issues);
		if (err instanceof StaleRevision) {
			return json({ message: err.message, current: planView(err.current) }, { status: 409 });
		}
		throw err;
	}
};

export const DELETE: RequestHandler = async ({ locals, params }) => {
	const me = requireApiRole(locals, 'homeowner');
	try {
		if (!(await deletePlan(params.id, me.id))) notFound();
	} catch (err) {
		if (err instanceof PlanHasLeads) return json({ message: err.message }, { status: 409 });
		throw err;
	}
	return new Response(null, { status: 204 });
};
