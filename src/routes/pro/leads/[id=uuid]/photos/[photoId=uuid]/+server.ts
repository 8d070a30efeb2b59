import { error } from '@sveltejs/kit';
import { requireApprovedContractor } from '$lib/server/contractors';
import { leadPhotoPlan } from '$lib/server/leads';
import { photoResponse } from '$lib/server/photo-response';
import type { RequestHandler } from './$types';

/** A site photo of a lead's plan (`?size=thumb` for the small one): only for that lead's contractor. */
export const GET: RequestHandler = async (event) => {
	const user = await requireApprovedContractor(event);
	const planId = await leadPhotoPlan(user.id, event.params.id, event.params.photoId);
	if (!planId) error(404, 'Not found');
	return photoResponse(planId, event.params.photoId, event.url.searchParams.get('size') === 'thumb' ? 'thumb' : 'full');
};
