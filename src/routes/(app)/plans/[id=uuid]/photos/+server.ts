import { error, json } from '@sveltejs/kit';
import { requireApiRole } from '$lib/server/api';
import { KEY_MESSAGE, KEY_RULE } from '$lib/server/idempotency';
import { acceptPhotoUpload, MAX_PHOTO_BYTES } from '$lib/server/photos';
import { findOwnPlan } from '$lib/server/plans';
import type { RequestHandler } from './$types';

/**
 * One photo per request, so the browser can show progress per file. With an Idempotency-Key (the
 * pour page's offline queue sends one per photo) a photo sent again is stored once and answered as
 * the first time, with 200 instead of 201.
 */
export const POST: RequestHandler = async ({ locals, params, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	const owned = await findOwnPlan(params.id, me.id);
	if (!owned) error(404, 'No such plan.');
	const key = request.headers.get('idempotency-key');
	if (key !== null && !KEY_RULE.test(key)) return json({ message: KEY_MESSAGE }, { status: 400 });
	const declared = Number(request.headers.get('content-length') ?? 0);
	if (declared > MAX_PHOTO_BYTES + 64 * 1024) return json({ message: `Photos can be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB.` }, { status: 413 });
	let file: FormDataEntryValue | null;
	try {
		file = (await request.formData()).get('photo');
	} catch {
		return json({ message: 'Send the photo as multipart form data.' }, { status: 400 });
	}
	const up = await acceptPhotoUpload(owned.id, file, key);
	if (!up.ok) return json({ message: up.message }, { status: up.status });
	return json({ photo: { id: up.photo.id, name: up.photo.originalName, width: up.photo.width, height: up.photo.height } }, { status: up.replayed ? 200 : 201 });
};
