// Two app servers behind nginx on one PostgreSQL and one S3-compatible store (scripts/lib/cluster.mjs,
// what `npm run cluster` starts): whatever one server does, the other sees. nginx tells which server
// answered in X-Stakeline-Upstream, so each check makes sure both took part.
// (Migrations started by two servers at once: src/lib/server/migrate.integration.spec.ts; curing
// reminders with two workers: src/lib/server/reminders.integration.spec.ts.)
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { expect, request as playwrightRequest, test, type APIRequestContext, type APIResponse } from '@playwright/test';
import postgres from 'postgres';
import sharp from 'sharp';
import { startCluster } from '../scripts/lib/cluster.mjs';
import { killDrill } from '../scripts/lib/cluster-drill.mjs';
import { demoPassword, demoUser, openHydrated, uniqueEmail, watchErrors } from './helpers';
import { insertPlan } from './pro-helpers';

test.describe.configure({ mode: 'serial', timeout: 180_000 });

let cluster: Awaited<ReturnType<typeof startCluster>>;
let dir = '';

test.beforeAll(async () => {
	test.setTimeout(180_000);
	dir = fs.mkdtempSync(path.join(os.tmpdir(), 'stakeline-cluster-'));
	const env = Object.fromEntries(Object.entries(process.env).filter(([, v]) => v !== undefined)) as Record<string, string>;
	cluster = await startCluster({ env, dir, quiet: true });
});

test.afterAll(async () => {
	await cluster?.stop();
	fs.rmSync(dir, { recursive: true, force: true });
});

const upstream = (r: APIResponse) => r.headers()['x-stakeline-upstream'] ?? '';
const appAddresses = () => cluster.apps.map((a) => `127.0.0.1:${a.port}`);

/**
 * GETs `url` through nginx until each app server has answered once (nginx takes turns); returns the
 * answer from each, by server address.
 */
async function fromEachServer(api: APIRequestContext, url: string, headers: Record<string, string> = {}) {
	const seen = new Map<string, APIResponse>();
	for (let i = 0; i < 20 && seen.size < cluster.apps.length; i++) {
		const r = await api.get(url, { maxRedirects: 0, headers });
		if (!seen.has(upstream(r))) seen.set(upstream(r), r);
	}
	expect([...seen.keys()].sort()).toEqual(appAddresses().sort());
	return seen;
}

test('nginx spreads requests over both app servers, each healthy on the shared database', async () => {
	const api = await playwrightRequest.newContext({ baseURL: cluster.url });
	const answers = await fromEachServer(api, '/healthz');
	for (const r of answers.values()) expect(await r.json()).toMatchObject({ ok: true, database: 'up' });
	await api.dispose();
});

test('a session made on one server is valid on the other, and signing out on one ends it on both', async ({ browser }) => {
	const context = await browser.newContext({ baseURL: cluster.url });
	const page = await context.newPage();
	const errors = watchErrors(page);
	const homeowner = demoUser('homeowner');

	await openHydrated(page, '/signin');
	await page.getByLabel('E-mail').fill(homeowner.email);
	await page.getByLabel('Password').fill(demoPassword);
	const [signInAnswer] = await Promise.all([
		page.waitForResponse((r) => r.request().method() === 'POST'),
		page.getByRole('button', { name: 'Sign in' }).click()
	]);
	expect(appAddresses()).toContain(signInAnswer.headers()['x-stakeline-upstream']);
	await expect(page).toHaveURL(/\/plans$/, { timeout: 20_000 });
	const token = (await context.cookies()).find((c) => c.name === 'stakeline_session')?.value;
	expect(token).toBeTruthy();

	// Both servers know the session the sign-in made (it is a row in PostgreSQL, not process memory).
	for (const r of (await fromEachServer(context.request, '/plans')).values()) {
		expect(r.status()).toBe(200);
		expect(await r.text()).toContain(homeowner.name);
	}

	const [signOutAnswer] = await Promise.all([
		page.waitForResponse((r) => r.request().method() === 'POST'),
		page.getByRole('button', { name: 'Sign out' }).click()
	]);
	expect(appAddresses()).toContain(signOutAnswer.headers()['x-stakeline-upstream']);
	await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();

	// The old token, replayed on either server, no longer opens the account.
	const replay = await playwrightRequest.newContext({ baseURL: cluster.url });
	for (const r of (await fromEachServer(replay, '/plans', { cookie: `stakeline_session=${token}` })).values()) {
		expect(r.status()).toBe(303);
		expect(r.headers()['location']).toMatch(/^\/signin/);
	}
	await replay.dispose();
	expect(errors).toEqual([]);
	await context.close();
});

test('the sign-in throttle counts attempts on both servers together, whatever address the client claims', async () => {
	const api = await playwrightRequest.newContext({ baseURL: cluster.url });
	const email = uniqueEmail('cluster-throttle');
	const attempt = (n: number) =>
		api.post('/signin', {
			form: { email, password: `wrong-guess-${n}` },
			// A forged address in front of nginx's: the app reads only the entry nginx added.
			headers: { origin: cluster.url, 'x-sveltekit-action': 'true', 'x-forwarded-for': `198.51.100.${n}` },
			maxRedirects: 0
		});
	const servedBy: string[] = [];
	// Five wrong passwords are allowed per account and address; they are spread over both servers.
	for (let n = 1; n <= 5; n++) {
		const r = await attempt(n);
		expect(r.status(), `attempt ${n}`).toBe(200);
		expect((await r.json()).status).toBe(400);
		servedBy.push(upstream(r));
	}
	for (const address of appAddresses()) {
		const count = servedBy.filter((u) => u === address).length;
		expect(count, `attempts on ${address}`).toBeGreaterThan(0);
		expect(count).toBeLessThan(5); // neither server alone saw enough to pause
	}
	// The sixth is paused, on whichever server takes it: the count lives in PostgreSQL.
	for (let n = 6; n <= 7; n++) {
		const r = await attempt(n);
		const body = await r.json();
		expect(body.status, `attempt ${n} on ${upstream(r)}`).toBe(429);
		expect(JSON.stringify(body.data)).toContain('Too many sign-in attempts');
	}
	await api.dispose();
});

