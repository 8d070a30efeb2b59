import { error } from '@sveltejs/kit';
import { parsePlanInput } from '$lib/plan';
import type { PageServerLoad } from './$types';

// A stored input the engine no longer accepts is shown as an error, never replaced by a starter
// shape that the next autosave would write over the plan.
export const load = (async ({ parent }) => {
	const { plan } = await parent();
	const parsed = parsePlanInput(plan.input);
	if (!parsed.ok) error(422, `This plan cannot be edited in the planner: ${parsed.errors[0].path} ${parsed.errors[0].message}`);
}) satisfies PageServerLoad;
