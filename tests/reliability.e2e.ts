// The built app under faults: the PDF drawn by the worker pool, and a short fault drill
// (PostgreSQL restarted, then stopped for 3 s) through the API.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { expect, test } from '@playwright/test';
import { demoPassword, demoUser } from './helpers';

test('the plan PDF is drawn by the worker pool of the built app', async ({ request, baseURL }) => {
	const owner = demoUser('homeowner');
	// A form post without JavaScript's headers: SvelteKit answers the redirect as JSON; the cookie is set.
	await request.post('/signin', { form: { email: owner.email, password: demoPassword }, headers: { origin: baseURL! }, maxRedirects: 0 });
	const list = await request.get('/api/plans');
	expect(list.status()).toBe(200);
	const { plans } = await list.json();
	const pdf = await request.get(`/plans/${plans[0].id}/plan.pdf`);
	expect(pdf.status()).toBe(200);
	expect(pdf.headers()['content-type']).toBe('application/pdf');
	expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
	// /healthz answered with the database's state.
	expect(await (await request.get('/healthz')).json()).toMatchObject({ ok: true, database: 'up' });
});

test('fault drill: no acknowledged write lost, 503 during the outage, serving again after', async ({ baseURL }) => {
	test.setTimeout(90_000);
	const run = await promisify(execFile)(process.execPath, ['scripts/fault.mjs', '--short', '--url', baseURL!], { env: process.env }).catch((e) => e);
	const tally = JSON.parse(/^\{[\s\S]*?^\}/m.exec(run.stdout)?.[0] ?? '{}');
	expect(run.stderr ?? '', run.stderr).not.toMatch(/✖/);
	expect(tally.acknowledged).toBeGreaterThan(0);
	expect(tally.acknowledgedStored).toBe(tally.acknowledged);
	expect(tally.duringOutage).toBeGreaterThan(0);
	expect(tally.outage503).toBe(tally.duringOutage);
	expect(tally.duplicates).toBe(0);
	expect(tally.serverErrors).toBe(0);
	expect(run.code ?? 0).toBe(0);
});
