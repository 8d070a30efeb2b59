import { and, asc, count, eq } from 'drizzle-orm';
import sharp, { type OutputInfo } from 'sharp';
import { db } from '$lib/server/db';
import { plan, planPhoto, type PlanPhoto } from '$lib/server/db/schema';
import { storage } from './storage';
import { MAX_PHOTOS_PER_PLAN, uploadRules } from '$lib/upload-rules';
import { imageTypes, sniffUpload } from './uploads';

export const MAX_PHOTO_BYTES = uploadRules.photo.maxBytes;
export { MAX_PHOTOS_PER_PLAN };
/**
 * Largest image decoded: 40 megapixels (a 48 MP phone's default 24 MP photos pass). A PNG of
 * 16383 × 16383 pixels is under a megabyte on disk but 268 MP, 800 MB once decoded.
 */
export const MAX_INPUT_PIXELS = 40_000_000;
const tooMany = `A plan holds at most ${MAX_PHOTOS_PER_PLAN} photos.`;

export class PhotoRejected extends Error {}

export type StoredPhoto = { photo: PlanPhoto; replayed: boolean };

/**
 * Stores a site photo, already checked by sniffUpload: re-encoded upright without its metadata
 * (phone photos carry the GPS position of the house), plus a small thumbnail. With a `clientKey`
 * the plan holds it once: a second send (the device never saw the first answer) gets the photo
 * already stored, even when the plan has since filled up.
 */
export async function addPhoto(planId: string, bytes: Uint8Array, originalName: string, clientKey: string | null = null): Promise<StoredPhoto> {
	// The header alone gives the size: a bomb is refused before any pixel is decoded.
	const meta = await sharp(bytes)
		.metadata()
		.catch(() => null);
	if (!meta?.width || !meta.height) throw new PhotoRejected('That image could not be read; it may be damaged.');
	if (meta.width * meta.height > MAX_INPUT_PIXELS)
		throw new PhotoRejected(
			`That image is ${meta.width} × ${meta.height} pixels; the limit is ${MAX_INPUT_PIXELS / 1e6} megapixels. Please send a smaller photo.`
		);
	let image: Buffer, thumb: Buffer, info: OutputInfo;
	try {
		// Decoded once: the thumbnail is made from the small re-encoded copy, not from the upload.
		({ data: image, info } = await sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS })
			.rotate()
			.resize({ width: 2400, height: 2400, fit: 'inside', withoutEnlargement: true })
			.jpeg({ quality: 85 })
			.toBuffer({ resolveWithObject: true }));
		thumb = await sharp(image).resize({ width: 360, height: 270, fit: 'cover' }).webp({ quality: 75 }).toBuffer();
	} catch {
		throw new PhotoRejected('That image could not be read; it may be damaged.');
	}
	const id = crypto.randomUUID();
	const key = `plans/${planId}/photos/${id}`;
	await storage().put(`${key}.jpg`, image, 'image/jpeg');
	await storage().put(`${key}-thumb.webp`, thumb, 'image/webp');
	const stored = await db.transaction(async (tx): Promise<StoredPhoto | null> => {
		// The plan row is locked while counting, so parallel uploads cannot all see room for one more,
		// and two sends of one key cannot both find it missing.
		await tx.select({ id: plan.id }).from(plan).where(eq(plan.id, planId)).for('update');
		const held = clientKey ? await findPhotoByKey(planId, clientKey, tx) : undefined;
		if (held) return { photo: held, replayed: true };
		const [{ n }] = await tx.select({ n: count() }).from(planPhoto).where(eq(planPhoto.planId, planId));
		if (n >= MAX_PHOTOS_PER_PLAN) return null;
		const [inserted] = await tx
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
				originalName: originalName.slice(0, 200) || 'photo',
				clientKey
			})
			.returning();
		return { photo: inserted, replayed: false };
	});
	// Nothing stored under this upload's own files: the plan was full, or the key's photo was already there.
	if (!stored || stored.replayed) await Promise.all([storage().delete(`${key}.jpg`), storage().delete(`${key}-thumb.webp`)]);
	if (!stored) throw new PhotoRejected(tooMany);
	return stored;
}

type Conn = Parameters<Parameters<typeof db.transaction>[0]>[0] | typeof db;

/** The plan's photo sent with this Idempotency-Key, if one was. */
async function findPhotoByKey(planId: string, clientKey: string, conn: Conn = db): Promise<PlanPhoto | undefined> {
	const [row] = await conn
		.select()
		.from(planPhoto)
		.where(and(eq(planPhoto.planId, planId), eq(planPhoto.clientKey, clientKey)));
	return row;
}

/** How many site photos a plan holds. */
export async function countPhotos(planId: string): Promise<number> {
	const [{ n }] = await db.select({ n: count() }).from(planPhoto).where(eq(planPhoto.planId, planId));
	return n;
}

export function listPhotos(planId: string) {
	return db.select().from(planPhoto).where(eq(planPhoto.planId, planId)).orderBy(asc(planPhoto.createdAt));
}

export async function findPhoto(planId: string, photoId: string) {
	const [row] = await db
		.select()
		.from(planPhoto)
		.where(and(eq(planPhoto.planId, planId), eq(planPhoto.id, photoId)));
	return row;
}

export async function deletePhoto(planId: string, photoId: string) {
	const [row] = await db
		.delete(planPhoto)
		.where(and(eq(planPhoto.planId, planId), eq(planPhoto.id, photoId)))
		.returning();
	if (row) await Promise.all([storage().delete(row.storageKey), storage().delete(row.thumbKey)]);
	return row !== undefined;
}

export type PhotoUpload = ({ ok: true } & StoredPhoto) | { ok: false; status: number; message: string };

/**
 * Everything one uploaded file goes through, from the upload route and the no-JavaScript form alike.
 * A key already held answers with its photo before anything else is checked: the replay of a photo
 * the plan took is not refused because the plan is full now.
 */
export async function acceptPhotoUpload(planId: string, file: FormDataEntryValue | null, clientKey: string | null = null): Promise<PhotoUpload> {
	const held = clientKey ? await findPhotoByKey(planId, clientKey) : undefined;
	if (held) return { ok: true, photo: held, replayed: true };
	if (!(file instanceof File) || file.size === 0) return { ok: false, status: 400, message: 'Choose a photo to upload.' };
	// A quick answer when full; addPhoto checks again under a lock.
	if ((await listPhotos(planId)).length >= MAX_PHOTOS_PER_PLAN) return { ok: false, status: 400, message: tooMany };
	const checked = await sniffUpload(file, { maxBytes: MAX_PHOTO_BYTES, accept: imageTypes, what: 'photo' });
	if (!checked.ok) return { ok: false, status: 400, message: checked.message };
	try {
		return { ok: true, ...(await addPhoto(planId, checked.bytes, checked.name, clientKey)) };
	} catch (err) {
		if (err instanceof PhotoRejected) return { ok: false, status: 400, message: err.message };
		throw err;
	}
}
