import { expect, test, type Page } from '@playwright/test';
import { writeFile, mkdir } from 'node:fs/promises';
import { demoPlanOwner, sessionFile } from './helpers';
import { pdfPageCount, pdfPagePixels, pdfPagePng, pdfPageText } from './pdf-text';

test.describe.configure({ timeout: 90_000 });

/** The demo patio's printed plan on Letter paper; 17 pages before the print styles, 9 while the
 *  sections were grid items (not split across pages), 8 in block flow. */
const PRINT_PAGES_AT_MOST = 8;

/** Its owner's stored session (tests/auth.setup.ts), for a describe block whose tests open the demo plan `planId`. */
const asOwnerOf = (planId: string) => test.use({ storageState: sessionFile(demoPlanOwner(planId).email) });

/** The demo homeowner, signed in with their stored session, opens their plan from My plans. */
async function openDemoPlan(page: Page) {
	const errors: string[] = [];
	page.on('pageerror', (e) => errors.push(e.message));
	await page.goto('/plans');
	await page
		.getByRole('link', { name: /Back patio|Shed pad|Corner patio/ })
		.first()
		.click();
	await page.waitForURL(/\/plans\/[0-9a-f-]{36}$/);
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
	return errors;
}

/**
 * The smallest stake id's size on screen, in CSS px: its font size in drawing units times the
 * drawing's scale (its shown width over its viewBox width).
 */
async function smallestStakeId(page: Page) {
	return page.getByTestId('layout-drawing').evaluate((svg) => {
		const scale = svg.getBoundingClientRect().width / (svg as unknown as SVGSVGElement).viewBox.baseVal.width;
		const sizes = [...svg.querySelectorAll('text')]
			.filter((t) => /^S\d+$/.test(t.textContent ?? ''))
			.map((t) => parseFloat(getComputedStyle(t).fontSize) * scale);
		return sizes.length ? Math.min(...sizes) : 0;
	});
}

