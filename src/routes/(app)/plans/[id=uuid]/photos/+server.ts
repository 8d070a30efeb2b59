import { error, json } from '@sveltejs/kit';
import { requireApiRole } from '$lib/server/api';
import { addPhoto, listPhotos, MAX_PHOTO_BYTES, MAX_PHOTOS_PER_PLAN, PhotoRejected } from '$lib/server/photos';
import { imageTypes, sniffUpload } from '$lib/server/uploads';
import { findOwnPlan } from '$lib/server/plans';
import type { RequestHandler } from './$types';

/** One photo per request, so the browser can show progress per file. */
export const POST: RequestHandler = async ({ locals, params, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	const owned = await findOwnPlan(params.id, me.id);
	if (!owned) error(404, 'No such plan.');
	const declared = Number(request.headers.get('content-length') ?? 0);
	if (declared > MAX_PHOTO_BYTES + 64 * 1024) return json({ message: `Photos can be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB.` }, { status: 413 });
	if ((await listPhotos(owned.id)).length >= MAX_PHOTOS_PER_PLAN) return json({ message: `A plan holds at most ${MAX_PHOTOS_PER_PLAN} photos.` }, { status: 400 });
	let file: FormDataEntryValue | null;
	try {
		file = (await request.formData()).get('photo');
	} catch {
		return json({ message: 'Send the photo as multipart form data.' }, { status: 400 });
	}
	if (!(file instanceof File)) return json({ message: 'Choose a photo to upload.' }, { status: 400 });
	const checked = await sniffUpload(file, { maxBytes: MAX_PHOTO_BYTES, accept: imageTypes, what: 'photo' });
	if (!checked.ok) return json({ message: checked.message }, { status: 400 });
	try {
		const photo = await addPhoto(owned.id, checked.bytes, checked.name);
		return json({ photo: { id: photo.id, name: photo.originalName, width: photo.width, height: photo.height } }, { status: 201 });
	} catch (err) {
		if (err instanceof PhotoRejected) return json({ message: err.message }, { status: 400 });
		throw err;
	}
};
