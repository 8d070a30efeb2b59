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

test('the wizard carries the engine once and stays within its current ceiling', async () => {
	const pages: Map<string, { bytes: number }> = await pageBundles();
	// The goal is 80 kB (the engine and its zod schema run in the browser for instant results; see
	// docs/performance.md); this ceiling catches growth until then.
	expect(pages.get('/plans/new')!.bytes).toBeLessThanOrEqual(135 * KB);
});
