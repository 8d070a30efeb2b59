import { error } from '@sveltejs/kit';
import { parsePlanInput } from '$lib/plan';
import { requireRole } from '$lib/server/guards';
import { findOwnPlan, planView } from '$lib/server/plans';
import type { PageServerLoad } from './$types';

// A stored input the engine no longer accepts is shown as an error, never replaced by a starter
// shape that the next autosave would write over the plan.
export const load = (async (event) => {
	const me = requireRole(event, 'homeowner');
	const found = await findOwnPlan(event.params.id, me.id);
	if (!found) error(404, 'No such plan.');
	const parsed = parsePlanInput(found.input);
	if (!parsed.ok) error(422, `This plan cannot be edited in the planner: ${parsed.errors[0].path} ${parsed.errors[0].message}`);
	// Sent completed (every default filled in), so the wizard shows before the engine has loaded.
	return { plan: { ...planView(found), input: parsed.plan } };
}) satisfies PageServerLoad;