test('mail queued through both servers is sent once each, whichever worker takes it', async () => {
	const api = await playwrightRequest.newContext({ baseURL: cluster.url });
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	const emails = Array.from({ length: 8 }, (_, i) => uniqueEmail(`cluster-mail-${i}`));
	const servedBy = new Set<string>();
	// Each sign-up queues a confirmation mail in the transaction that makes the account; every app
	// server runs a job worker on the shared queue, so both compete for each mail.
	for (const [i, email] of emails.entries()) {
		const r = await api.post('/signup', {
			form: { role: 'homeowner', name: `Queue Test ${i}`, email, password: 'two-workers-one-mail', redirectTo: '' },
			headers: { origin: cluster.url, 'x-sveltekit-action': 'true', 'x-forwarded-for': `198.51.100.${100 + i}` },
			maxRedirects: 0
		});
		expect(r.status(), `sign-up ${i}`).toBe(200);
		servedBy.add(upstream(r));
	}
	expect([...servedBy].sort()).toEqual(appAddresses().sort());
	const counts = async () => {
		const rows = await sql<
			{ to: string; n: number }[]
		>`SELECT "to", count(*)::int AS n FROM dev_mail WHERE "to" IN ${sql(emails)} AND subject LIKE 'Confirm%' GROUP BY "to"`;
		return emails.map((e) => rows.find((r) => r.to === e)?.n ?? 0);
	};
	await expect.poll(counts, { timeout: 60_000 }).toEqual(emails.map(() => 1));
	// A second sender would come late, after the first: still one each a few seconds on.
	await new Promise((r) => setTimeout(r, 3_000));
	expect(await counts()).toEqual(emails.map(() => 1));
	await sql.end();
	await api.dispose();
});

test('a photo uploaded through one server is read through the other, from the shared bucket', async () => {
	const homeowner = demoUser('homeowner');
	const { id: planId } = await insertPlan(homeowner.email, { name: 'Walk to the shed', postcode: '97321' });
	const api = await playwrightRequest.newContext({ baseURL: cluster.url });
	const signIn = await api.post('/signin', {
		form: { email: homeowner.email, password: demoPassword },
		// As a form without JavaScript posts it: answered with a redirect and the session cookie.
		headers: { origin: cluster.url, accept: 'text/html' },
		maxRedirects: 0
	});
	expect(signIn.status()).toBe(303);

	const photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#a3b899' } })
		.jpeg()
		.toBuffer();
	const upload = await api.post(`/plans/${planId}/photos`, {
		multipart: { photo: { name: 'walk.jpg', mimeType: 'image/jpeg', buffer: photo } },
		headers: { origin: cluster.url }
	});
	expect(upload.status(), await upload.text()).toBe(201);
	const { photo: stored } = await upload.json();

	// The object is in the S3 store, named by its key; nothing was written to local disk.
	const objects = fs.readdirSync(path.join(dir, 's3'), { recursive: true }).map(String);
	expect(objects.some((f) => f.includes(`${stored.id}.jpg`))).toBe(true);
	expect(objects.some((f) => f.includes(`${stored.id}-thumb.webp`))).toBe(true);

	const full = await fromEachServer(api, `/plans/${planId}/photos/${stored.id}`);
	const bodies = await Promise.all([...full.values()].map((r) => r.body()));
	for (const [i, r] of [...full.values()].entries()) {
		expect(r.status()).toBe(200);
		expect(r.headers()['content-type']).toBe('image/jpeg');
		expect(Number(r.headers()['content-length'])).toBe(bodies[i].length);
		const meta = await sharp(bodies[i]).metadata();
		expect([meta.width, meta.height]).toEqual([640, 480]);
	}
	expect(bodies[0].equals(bodies[1])).toBe(true);

	for (const r of (await fromEachServer(api, `/plans/${planId}/photos/${stored.id}/thumb`)).values()) {
		expect(r.status()).toBe(200);
		expect((await sharp(await r.body()).metadata()).format).toBe('webp');
	}
	await api.dispose();
});

// Last: it kills app server b. The long run with figures is `npm run cluster:fault` (docs/deploy.md).
test('one app server killed under load: nginx moves to the survivor and no acknowledged write is lost', async () => {
	const { figures, problems } = await killDrill({
		cluster,
		databaseUrl: process.env.DATABASE_URL!,
		durationS: 8,
		killAfterS: 3,
		connections: 4
	});
	expect(problems, JSON.stringify(figures)).toEqual([]);
	expect(figures.writesAcknowledged).toBeGreaterThan(0);
	expect(figures.acknowledgedStored).toBe(figures.writesAcknowledged);
	expect(figures.answeredBySurvivorAfterKill).toBeGreaterThan(0);
	expect(cluster.apps[cluster.apps.length - 1].child.signalCode).toBe('SIGKILL');
});
