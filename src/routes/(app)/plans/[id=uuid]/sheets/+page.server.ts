import { error } from '@sveltejs/kit';
import { currentResult } from '$lib/plan-view/currentResult';
import { planSheets } from '$lib/plan-view/pageView';
import { requireRole } from '$lib/server/guards';
import { findOwnPlan } from '$lib/server/plans';
import type { PageServerLoad } from './$types';

// The plan's long parts: the layout sheet, stake marks and day plan. A page of its own without
// JavaScript (the plan page links here), and the data the plan page fetches when one is opened in
// place (the 3D view reads it too). Read per request like the plan page: nothing is kept per process.
export const load = (async (event) => {
	const me = requireRole(event, 'homeowner');
	const found = await findOwnPlan(event.params.id, me.id);
	if (!found) error(404, 'No such plan.');
	return { result: planSheets(currentResult(found.input, found.result)), locale: event.locals.reader.locale };
}) satisfies PageServerLoad;
