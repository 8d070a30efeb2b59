// The photo store's Idempotency-Key, against the real test database and the upload route: a photo sent
// twice (its first answer lost) is stored once and answered alike; the same key on another plan, or
// from another homeowner, is a different photo and never returns someone else's.
import fs from 'node:fs/promises';
import path from 'node:path';
import type { RequestEvent } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { rect } from '$lib/plan/test-plans';
import { POST } from '../../routes/(app)/plans/[id=uuid]/photos/+server';
import { db } from './db';
import { planPhoto } from './db/schema';
import { uniqueEmail, useTestDatabase } from './integration-setup';
import { acceptPhotoUpload, addPhoto, MAX_PHOTOS_PER_PLAN } from './photos';
import type { SessionUser } from './auth';
import { createPlan } from './plans';
import { createUser } from './users';

useTestDatabase();

/** A 12 × 10 ft pad. */
const input = { units: 'imperial', sections: [{ outline: rect(0, 0, 12, 10) }] } as const;

// The route reads only the user's id and role.
const homeowner = async () =>
	(await createUser({
		name: 'Ida Yard',
		email: uniqueEmail('photo-key'),
		password: 'photo-key-password-1',
		role: 'homeowner',
		verified: true
	})) as unknown as SessionUser;
const planOf = (owner: SessionUser) => createPlan(owner.id, { name: 'Yard pad', input });
const jpeg = (colour = '#9bb88a') =>
	sharp({ create: { width: 64, height: 48, channels: 3, background: colour } })
		.jpeg()
		.toBuffer();
const file = async (name = 'pour.jpg', colour?: string) => new File([new Uint8Array(await jpeg(colour))], name, { type: 'image/jpeg' });

const rows = (planId: string) => db.select().from(planPhoto).where(eq(planPhoto.planId, planId));
/** Files the plan's photos left in storage (the test server keeps them on disk under UPLOAD_DIR). */
const files = (planId: string) =>
	fs.readdir(path.resolve(process.env.UPLOAD_DIR || '.data/uploads', 'plans', planId, 'photos')).then(
		(f) => f.sort(),
		() => []
	);

/** The upload route as the browser calls it: the signed-in user, the plan in the path, the photo and the key. */
async function post(user: SessionUser, planId: string, photo: File, key?: string): Promise<{ status: number; body: Record<string, unknown> }> {
	const body = new FormData();
	body.append('photo', photo);
	const request = new Request(`http://127.0.0.1:3100/plans/${planId}/photos`, {
		method: 'POST',
		body,
		headers: key === undefined ? {} : { 'idempotency-key': key }
	});
	try {
		const res = await POST({ request, params: { id: planId }, locals: { user, session: null } } as unknown as Parameters<typeof POST>[0] & RequestEvent);
		return { status: res.status, body: await res.json() };
	} catch (err) {
		// error(404, …) is thrown as an HttpError.
		const e = err as { status?: number; body?: { message?: string } };
		if (typeof e.status !== 'number') throw err;
		return { status: e.status, body: e.body ?? {} };
	}
}

