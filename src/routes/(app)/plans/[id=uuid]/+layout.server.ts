import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/guards';
import { findOwnPlan, planView } from '$lib/server/plans';
import type { LayoutServerLoad } from './$types';

// Someone else's plan is "not found", not "forbidden": its existence is not revealed.
export const load = (async (event) => {
	const me = requireRole(event, 'homeowner');
	const found = await findOwnPlan(event.params.id, me.id);
	if (!found) error(404, 'No such plan.');
	// loadedAt: when this copy was made, for the "offline, as of" note when a kept copy is shown.
	return { plan: planView(found), loadedAt: Date.now() };
}) satisfies LayoutServerLoad;
