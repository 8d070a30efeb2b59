import { and, asc, eq } from 'drizzle-orm';
import sharp, { type OutputInfo } from 'sharp';
import { db } from '$lib/server/db';
import { planPhoto, type PlanPhoto } from '$lib/server/db/schema';
import { storage } from './storage';
import { imageTypes, MB, sniffUpload } from './uploads';

export const MAX_PHOTO_BYTES = 12 * MB;
export const MAX_PHOTOS_PER_PLAN = 20;

export class PhotoRejected extends Error {}

/**
 * Stores a site photo, already checked by sniffUpload: re-encoded upright without its metadata
 * (phone photos carry the GPS position of the house), plus a small thumbnail.
 */
export async function addPhoto(planId: string, bytes: Uint8Array, originalName: string): Promise<PlanPhoto> {	let image: Buffer, thumb: Buffer, info: OutputInfo;
	try {
		({ data: image, info } = await sharp(bytes).rotate().resize({ width: 2400, height: 2400, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 85 }).toBuffer({ resolveWithObject: true }));
		thumb = await sharp(bytes).rotate().resize({ width: 360, height: 270, fit: 'cover' }).webp({ quality: 75 }).toBuffer();
	} catch {
		throw new PhotoRejected('That image could not be read; it may be damaged.');
	}
	const id = crypto.randomUUID();
	const key = `plans/${planId}/photos/${id}`;
	await storage().put(`${key}.jpg`, image, 'image/jpeg');
	await storage().put(`${key}-thumb.webp`, thumb, 'image/webp');
	const [row] = await db
		.insert(planPhoto)
		.values({
			id,
			planId,
			storageKey: `${key}.jpg`,
			thumbKey: `${key}-thumb.webp`,
			contentType: 'image/jpeg',
			bytes: image.byteLength,
			width: info.width,
			height: info.height,
			originalName: originalName.slice(0, 200) || 'photo'
		})
		.returning();
	return row;
}

export function listPhotos(planId: string) {
	return db.select().from(planPhoto).where(eq(planPhoto.planId, planId)).orderBy(asc(planPhoto.createdAt));
}

export async function findPhoto(planId: string, photoId: string) {
	const [row] = await db.select().from(planPhoto).where(and(eq(planPhoto.planId, planId), eq(planPhoto.id, photoId)));
	return row;
}

export async function deletePhoto(planId: string, photoId: string) {
	const [row] = await db.delete(planPhoto).where(and(eq(planPhoto.planId, planId), eq(planPhoto.id, photoId))).returning();
	if (row) await Promise.all([storage().delete(row.storageKey), storage().delete(row.thumbKey)]);
	return row !== undefined;
}

export type PhotoUpload = { ok: true; photo: PlanPhoto } | { ok: false; status: number; message: string };

/** Everything one uploaded file goes through, from the upload route and the no-JavaScript form alike. */
export async function acceptPhotoUpload(planId: string, file: FormDataEntryValue | null): Promise<PhotoUpload> {
	if (!(file instanceof File) || file.size === 0) return { ok: false, status: 400, message: 'Choose a photo to upload.' };
	if ((await listPhotos(planId)).length >= MAX_PHOTOS_PER_PLAN) return { ok: false, status: 400, message: `A plan holds at most ${MAX_PHOTOS_PER_PLAN} photos.` };
	const checked = await sniffUpload(file, { maxBytes: MAX_PHOTO_BYTES, accept: imageTypes, what: 'photo' });
	if (!checked.ok) return { ok: false, status: 400, message: checked.message };
	try {
		return { ok: true, photo: await addPhoto(planId, checked.bytes, checked.name) };
	} catch (err) {
		if (err instanceof PhotoRejected) return { ok: false, status: 400, message: err.message };
		throw err;
	}
}
