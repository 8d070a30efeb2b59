import { currentResult } from '$lib/components/plan/currentResult';
import { pacerPours } from '$lib/plan/pacer';
import { listPourRecords } from '$lib/server/pour-records';
import type { PageServerLoad } from './$types';

export const load = (async ({ parent }) => {
	// The layout found the plan among the user's own; only then are its records read.
	const { plan } = await parent();
	const result = currentResult(plan.input, plan.result);
	return {
		pours: pacerPours(result),
		units: result.units,
		records: await listPourRecords(plan.id)
	};
}) satisfies PageServerLoad;
