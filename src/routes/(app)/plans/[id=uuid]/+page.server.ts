import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/guards';
import { deletePhoto, listPhotos, MAX_PHOTO_BYTES } from '$lib/server/photos';
import { findOwnPlan } from '$lib/server/plans';
import type { Actions, PageServerLoad } from './$types';

export const load = (async ({ params }) => {
	const photos = (await listPhotos(params.id)).map((p) => ({ id: p.id, originalName: p.originalName, width: p.width, height: p.height }));
	return { photos, maxPhotoMb: MAX_PHOTO_BYTES / 1024 / 1024 };
}) satisfies PageServerLoad;

export const actions = {
	deletePhoto: async (event) => {
		const me = requireRole(event, 'homeowner');
		const owned = await findOwnPlan(event.params.id, me.id);
		const photoId = z.uuid().safeParse((await event.request.formData()).get('photoId'));
		if (!owned || !photoId.success) return fail(404, { message: 'No such photo.' });
		await deletePhoto(owned.id, photoId.data);
		return { removed: true };
	}
} satisfies Actions;