test.describe('the back patio, opened by its owner', () => {
	asOwnerOf('lind-back-patio');

	test('the plan page opens with the build card and carries a layout sheet with squaring diagonals, on screen and in print', async ({ page }) => {
		const errors = await openDemoPlan(page);
		// The demo back patio: 14 × 12 ft, 4 in thick on 4 in of base (fixtures/demo-plans.json).
		const card = page.getByTestId('build-card');
		await expect(card).toBeVisible();
		await expect(card.getByText('Slab thickness')).toBeVisible();
		await expect(card.locator('div', { hasText: 'Slab thickness' }).getByRole('definition').first()).toHaveText('4 in');
		// 4 in of slab + 4 in of base.
		await expect(
			card
				.locator('div', { hasText: /^Dig depth/ })
				.getByRole('definition')
				.first()
		).toHaveText('8 in');
		// The build card comes before everything else in the plan.
		const cardTop = (await card.boundingBox())!.y;
		const summaryTop = (await page.getByRole('heading', { name: 'Summary' }).boundingBox())!.y;
		expect(cardTop).toBeLessThan(summaryTop);

		const sheet = page.getByTestId('layout-sheet');
		await expect(sheet.getByRole('heading', { name: 'Layout sheet' })).toBeVisible();
		// The long parts open where they are, from the keyboard too; the page sends them only then.
		await expect(sheet.getByTestId('layout-drawing')).toHaveCount(0);
		await sheet.getByRole('button', { name: 'Show the layout sheet' }).focus();
		await page.keyboard.press('Enter');
		await expect(sheet.getByRole('button', { name: 'Hide the layout sheet' })).toHaveAttribute('aria-expanded', 'true');
		await expect(sheet.getByRole('button', { name: 'Hide the layout sheet' })).toBeFocused();
		await expect(sheet.getByTestId('layout-drawing')).toBeVisible();
		// Pythagoras: √(14² + 12²) = √340 = 18.4391 ft = 18 ft 5.269 in → 5 1/4 in to the sixteenth.
		await expect(sheet.getByTestId('diagonals')).toContainText('A–C 18 ft 5 1/4 in');
		await expect(sheet.getByTestId('diagonals')).toContainText('B–D 18 ft 5 1/4 in');
		// 6-8-10: 6² + 8² = 10² (Pythagoras), the 8 ft leg along the 14 ft house edge A–B.
		await expect(sheet.getByTestId('square-check')).toContainText('6-8-10 ft');
		await expect(sheet.getByTestId('square-check')).toContainText('mark 8 ft 0 in along A–B');
		// Every stake of the stake-mark table appears on the sheet under the same id.
		await page.getByRole('button', { name: 'Show the stake marks' }).click();
		await expect(page.getByTestId('stake-marks')).toBeVisible();
		const stakeIds = await page.locator('#plan-stake-marks ~ div tbody th').evaluateAll((ths) => ths.map((t) => /^S\d+/.exec(t.textContent!.trim())![0]));
		expect(stakeIds.length).toBeGreaterThan(4);
		for (const id of stakeIds) await expect(sheet.getByRole('rowheader', { name: id, exact: true })).toBeVisible();
		await page.screenshot({ path: 'test-results/screens/plan-layout-sheet.png', fullPage: true });
		// On a desktop the stake ids read at 12 px (they were about 8 px: paper sizes scaled to the screen).
		await page.setViewportSize({ width: 1366, height: 768 });
		await expect.poll(() => smallestStakeId(page)).toBeGreaterThanOrEqual(11.9);

		// Print opens what is still closed (the day plan) before the browser's print dialog.
		await expect(page.getByRole('button', { name: 'Show the day plan' })).toBeVisible();
		await page.evaluate(() => {
			const w = window as unknown as { printed: number };
			w.printed = 0;
			window.print = () => void w.printed++;
		});
		await page.getByRole('button', { name: 'Print', exact: true }).click();
		await expect.poll(() => page.evaluate(() => (window as unknown as { printed: number }).printed)).toBe(1);
		await expect(page.getByRole('button', { name: 'Hide the day plan' })).toHaveAttribute('aria-expanded', 'true');
		await expect(page.getByRole('region', { name: 'Day by day' }).getByText('Pour day', { exact: true })).toBeVisible();

		// The print view keeps the build card and the layout sheet and drops the buttons.
		await page.emulateMedia({ media: 'print' });
		await expect(page.getByTestId('build-card')).toBeVisible();
		await expect(page.getByTestId('layout-sheet')).toBeVisible();
		await expect(page.getByTestId('layout-drawing-print')).toBeVisible();
		await expect(page.getByTestId('layout-drawing')).toBeHidden();
		await expect(page.getByRole('link', { name: 'Edit the plan' })).toBeHidden();
		// Stake ids on paper at least 7 CSS px tall (they were about 6 px: the drawing is shrunk to 4.2 in).
		const stakeLabel = page.getByTestId('layout-drawing-print').locator('text', { hasText: /^S1$/ });
		expect((await stakeLabel.boundingBox())!.height).toBeGreaterThanOrEqual(7);
		await page.screenshot({ path: 'test-results/screens/plan-print.png', fullPage: true });
		// Printed on Letter paper: the build card and the layout sheet start on page 1, the screen-only
		// parts (3D, the outline editor's copy, photos, buttons, navigation) are left out, and no table
		// row is cut in two.
		const printed = await page.pdf({ format: 'Letter', printBackground: true });
		const pages = await pdfPageCount(printed);
		const first = await pdfPageText(printed, 1);
		expect(first).toContain('Build card');
		expect(first).toContain('Layout sheet');
		for (const hidden of ['Edit the plan', 'Download PDF', 'Site photos', 'Sign out', '3D']) expect(first).not.toContain(hidden);
		console.log(`printed plan: ${pages} pages`);
		expect(pages).toBeLessThanOrEqual(PRINT_PAGES_AT_MOST);
		// The sections flow on: the summary follows the layout sheet on page 2 instead of jumping to page 3.
		const second = await pdfPageText(printed, 2);
		expect(second).toContain('Summary');
		expect(second).toContain('Concrete to order');
		await mkdir('test-results/screens', { recursive: true });
		for (const n of [1, 2]) await writeFile(`test-results/screens/plan-print-page-${n}.png`, await pdfPagePng(printed, n));
		// White paper, even with background graphics on: not one pixel of page 1 in the screen's tint (#f7f4ec).
		const paper = await pdfPagePixels(printed, 1);
		let tinted = 0;
		for (let i = 0; i < paper.data.length; i += 4)
			if (Math.abs(paper.data[i] - 0xf7) <= 2 && Math.abs(paper.data[i + 1] - 0xf4) <= 2 && Math.abs(paper.data[i + 2] - 0xec) <= 2) tinted++;
		expect(tinted).toBe(0);
		const rowsCut = await page.evaluate(
			() =>
				[...document.querySelectorAll('tbody tr')].filter(
					(tr) => getComputedStyle(tr).breakInside !== 'avoid' && getComputedStyle(tr).pageBreakInside !== 'avoid'
				).length
		);
		expect(rowsCut).toBe(0);
		expect(errors).toEqual([]);
	});
});

