// First-load JavaScript budgets, read from the build this suite serves (gzip, static imports only).
// `node scripts/bundle-size.mjs` prints every page's figure.
import { expect, test } from '@playwright/test';
import { pageBundles } from '../scripts/bundle-size.mjs';

const KB = 1024;

test('the home page ships neither the engine nor its schema, and stays under 80 kB of JavaScript', async () => {
	const pages: Map<string, { bytes: number }> = await pageBundles();
	const home = pages.get('/')!.bytes;
	// Every page pays the framework and the header; home adds only its own text and the 3D opener.
	const signin = pages.get('/(auth)/signin')!.bytes;
	expect(home).toBeLessThanOrEqual(80 * KB);
	expect(home - signin).toBeLessThan(10 * KB);
});

test("the wizard's first step stays under 80 kB of JavaScript: the engine and its schema load after it", async () => {
	const pages: Map<string, { bytes: number }> = await pageBundles();
	// The engine and its zod schema load once the wizard is on screen (src/lib/planner/engine.svelte.ts);
	// the first step needs neither. Both wizard pages get the same budget.
	expect(pages.get('/plans/new')!.bytes).toBeLessThanOrEqual(80 * KB);
	expect(pages.get('/(app)/plans/[id=uuid]/edit')!.bytes).toBeLessThanOrEqual(80 * KB);
});
