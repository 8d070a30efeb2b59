import { error } from '@sveltejs/kit';
import { requireApiRole } from '$lib/server/api';
import { planAsLogged } from '$lib/plan/reminders';
import { planCalendar } from '$lib/server/calendar';
import { findOwnPlan, planView } from '$lib/server/plans';
import { listPourRecords } from '$lib/server/pour-records';
import type { RequestHandler } from './$types';

/**
 * The plan's days as an iCalendar file, for its owner only (someone else's plan is not found), dated
 * from the first pour as logged once the crew started one, else as planned: the reminders' date.
 */
export const GET: RequestHandler = async ({ locals, params, url }) => {
	const me = requireApiRole(locals, 'homeowner');
	const found = await findOwnPlan(params.id, me.id);
	if (!found) error(404, 'No such plan.');
	const view = planView(found);
	const dated = planAsLogged(view.input, await listPourRecords(view.id));
	if (!dated) error(409, 'This plan cannot be worked out as saved: open it in the editor and save it again.');
	const ics = planCalendar({ id: view.id, name: view.name, dated, url: `${url.origin}/plans/${view.id}`, locale: locals.reader.locale });
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
