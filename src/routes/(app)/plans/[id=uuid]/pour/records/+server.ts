import { error, json } from '@sveltejs/kit';
import { futureTemp, pourRecordsBody } from '$lib/plan/pour-log';
import { badRequest, readBody, requireApiRole } from '$lib/server/api';
import { findOwnPlan } from '$lib/server/plans';
import { savePourRecords } from '$lib/server/pour-records';
import type { RequestHandler } from './$types';

/**
 * The pour page's records, queued on the device and sent here when there is a connection. Each
 * record carries its own key; one already held is not stored again, and every key sent comes back
 * in `keys`, so the device can drop it from its queue.
 */
export const POST: RequestHandler = async ({ locals, params, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	const owned = await findOwnPlan(params.id, me.id);
	if (!owned) error(404, 'No such plan.');
	const body = await readBody(request, pourRecordsBody);
	if ('response' in body) return body.response;
	// The schema checks a temperature's date against the device's clock; this against the server's.
	const future = futureTemp(body.data.records);
	if (future) return badRequest([future]);
	const saved = await savePourRecords(owned.id, body.data.records);
	if (!saved.ok) return json({ errors: [{ path: 'records', message: saved.message }] }, { status: saved.status });
	return json({ stored: saved.stored, keys: saved.keys });
};
