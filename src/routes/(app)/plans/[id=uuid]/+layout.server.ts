import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/guards';
import { findOwnPlanHeader } from '$lib/server/plans';
import type { LayoutServerLoad } from './$types';

// Someone else's plan is "not found", not "forbidden": its existence is not revealed.
// Only the plan's name and revision: each page loads the parts it shows (the plan page its result,
// the editor its input), so no page sends the browser the input and result it does not use.
export const load = (async (event) => {
	const me = requireRole(event, 'homeowner');
	const plan = await findOwnPlanHeader(event.params.id, me.id);
	if (!plan) error(404, 'No such plan.');
	return { plan };
}) satisfies LayoutServerLoad;
