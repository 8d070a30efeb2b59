// In the yard, photos: a photo taken on the pour page with no signal waits on the phone (with its
// thumbnail, a count and a way to take it back), survives a reload, and reaches the plan exactly once
// when the connection returns; one the plan refuses by then is named with the reason and dropped; and
// a photo sent twice under one Idempotency-Key is stored once.
import { expect, test, type Locator, type Page, type Route } from '@playwright/test';
import postgres from 'postgres';
import sharp from 'sharp';
import { hydrated, reloadHydrated, signUp, uniqueEmail, watchErrors } from './helpers';
import { axeClean, noSidewaysScroll, rectanglePlan } from './yard-helpers';

test.describe.configure({ timeout: 240_000 });

const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
test.afterAll(() => sql.end());

/** The plan's photos as the server holds them, oldest first. */
const stored = (planId: string) =>
	sql<
		{ id: string; name: string; key: string | null }[]
	>`select id, original_name as name, client_key as key from plan_photo where plan_id = ${planId} order by created_at`;
const jpeg = (background: string) =>
	sharp({ create: { width: 320, height: 240, channels: 3, background } })
		.jpeg()
		.toBuffer();
/** A picture that has really been drawn (loaded and decoded), not only put in the page. */
const drawn = async (img: Locator) => {
	await expect(img).toBeVisible();
	await expect.poll(() => img.evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth > 0)).toBe(true);
};

async function newPlan(page: Page, name: string): Promise<string> {
	const created = await page.request.post('/api/plans', { data: { name, postcode: '97321', input: rectanglePlan(10, 8, { airTemp: 70, house: true }) } });
	expect(created.status()).toBe(201);
	return (await created.json()).plan.id;
}