test.describe('the shed pad in two pours, opened by its owner', () => {
	asOwnerOf('castell-shed-pad');

	test('a metric plan in two pours on a phone: corners carry the section number and diagonals read in metres', async ({ page }) => {
		await page.setViewportSize({ width: 390, height: 844 });
		const errors = await openDemoPlan(page);
		const sheet = page.getByTestId('layout-sheet');
		await sheet.getByRole('button', { name: 'Show the layout sheet' }).click();
		// Two pours of 1.8 × 2.4 m: Pythagoras √(1.8² + 2.4²) = √9 = 3 m.
		await expect(sheet.getByTestId('diagonals')).toContainText('1A–1C 3.000 m');
		await expect(sheet.getByTestId('diagonals')).toContainText('2B–2D 3.000 m');
		// On a phone the build card and the sheet fit the width: nothing scrolls sideways.
		await expect(page.getByTestId('build-card')).toBeVisible();
		await expect(sheet.getByTestId('layout-drawing')).toBeVisible();
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
		// Stake ids at 11 px on a phone (they were about 4 px), placed clear of each other (layoutDrawing.spec).
		await expect.poll(() => smallestStakeId(page)).toBeGreaterThanOrEqual(10.9);
		await page.screenshot({ path: 'test-results/screens/plan-layout-sheet-390.png', fullPage: true });
		const card = page.getByTestId('build-card');
		// 100 mm slab + 100 mm thickened-edge trench; no base under the thickened edges (as the base volume lays it).
		await expect(
			card
				.locator('div', { hasText: /^Dig at thickened edges/ })
				.getByRole('definition')
				.first()
		).toHaveText('200 mm');
		expect(errors).toEqual([]);
	});
});

test.describe('without JavaScript, the back patio opened by its owner', () => {
	asOwnerOf('lind-back-patio');
	test.use({ javaScriptEnabled: false });

	test('the long parts are links to a page that holds them: layout sheet, stake marks and day plan', async ({ page }) => {
		await page.setViewportSize({ width: 390, height: 844 });
		const errors = await openDemoPlan(page);
		const planUrl = page.url();
		// The plan page itself leads with the build card, summary and cautions; the drawing is not in it.
		await expect(page.getByTestId('build-card')).toBeVisible();
		await expect(page.getByRole('heading', { name: 'Summary' })).toBeVisible();
		await expect(page.getByRole('heading', { name: 'Cautions' })).toBeVisible();
		await expect(page.getByTestId('layout-drawing')).toHaveCount(0);
		for (const name of ['Open the stake marks', 'Open the day plan']) await expect(page.getByRole('link', { name })).toHaveAttribute('href', /\/sheets#plan-/);
		await page.getByRole('link', { name: 'Open the layout sheet' }).click();
		await page.waitForURL(/\/sheets#plan-layout-sheet$/);
		await expect(page.getByTestId('sheets-title')).toBeVisible();
		const sheet = page.getByTestId('layout-sheet');
		await expect(sheet.getByTestId('layout-drawing')).toBeVisible();
		// √(14² + 12²) ft, as on the plan page (see above).
		await expect(sheet.getByTestId('diagonals')).toContainText('A–C 18 ft 5 1/4 in');
		await expect(page.getByTestId('stake-marks')).toBeVisible();
		await expect(page.getByRole('region', { name: 'Day by day' }).getByText('Pour day', { exact: true })).toBeVisible();
		// The trade words the sheets link to are on the same page.
		await expect(page.locator('#word-control-joint')).toBeAttached();
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
		await page.screenshot({ path: 'test-results/screens/plan-sheets-page-390.png', fullPage: true });
		await page.getByRole('link', { name: /^← Back patio/ }).click();
		await expect(page).toHaveURL(planUrl);
		expect(errors).toEqual([]);
	});
});
