import fs from 'node:fs/promises';
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { computePlan } from '../src/lib/plan/index';
import { formatVolume } from '../src/lib/plan/format';
import {
	demoPassword,
	demoUser,
	mailLink,
	openHydrated,
	savedPlanId,
	sessionFile,
	signIn,
	signOut,
	signUp,
	uniqueEmail,
	watchErrors,
	wizardStep
} from './helpers';
import { pdfText } from './pdf-text';

const fmt = (v: number, digits = 1) => v.toLocaleString('en', { maximumFractionDigits: digits });
// The L the test draws: 16 × 12 ft with a 6 × 5 ft notch (the wizard's own L preset).
const L: [number, number][] = [
	[0, 0],
	[16, 0],
	[16, 7],
	[10, 7],
	[10, 12],
	[0, 12]
];
const expected = computePlan({ units: 'imperial', name: 'My slab', sections: [{ outline: L }], reference: { label: 'door sill', below: 1 } });

async function seriousViolations(page: Page) {
	const { violations } = await new AxeBuilder({ page }).analyze();
	return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes[0]?.target}`);
}

async function nextStep(page: Page, shot: string) {
	await page.screenshot({ path: `test-results/screens/wizard-${shot}.png`, fullPage: true });
	await page.getByRole('button', { name: /^Next:/ }).click();
}

test('a homeowner builds an L-shaped plan; results match the engine, survive a reload, and the plan page, 3D, photos and PDF work', async ({
	page,
	request
}) => {
	test.setTimeout(240_000); // sign-up waits on the confirmation mail; 3D turns on a loaded machine
	await signUp(page, { name: 'Hazel Brook', email: uniqueEmail('planner'), password: 'l-shaped-patio' });
	await page.getByRole('link', { name: 'Start a new plan' }).click();
	await expect(page.getByRole('heading', { name: '1. Site' })).toBeVisible();
	expect(await seriousViolations(page)).toEqual([]);

	await page.getByLabel('Plan name').fill('Corner patio');
	await page.getByLabel('Postal code').fill('97361');
	await nextStep(page, '1-site');

	await page.getByLabel('L-shape (notched corner)').check();
	await page.getByLabel('Length (A–B)').fill('16');
	await page.getByLabel('Width (B–C side)').fill('12');
	await page.getByLabel('Notch length (C–D)').fill('6');
	await page.getByLabel('Notch width (D–E)').fill('5');
	await page.getByRole('button', { name: 'Use this L-shape' }).click();
	// Keyboard: nudge a corner right and back; the outline ends where it started.
	const corner = page.getByRole('button', { name: /Section 1, corner B,/ });
	await corner.focus();
	await page.keyboard.press('ArrowRight');
	await expect(page.getByRole('button', { name: 'Section 1, corner B, at 16.5 by 0 ft' })).toBeVisible();
	await page.keyboard.press('ArrowLeft');
	await expect(page.getByTestId('result-area')).toHaveText(`${fmt(expected.area.squareFeet)} ft²`); // 16×12 − 6×5 = 162 ft²
	await nextStep(page, '2-outline');
	await nextStep(page, '3-pitch');
	await nextStep(page, '4-build-up');
	await nextStep(page, '5-crew');
	await expect(page.getByRole('heading', { name: '6. Review' })).toBeVisible();
	await page.screenshot({ path: 'test-results/screens/wizard-6-review.png', fullPage: true });

	const planned = expected.bags.find((b) => b.planned)!;
	await expect(page.getByTestId('result-volume')).toHaveText(`${fmt(expected.volume.order.cubicYards, 2)} yd³`);
	await expect(page.getByTestId('result-bags')).toHaveText(String(planned.count));
	const id = await savedPlanId(page);

	// The server stored its own computation of the same input.
	const api = await (await page.request.get(`/api/plans/${id}`)).json();
	expect(api.plan.name).toBe('Corner patio');
	expect(api.plan.result.area.squareFeet).toBeCloseTo(expected.area.squareFeet, 9);
	expect(api.plan.result.bags.map((b: { count: number }) => b.count)).toEqual(expected.bags.map((b) => b.count));

	await page.reload();
	await expect(page.getByTestId('plan-name')).toHaveText('Corner patio');
	await expect(page.getByTestId('result-area')).toHaveText(`${fmt(expected.area.squareFeet)} ft²`);
	expect(await seriousViolations(page)).toEqual([]);

	await page.getByRole('link', { name: 'See the full plan' }).click();
	await expect(page.getByTestId('plan-title')).toHaveText('Corner patio');
	await page.getByRole('button', { name: 'Show the stake marks' }).click();
	await expect(page.getByRole('table', { name: /stake/i })).toBeVisible();
	expect(await seriousViolations(page)).toEqual([]);

	// 3D preview: loaded on demand, draws something that is not one flat colour.
	await page.getByRole('button', { name: 'Show 3D preview' }).click();
	const canvas = page.getByTestId('preview-canvas');
	await expect(canvas).toBeVisible({ timeout: 20_000 });
	await expect(canvas).toHaveAttribute('data-ready', '');
	const shot = await canvas.screenshot({ path: 'test-results/screens/plan-3d.png' });
	const { channels } = await sharp(shot).stats();
	expect(Math.max(...channels.map((c) => c.stdev))).toBeGreaterThan(10);
	// No label covers another on screen, at the opening view and after turning by the keyboard.
	const labelsClear = () =>
		page.getByTestId('scene-label').evaluateAll((els) => {
			const rs = els.map((e) => e.getBoundingClientRect());
			return rs.every((a, i) => rs.slice(i + 1).every((b) => a.right <= b.left || b.right <= a.left || a.bottom <= b.top || b.bottom <= a.top));
		});
	await expect(page.getByTestId('scene-label').first()).toBeVisible();
	await expect.poll(labelsClear).toBe(true);
	// The view turns and zooms from the keyboard (the pointer is not the only way).
	await page.getByRole('button', { name: 'Turn left' }).focus();
	await page.keyboard.press('Enter');
	await expect.poll(async () => (await canvas.screenshot()).equals(shot)).toBe(false);
	await expect.poll(labelsClear).toBe(true);
	const turned = await canvas.screenshot();
	await page.getByRole('button', { name: 'Closer' }).focus();
	await page.keyboard.press('Enter');
	await expect.poll(async () => (await canvas.screenshot()).equals(turned)).toBe(false);

	// Photos: a real image goes in with progress; a text file named .jpg is refused.
	const png = await sharp({ create: { width: 80, height: 60, channels: 3, background: '#7a9a5a' } })
		.png()
		.toBuffer();
	await page.getByTestId('photo-input').setInputFiles([
		{ name: 'lawn.png', mimeType: 'image/png', buffer: png },
		{ name: 'not-a-photo.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('just some text, not an image') }
	]);
	await expect(page.getByTestId('upload').filter({ hasText: 'lawn.png' })).toHaveAttribute('data-state', 'done');
	await expect(page.getByTestId('upload').filter({ hasText: 'not-a-photo.jpg' })).toContainText('The photo must be a JPEG, a PNG, or a WebP image');
	await expect(page.getByTestId('photo')).toHaveCount(1);
	const thumb = await page.getByTestId('photo').locator('img').getAttribute('src');
	const thumbRes = await page.request.get(thumb!);
	expect(thumbRes.headers()['content-type']).toBe('image/webp');
	await page.screenshot({ path: 'test-results/screens/plan-page.png', fullPage: true });

	// The PDF carries the same volume and bag count as the page.
	const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('pdf-link').click()]);
	const bytes = await fs.readFile((await download.path())!);
	expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
	const text = (await pdfText(bytes)).replace(/\s+/g, ' ');
	expect(text).toContain(formatVolume(expected.volume.order, 'imperial'));
	expect(text).toContain(`${planned.count} bags`);

	// Another homeowner sees none of it.
	await signOut(page);
	await signIn(page, demoUser('homeowner').email, demoPassword);
	await expect(page).toHaveURL(/\/plans$/);
	expect((await page.goto(`/plans/${id}`))?.status()).toBe(404);
	expect((await page.goto(`/plans/${id}/edit`))?.status()).toBe(404);
	expect((await page.request.get(`/api/plans/${id}`)).status()).toBe(404);
	expect((await page.request.patch(`/api/plans/${id}`, { data: { revision: 1, name: 'Mine now' } })).status()).toBe(404);
	expect((await page.request.delete(`/api/plans/${id}`)).status()).toBe(404);
	expect((await page.request.get(thumb!)).status()).toBe(404);
	expect((await page.request.get(`/plans/${id}/plan.pdf`)).status()).toBe(404);
	expect((await request.get('/api/plans')).status()).toBe(401); // signed out
});

test('a new homeowner who keeps the starter plan as it is can save it from the review step and open it', async ({ page }) => {
	test.setTimeout(120_000);
	await signUp(page, { name: 'Nell Starter', email: uniqueEmail('starter'), password: 'starter plan kept as is' });
	await openHydrated(page, '/plans/new');
	// Nothing edited, so nothing saved yet: the review step offers the save instead of a dead end.
	await page
		.getByRole('navigation', { name: 'Plan steps' })
		.getByRole('button', { name: /Review/ })
		.click();
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'idle');
	await page.getByRole('button', { name: 'Save this plan' }).click();
	const id = await savedPlanId(page);
	await page.getByRole('link', { name: 'Open the full plan' }).click();
	await expect(page).toHaveURL(new RegExp(`/plans/${id}$`));
	await expect(page.getByTestId('plan-title')).toHaveText('My slab');
});

test('a signed-out visitor’s draft is kept through sign-up and lands in the new account', async ({ page }) => {
	test.setTimeout(120_000);
	await openHydrated(page, '/');
	expect(await seriousViolations(page)).toEqual([]);
	await page.getByRole('link', { name: 'Start a plan' }).click();
	await expect(page.getByTestId('local-banner')).toBeVisible();
	await page.getByLabel('Plan name').fill('Shed pad draft');
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'local');
	await page.getByRole('link', { name: 'Create an account' }).click();
	await page.getByLabel('Your name').fill('Nell Quarry');
	const email = uniqueEmail('draft');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password', { exact: true }).fill('draft-kept-safe');
	await page.getByRole('button', { name: 'Create account' }).click();
	// Confirm-first: the e-mailed link signs the new account in and returns to the planner.
	await expect(page.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();
	await openHydrated(page, await mailLink(page, email, /Confirm your e-mail/, { timeout: 60_000 }));
	await page.getByRole('button', { name: 'Confirm my e-mail' }).click();
	await expect(page.getByText('The plan you started before signing in is now saved to your account.')).toBeVisible();
	await expect(page).toHaveURL(/\/plans\/[0-9a-f-]{36}\/edit$/);
	await page.goto('/plans');
	await expect(page.getByTestId('plan-item')).toHaveCount(1);
	await expect(page.getByTestId('plan-item')).toContainText('Shed pad draft');
});

test('a draft started signed out is offered on My plans after a sign-up from the header', async ({ page }) => {
	test.setTimeout(120_000);
	const errors: string[] = [];
	page.on('pageerror', (e) => errors.push(e.message));
	await openHydrated(page, '/plans/new');
	await page.getByLabel('Plan name').fill('Side path draft');
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'local');
	// The header's "Create account" carries no way back to the planner: the account opens on My plans.
	await signUp(page, { name: 'Otto Header', email: uniqueEmail('header'), password: 'header-sign-up' });
	await page.goto('/plans');
	const offer = page.getByTestId('browser-draft');
	await expect(offer).toContainText('Side path draft');
	await offer.getByRole('link', { name: 'Save it to my plans' }).click();
	await expect(page.getByText('The plan you started before signing in is now saved to your account.')).toBeVisible();
	await expect(page).toHaveURL(/\/plans\/[0-9a-f-]{36}\/edit$/);
	await page.goto('/plans');
	await expect(page.getByTestId('plan-item')).toContainText('Side path draft');
	// Saved, it is no longer offered.
	await expect(page.getByTestId('browser-draft')).toHaveCount(0);
	expect(errors).toEqual([]);
});

test('a draft left with a marked field is carried into the account unsaved, says so, and saves once fixed', async ({ page }) => {
	test.setTimeout(120_000);
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await page.getByLabel('Plan name').fill('Steep step draft');
	await wizardStep(page, 'Build-up');
	await page.locator('#thickness').fill('40'); // past the 2–12 in the engine takes
	await page.locator('#thickness').blur();
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'local');
	// On another step, the results say where the marked field is.
	await wizardStep(page, 'Crew');
	await expect(page.getByTestId('results')).toContainText('Fix the marked field in the Build-up step to see the numbers.');
	await signUp(page, { name: 'Lale Marked', email: uniqueEmail('marked'), password: 'marked-field-kept' });
	await page.goto('/plans');
	await page.getByTestId('browser-draft').getByRole('link', { name: 'Save it to my plans' }).click();
	await expect(page.getByTestId('claim-waiting')).toContainText('not saved to your account yet');
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'invalid');
	await expect(page).toHaveURL(/\/plans\/new$/);
	await wizardStep(page, 'Build-up');
	await expect(page.locator('#thickness')).toHaveValue('40');
	await page.locator('#thickness').fill('5');
	await page.locator('#thickness').blur();
	await expect(page).toHaveURL(/\/plans\/[0-9a-f-]{36}\/edit$/, { timeout: 15_000 });
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'saved');
	// Saved now, so the banner that said it was not is gone.
	await expect(page.getByTestId('claim-waiting')).toHaveCount(0);
	// At the editor's address the page is named as the editor is.
	await expect(page).toHaveTitle('Edit Steep step draft · Stakeline');
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Editing Steep step draft');
	await page.goto('/plans');
	await expect(page.getByTestId('plan-item')).toContainText('Steep step draft');
	await expect(page.getByTestId('browser-draft')).toHaveCount(0);
	expect(errors).toEqual([]);
});

test('two tabs editing one plan: the stale one is refused and offered the newer version', async ({ page, context }) => {
	await signUp(page, { name: 'Ivo Tabb', email: uniqueEmail('tabs'), password: 'two-tabs-open' });
	await expect(page).toHaveURL(/\/plans$/);
	const created = await page.request.post('/api/plans', {
		data: {
			name: 'Walkway',
			input: {
				units: 'imperial',
				sections: [
					{
						outline: [
							[0, 0],
							[20, 0],
							[20, 4],
							[0, 4]
						]
					}
				]
			}
		}
	});
	expect(created.status()).toBe(201);
	const { plan } = await created.json();
	const other = await context.newPage();
	await openHydrated(page, `/plans/${plan.id}/edit`);
	await openHydrated(other, `/plans/${plan.id}/edit`);

	await page.getByLabel('Plan name').fill('Walkway to the shed');
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'saved');
	await other.getByLabel('Plan name').fill('Front walk');
	await expect(other.getByTestId('save-status')).toHaveAttribute('data-status', 'conflict');
	await other.getByRole('button', { name: 'Load the newer version' }).click();
	await expect(other.getByLabel('Plan name')).toHaveValue('Walkway to the shed');
	const stored = await (await page.request.get(`/api/plans/${plan.id}`)).json();
	expect(stored.plan.name).toBe('Walkway to the shed');
	expect((await page.request.patch(`/api/plans/${plan.id}`, { data: { revision: 1, name: 'Stale' } })).status()).toBe(409);
});

test('my plans: rename, duplicate and delete with confirmation', async ({ page }) => {
	await signUp(page, { name: 'Rhea List', email: uniqueEmail('list'), password: 'list-of-plans' });
	await expect(page).toHaveURL(/\/plans$/);
	await expect(page.getByRole('heading', { name: 'No plans yet' })).toBeVisible();
	await page.request.post('/api/plans', {
		data: {
			name: 'Patio A',
			input: {
				units: 'metric',
				sections: [
					{
						outline: [
							[0, 0],
							[3, 0],
							[3, 3],
							[0, 3]
						]
					}
				]
			}
		}
	});
	await page.goto('/plans');
	await expect(page.getByTestId('plan-item')).toContainText('9 m²'); // 3 × 3 m
	// Every control of a plan row is a touch target of at least 44 px (WCAG 2.5.5), on a phone and a desktop.
	const tall = async (controls: ['link' | 'button', string][]) => {
		for (const [role, name] of controls) {
			const box = await page.getByTestId('plan-item').first().getByRole(role, { name, exact: true }).boundingBox();
			expect(box!.height, name).toBeGreaterThanOrEqual(44);
		}
	};
	for (const width of [390, 1366]) {
		await page.setViewportSize({ width, height: width === 390 ? 844 : 768 });
		await tall([
			['link', 'Edit'],
			['link', 'Rename'],
			['button', 'Duplicate'],
			['link', 'Delete']
		]);
	}
	await page.getByRole('link', { name: 'Rename' }).click();
	await tall([
		['button', 'Save name'],
		['link', 'Cancel']
	]);
	await page.getByLabel('New name').fill('Patio by the oak');
	await page.getByRole('button', { name: 'Save name' }).click();
	await expect(page.getByRole('link', { name: 'Patio by the oak' })).toBeVisible();
	await page.getByRole('button', { name: 'Duplicate' }).click();
	await expect(page.getByTestId('plan-item')).toHaveCount(2);
	await page.getByTestId('plan-item').filter({ hasText: '(copy)' }).getByRole('link', { name: 'Delete' }).click();
	await expect(page.getByText('This cannot be undone.')).toBeVisible();
	await page.setViewportSize({ width: 390, height: 844 });
	const confirm = page.getByTestId('plan-item').filter({ hasText: '(copy)' });
	for (const control of [confirm.getByRole('button', { name: 'Yes, delete it' }), confirm.getByRole('link', { name: 'Keep it' })])
		expect((await control.boundingBox())!.height).toBeGreaterThanOrEqual(44);
	await page.getByRole('button', { name: 'Yes, delete it' }).click();
	await expect(page.getByTestId('plan-item')).toHaveCount(1);
	await expect(page.getByTestId('plan-item')).toContainText('Patio by the oak');
});

test.describe('signed in as the demo contractor', () => {
	test.use({ storageState: sessionFile(demoUser('contractor').email) });

	test('contractors cannot use the plan API', async ({ page }) => {
		await page.goto('/pro');
		await expect(page).toHaveURL(/\/pro$/);
		expect((await page.request.get('/api/plans')).status()).toBe(403);
		expect((await page.goto('/plans/new'))?.status()).toBe(403);
	});
});
