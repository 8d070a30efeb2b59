import { error } from '@sveltejs/kit';
import { requireApprovedContractor } from '$lib/server/contractors';
import { leadPhotoPlan } from '$lib/server/leads';
import { openLeadFor } from '$lib/server/billing/accounts'; // billing
import { photoResponse } from '$lib/server/photo-response';
import type { RequestHandler } from './$types';

/** A site photo of a lead's plan (`?size=thumb` for the small one): only for that lead's contractor. */
export const GET: RequestHandler = async (event) => {
	const user = await requireApprovedContractor(event);
	const planId = await leadPhotoPlan(user.id, event.params.id, event.params.photoId);
	if (!planId) error(404, 'Not found');
	// billing: a lead's photos are part of its details, open once the lead was opened.
	if ((await openLeadFor(user.id, event.params.id)) !== 'open') error(402, 'Open the lead first: its details need a plan with leads left or a lead credit.');
	return photoResponse(planId, event.params.photoId, event.url.searchParams.get('size') === 'thumb' ? 'thumb' : 'full');
};