test('photos taken offline on the pour page wait on the phone, survive a reload, and reach the plan once', async ({ page, context }) => {
	await page.setViewportSize({ width: 390, height: 844 });
	const errors = watchErrors(page);
	await signUp(page, { name: 'Pia Camera', email: uniqueEmail('yard-photos'), password: 'a long photo password 7' });
	const planId = await newPlan(page, 'Shed pad');

	// Online: the pour page, kept by the worker its layout registers, and controlled by it after a reload.
	await page.goto(`/plans/${planId}/pour`);
	await hydrated(page);
	await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
	await expect
		.poll(() => page.evaluate((id) => caches.open('plan-pages').then(async (c) => !!(await c.match(`/plans/${id}/pour`))), planId), { timeout: 30_000 })
		.toBe(true);
	await reloadHydrated(page);
	await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller)).toBe(true);
	await expect(page.getByText(/They join the plan’s site photos \(0 so far/)).toBeVisible();
	await expect(page.getByText('JPEG, PNG, or WebP, up to 12 MB each, 20 to a plan. Location data is removed.')).toBeVisible();

	// The signal goes. Chromium applies the offline emulation to a new document a moment late (see
	// in-the-yard.e2e.ts), so until it returns the uploads are cut here too: a reloaded page's first send
	// cannot slip through before the emulation does.
	const cut = (route: Route) => route.abort('internetdisconnected');
	await page.route(`**/plans/${planId}/photos`, cut);
	await context.setOffline(true);
	// Three photos taken; one of them the wrong one.
	await expect(page.getByTestId('offline-note')).toBeVisible();
	const input = page.getByTestId('photo-input');
	await input.setInputFiles([
		{ name: 'forms-set.jpg', mimeType: 'image/jpeg', buffer: await jpeg('#9bb88a') },
		{ name: 'thumb-over-lens.jpg', mimeType: 'image/jpeg', buffer: await jpeg('#222222') },
		{ name: 'screeded.jpg', mimeType: 'image/jpeg', buffer: await jpeg('#c8b89a') }
	]);
	const queued = page.getByTestId('queued-photo');
	const state = page.getByTestId('photo-queue-state');
	await expect(queued).toHaveCount(3);
	await expect(state).toHaveText('3 photos waiting to send. Kept on this device; they will be sent when there is a connection.');
	for (const name of ['forms-set.jpg', 'thumb-over-lens.jpg', 'screeded.jpg']) await drawn(page.getByRole('img', { name: `Waiting to send: ${name}` }));
	await expect(queued.first()).toContainText('waiting to send');
	// Taken back before it is sent; the remove button is a thumb-sized target.
	const remove = page.getByRole('button', { name: 'Remove thumb-over-lens.jpg' });
	expect((await remove.boundingBox())!.height).toBeGreaterThanOrEqual(44);
	await remove.click();
	await expect(queued).toHaveCount(2);
	await expect(state).toHaveText(/^2 photos waiting to send\./);
	// A file the server would refuse anyway is not kept, and the page says why.
	await input.setInputFiles([{ name: 'site-plan.pdf', mimeType: 'application/pdf', buffer: Buffer.from('%PDF-1.4\n%%EOF\n') }]);
	await expect(page.getByRole('alert').filter({ hasText: 'The photo must be a JPEG, a PNG, or a WebP image; “site-plan.pdf” is not.' })).toBeVisible();
	await expect(queued).toHaveCount(2);
	await axeClean(page);
	await noSidewaysScroll(page);
	// Nothing reached the server. Checked before the reload: Chromium applies the offline emulation to a
	// new document a moment late (in-the-yard.e2e.ts says more).
	expect(await stored(planId)).toEqual([]);

	// Reloaded with the signal still gone: the photos are still here, in the order taken.
	await reloadHydrated(page);
	await expect(queued).toHaveCount(2);
	await expect(queued.nth(0)).toContainText('forms-set.jpg');
	await expect(queued.nth(1)).toContainText('screeded.jpg');
	await drawn(page.getByRole('img', { name: 'Waiting to send: screeded.jpg' }));
	await page.screenshot({ path: 'test-results/screens/pour-photos-waiting.png', fullPage: true });

	// The signal returns: both are sent, in order, once each, and shown from the server.
	await page.unroute(`**/plans/${planId}/photos`, cut);
	await context.setOffline(false);
	await expect(queued).toHaveCount(0, { timeout: 30_000 });
	const sent = page.getByTestId('sent-photo');
	await expect(sent).toHaveCount(2);
	await drawn(sent.nth(0).getByRole('img', { name: 'Site photo forms-set.jpg' }));
	await drawn(sent.nth(1).getByRole('img', { name: 'Site photo screeded.jpg' }));
	await expect(page.getByText(/They join the plan’s site photos \(2 so far/)).toBeVisible();
	await expect(state).toHaveText('');
	const first = await stored(planId);
	expect(first.map((p) => p.name)).toEqual(['forms-set.jpg', 'screeded.jpg']);
	expect(first.every((p) => p.key !== null)).toBe(true);

	// A reload sends nothing again, and the plan page shows each photo once.
	await reloadHydrated(page);
	await expect(queued).toHaveCount(0);
	await page.goto(`/plans/${planId}`);
	await expect(page.getByRole('img', { name: 'Site photo forms-set.jpg' })).toHaveCount(1);
	await expect(page.getByRole('img', { name: 'Site photo screeded.jpg' })).toHaveCount(1);
	expect(await stored(planId)).toEqual(first);
	expect(errors).toEqual([]);
});

