import { error } from '@sveltejs/kit';
import { requireApiRole } from '$lib/server/api';
import { photoResponse } from '$lib/server/photo-response';
import { findOwnPlan } from '$lib/server/plans';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals, params }) => {
	const me = requireApiRole(locals, 'homeowner');
	if (!(await findOwnPlan(params.id, me.id))) error(404, 'No such plan.');
	return photoResponse(params.id, params.photoId, 'thumb');
};