describe('a photo sent with an Idempotency-Key', () => {
	it('is stored once when sent twice, and the second answer names the same photo', async () => {
		const owner = await homeowner();
		const p = await planOf(owner);
		const key = crypto.randomUUID();
		const first = await post(owner, p.id, await file('screeded.jpg'), key);
		const again = await post(owner, p.id, await file('screeded.jpg'), key);
		expect(first.status).toBe(201);
		expect(again.status).toBe(200);
		expect(again.body).toEqual(first.body);
		expect((first.body.photo as { name: string }).name).toBe('screeded.jpg');
		const held = await rows(p.id);
		expect(held.map((r) => [r.id, r.clientKey])).toEqual([[(first.body.photo as { id: string }).id, key]]);
		// The replay's own re-encoded files were removed: only the stored photo's two remain.
		expect(await files(p.id)).toEqual([`${held[0].id}-thumb.webp`, `${held[0].id}.jpg`].sort());
	});

	it('is stored once when both sends arrive together', async () => {
		const owner = await homeowner();
		const p = await planOf(owner);
		const key = `yard-${crypto.randomUUID()}`;
		const answers = await Promise.all([1, 2, 3].map(async () => acceptPhotoUpload(p.id, await file(), key)));
		const ids = answers.map((a) => (a.ok ? a.photo.id : a.message));
		expect(new Set(ids).size).toBe(1);
		expect(answers.filter((a) => a.ok && !a.replayed)).toHaveLength(1);
		expect(await rows(p.id)).toHaveLength(1);
		expect(await files(p.id)).toHaveLength(2);
	});

	it('is answered as stored even when the plan has filled up since', async () => {
		const owner = await homeowner();
		const p = await planOf(owner);
		const key = crypto.randomUUID();
		const first = await post(owner, p.id, await file(), key);
		expect(first.status).toBe(201);
		const small = await jpeg('#6b8f71');
		for (let i = 1; i < MAX_PHOTOS_PER_PLAN; i++) await addPhoto(p.id, small, `site-${i}.jpg`);
		const replay = await post(owner, p.id, await file(), key);
		expect(replay).toEqual({ status: 200, body: first.body });
		// A new key is refused with the limit named.
		const more = await post(owner, p.id, await file('one-too-many.jpg'), crypto.randomUUID());
		expect(more).toEqual({ status: 400, body: { message: `A plan holds at most ${MAX_PHOTOS_PER_PLAN} photos.` } });
		expect(await rows(p.id)).toHaveLength(MAX_PHOTOS_PER_PLAN);
	});

	it('is a new photo on another plan of the same homeowner', async () => {
		const owner = await homeowner();
		const [a, b] = [await planOf(owner), await planOf(owner)];
		const key = crypto.randomUUID();
		const onA = await post(owner, a.id, await file('a.jpg'), key);
		const onB = await post(owner, b.id, await file('b.jpg'), key);
		expect([onA.status, onB.status]).toEqual([201, 201]);
		expect(onB.body.photo).not.toEqual(onA.body.photo);
		expect((await rows(a.id)).map((r) => r.originalName)).toEqual(['a.jpg']);
		expect((await rows(b.id)).map((r) => r.originalName)).toEqual(['b.jpg']);
	});

	it('never reaches another homeowner’s photo: their plan is not found, and their key is theirs alone', async () => {
		const [owner, other] = [await homeowner(), await homeowner()];
		const [mine, theirs] = [await planOf(owner), await planOf(other)];
		const key = crypto.randomUUID();
		const stored = await post(owner, mine.id, await file('mine.jpg'), key);
		expect(stored.status).toBe(201);
		// The same key against the owner's plan, sent by someone else: no such plan, nothing returned or stored.
		expect(await post(other, mine.id, await file('theirs.jpg'), key)).toEqual({ status: 404, body: { message: 'No such plan.' } });
		// The same key on their own plan stores their own photo.
		const own = await post(other, theirs.id, await file('theirs.jpg'), key);
		expect(own.status).toBe(201);
		expect((own.body.photo as { name: string }).name).toBe('theirs.jpg');
		expect((await rows(mine.id)).map((r) => r.originalName)).toEqual(['mine.jpg']);
		expect((await rows(theirs.id)).map((r) => r.originalName)).toEqual(['theirs.jpg']);
	});

	it('must be 8 to 100 plain characters, and the refusal names the limit', async () => {
		const owner = await homeowner();
		const p = await planOf(owner);
		for (const bad of ['short', 'k'.repeat(101), 'has space in it', 'key/with/slash'])
			expect(await post(owner, p.id, await file(), bad)).toEqual({
				status: 400,
				body: { message: 'The Idempotency-Key header must be 8 to 100 letters, digits or _ . : - characters.' }
			});
		expect(await rows(p.id)).toHaveLength(0);
		// Without a key every send is a new photo, as before.
		await post(owner, p.id, await file());
		await post(owner, p.id, await file());
		expect((await rows(p.id)).map((r) => r.clientKey)).toEqual([null, null]);
	});
});
