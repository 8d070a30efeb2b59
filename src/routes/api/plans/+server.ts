import { json } from '@sveltejs/kit';
import { createPlanSchema } from '$lib/schemas/plan-record';
import { badRequest, readBody, requireApiRole } from '$lib/server/api';
import { createPlanOnce, KEY_MESSAGE, KEY_RULE } from '$lib/server/idempotency';
import { createPlan, listPlans, PlanInputInvalid, planView, summarize } from '$lib/server/plans';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals }) => {
	const me = requireApiRole(locals, 'homeowner');
	return json({ plans: (await listPlans(me.id)).map(summarize) });
};

export const POST: RequestHandler = async ({ locals, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	// With an Idempotency-Key, a retried create returns the first plan rather than a duplicate.
	const key = request.headers.get('idempotency-key');
	if (key !== null && !KEY_RULE.test(key)) return badRequest([{ path: 'Idempotency-Key', message: KEY_MESSAGE }]);
	const body = await readBody(request, createPlanSchema);
	if ('response' in body) return body.response;
	try {
		const { plan: created, replayed } = key ? await createPlanOnce(me.id, key, body.data) : { plan: await createPlan(me.id, body.data), replayed: false };
		return json({ plan: planView(created) }, { status: replayed ? 200 : 201, headers: { location: `/api/plans/${created.id}` } });
	} catch (err) {
		if (err instanceof PlanInputInvalid) return badRequest(err.issues);
		throw err;
	}
};
