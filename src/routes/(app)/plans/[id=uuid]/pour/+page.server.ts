import { error } from '@sveltejs/kit';
import { currentResult } from '$lib/plan-view/currentResult';
import { pacerPours } from '$lib/plan/pacer';
import { requireRole } from '$lib/server/guards';
import { findOwnPlan } from '$lib/server/plans';
import { countPhotos } from '$lib/server/photos';
import { listPourRecords } from '$lib/server/pour-records';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const me = requireRole(event, 'homeowner');
	// The plan and its records at once; the records are returned only when the plan is the user's own.
	const [found, records, photoCount] = await Promise.all([findOwnPlan(event.params.id, me.id), listPourRecords(event.params.id), countPhotos(event.params.id)]);
	if (!found) error(404, 'No such plan.');
	const result = currentResult(found.input, found.result);
	return { pours: pacerPours(result), units: result.units, records, photoCount };
}) satisfies PageServerLoad;
