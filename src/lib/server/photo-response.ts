import { error } from '@sveltejs/kit';
import { findPhoto } from './photos';
import { storage } from './storage';

/** The bytes of a plan's photo, for a caller already allowed to see the plan. */
export async function photoResponse(planId: string, photoId: string, variant: 'full' | 'thumb'): Promise<Response> {
	const photo = await findPhoto(planId, photoId);
	if (!photo) error(404, 'No such photo.');
	// Streamed from storage (disk or S3): a server sending many photos at once never holds them whole.
	const file = await storage().stream(variant === 'full' ? photo.storageKey : photo.thumbKey);
	if (!file) error(404, 'No such photo.');
	return new Response(file.body, {
		headers: {
			'content-type': variant === 'full' ? photo.contentType : 'image/webp',
			'content-length': String(file.size),
			// Private: these are pictures of someone's house.
			'cache-control': 'private, max-age=3600',
			'x-content-type-options': 'nosniff'
		}
	});
}