test('a waiting photo the plan no longer has room for is named with the reason and dropped; a photo sent twice under one key is stored once', async ({
	page,
	context
}) => {
	await page.setViewportSize({ width: 390, height: 844 });
	const errors = watchErrors(page);
	await signUp(page, { name: 'Ola Level', email: uniqueEmail('yard-full'), password: 'a long photo password 8' });
	const planId = await newPlan(page, 'Walk');
	await page.goto(`/plans/${planId}/pour`);
	await hydrated(page);
	await expect(page.getByText(/They join the plan’s site photos \(0 so far/)).toBeVisible();

	// Two photos wait while the signal is gone…
	await context.setOffline(true);
	await page.getByTestId('photo-input').setInputFiles([{ name: 'edge.jpg', mimeType: 'image/jpeg', buffer: await jpeg('#9bb88a') }]);
	await expect(page.getByTestId('photo-queue-state')).toHaveText('1 photo waiting to send. Kept on this device; it will be sent when there is a connection.');
	await page.getByTestId('photo-input').setInputFiles([{ name: 'broom.jpg', mimeType: 'image/jpeg', buffer: await jpeg('#c8b89a') }]);
	await expect(page.getByTestId('queued-photo')).toHaveCount(2);
	// …and meanwhile photos from another phone fill the plan to one short of its 20.
	await sql`insert into plan_photo (plan_id, storage_key, thumb_key, content_type, bytes, original_name)
		select ${planId}, 'plans/x/photos/x.jpg', 'plans/x/photos/x-thumb.webp', 'image/jpeg', 1, 'other phone ' || i from generate_series(1, 19) i`;

	await context.setOffline(false);
	const refused = page.getByTestId('refused-photo');
	await expect(refused).toContainText('“broom.jpg” was not sent: A plan holds at most 20 photos. It was taken off the list to send.', { timeout: 30_000 });
	await drawn(refused.getByRole('img', { name: 'Not sent: broom.jpg' }));
	await expect(page.getByTestId('sent-photo')).toContainText('Sent: edge.jpg');
	await expect(page.getByTestId('queued-photo')).toHaveCount(0);
	const rows = await stored(planId);
	expect(rows).toHaveLength(20);
	expect(rows.filter((r) => r.key !== null).map((r) => r.name)).toEqual(['edge.jpg']);
	// Read and put away; a reload brings neither the note nor the photo back.
	await page.getByRole('button', { name: 'Dismiss the note on broom.jpg' }).click();
	await expect(refused).toHaveCount(0);
	await reloadHydrated(page);
	await expect(page.getByTestId('photo-queue-state')).toHaveText('');
	await expect(refused).toHaveCount(0);

	// Sent again under the stored photo's key (its first answer lost): the same photo, nothing new,
	// even though the plan is full now.
	const origin = new URL(page.url()).origin;
	const post = (key: string, name = 'again.jpg') =>
		page.request.post(`/plans/${planId}/photos`, {
			headers: { origin, 'idempotency-key': key },
			multipart: { photo: { name, mimeType: 'image/jpeg', buffer: Buffer.from([]) } }
		});
	const edge = rows.find((r) => r.name === 'edge.jpg')!;
	const replay = await post(edge.key!);
	expect(replay.status()).toBe(200);
	expect((await replay.json()).photo).toMatchObject({ id: edge.id, name: 'edge.jpg' });
	expect(await stored(planId)).toEqual(rows);

	// On a plan with room: the same key twice is one photo, and both answers name it.
	const other = await newPlan(page, 'Steps');
	const photo = await jpeg('#6b8f71');
	const key = `replay-${crypto.randomUUID()}`;
	const send = () =>
		page.request.post(`/plans/${other}/photos`, {
			headers: { origin, 'idempotency-key': key },
			multipart: { photo: { name: 'step.jpg', mimeType: 'image/jpeg', buffer: photo } }
		});
	const a = await send();
	const b = await send();
	expect([a.status(), b.status()]).toEqual([201, 200]);
	expect(await b.json()).toEqual(await a.json());
	expect((await stored(other)).map((r) => [r.name, r.key])).toEqual([['step.jpg', key]]);
	// A key past the limit is refused, and the refusal names it.
	const long = await post('k'.repeat(101));
	expect(long.status()).toBe(400);
	expect(await long.json()).toEqual({ message: 'The Idempotency-Key header must be 8 to 100 letters, digits or _ . : - characters.' });
	expect(errors).toEqual([]);
});
