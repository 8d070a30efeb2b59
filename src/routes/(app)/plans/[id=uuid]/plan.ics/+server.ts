import { error } from '@sveltejs/kit';
import { requireApiRole } from '$lib/server/api';
import { currentResult } from '$lib/plan-view/currentResult';
import { planCalendar } from '$lib/server/calendar';
import { findOwnPlan, planView } from '$lib/server/plans';
import type { RequestHandler } from './$types';

/** The plan's days as an iCalendar file, for its owner only (someone else's plan is not found). */
export const GET: RequestHandler = async ({ locals, params, url }) => {
	const me = requireApiRole(locals, 'homeowner');
	const found = await findOwnPlan(params.id, me.id);
	if (!found) error(404, 'No such plan.');
	const view = planView(found);
	const ics = planCalendar({ id: view.id, name: view.name, result: currentResult(view.input, view.result), url: `${url.origin}/plans/${view.id}` });
	if (!ics) error(409, 'This plan has no pour date yet: add one in the plan, then its days can go in a calendar.');
	const file =
		view.name
			.replace(/[^A-Za-z0-9 _-]/g, '')
			.trim()
			.replace(/\s+/g, '-') || 'plan';
	return new Response(ics, {
		headers: {
			'content-type': 'text/calendar; charset=utf-8',
			'content-disposition': `attachment; filename="${file}.ics"`,
			'cache-control': 'private, no-store'
		}
	});
};
