import { error } from '@sveltejs/kit';
import { fileTypeFromBuffer } from 'file-type';
import { requireApprovedContractor } from '$lib/server/contractors';
import { leadPhotoFor } from '$lib/server/leads';
import { storage } from '$lib/server/storage';
import type { RequestHandler } from './$types';

/** A site photo of a lead's plan (`?size=thumb` for the small one): only for that lead's contractor. */
export const GET: RequestHandler = async (event) => {
	const user = await requireApprovedContractor(event);
	const photo = await leadPhotoFor(user.id, event.params.id, event.params.photoId);
	if (!photo) error(404, 'Not found');
	const thumb = event.url.searchParams.get('size') === 'thumb';
	const bytes = await storage().get(thumb ? photo.thumbKey : photo.storageKey);
	if (!bytes) error(404, 'Not found');
	return new Response(bytes as Uint8Array<ArrayBuffer>, {
		headers: {
			// The thumbnail's format is the planner's choice: read it from the bytes.
			'Content-Type': thumb ? ((await fileTypeFromBuffer(bytes))?.mime ?? 'application/octet-stream') : photo.contentType,
			'Content-Length': String(bytes.byteLength),
			'Cache-Control': 'private, max-age=3600'
		}
	});
};
