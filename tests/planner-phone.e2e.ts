import { expect, test, type Page } from '@playwright/test';
import { openHydrated, signUp, uniqueEmail, watchErrors, wizardStep } from './helpers';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

const STEPS = ['Site', 'Outline', 'Pitch', 'Build-up', 'Crew', 'Review'];

async function noSidewaysScroll(page: Page, where: string) {
	const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
	expect(scroll, `${where} is wider than the screen`).toBeLessThanOrEqual(client);
}

/**
 * Every field and every tick box (its whole label takes the tap) on screen is at least 44 px tall:
 * the radio and check-box rows were 26 px, one line of text.
 */
async function tallEnough(page: Page, where: string) {
	const short = await page.evaluate(() =>
		[...document.querySelectorAll('main input, main select, main textarea')]
			.map((el) => {
				const box = el as HTMLInputElement;
				const target = box.type === 'checkbox' || box.type === 'radio' ? box.closest('label') : box;
				const r = target?.getBoundingClientRect();
				return r && r.width > 0 ? { name: box.id || box.getAttribute('aria-label') || target!.textContent!.trim().slice(0, 40), height: r.height } : null;
			})
			.filter((t) => t && t.height < 44)
	);
	expect(short, `${where}: targets under 44 px tall`).toEqual([]);
}

/**
 * Every tick box and radio on screen is drawn at its full 20 px or more: beside a label that wraps
 * to a second line, a flex row squeezed three of them to 13–14 px.
 */
async function boxesFullSize(page: Page, where: string) {
	const small = await page.evaluate(() =>
		[...document.querySelectorAll<HTMLInputElement>('main input[type=checkbox], main input[type=radio]')]
			.map((box) => ({
				name: box.id || box.getAttribute('aria-label') || box.closest('label')?.textContent?.trim().slice(0, 40),
				r: box.getBoundingClientRect()
			}))
			.filter(({ r }) => r.width > 0 && (r.width < 20 || r.height < 20))
			.map(({ name, r }) => `${name}: ${r.width}×${r.height}`)
	);
	expect(small, `${where}: tick boxes under 20 px`).toEqual([]);
}

async function everyStep(page: Page, where: string) {
	for (const title of STEPS) {
		await wizardStep(page, title);
		await noSidewaysScroll(page, `${where}, step ${title}`);
		await tallEnough(page, `${where}, step ${title}`);
		await boxesFullSize(page, `${where}, step ${title}`);
	}
}

test('on a phone the key results stay in sight while editing, corners are big enough to touch, and nothing scrolls sideways', async ({ page }) => {
	test.setTimeout(120_000);
	const errors = watchErrors(page);
	await page.goto('/plans/new');
	// Touch targets of at least 44 px: the header links (the home link was 31 px), the cautions summary.
	const nav = page.getByRole('navigation', { name: 'Main' });
	for (const target of [
		nav.getByRole('link', { name: 'Stakeline' }),
		nav.getByRole('link', { name: 'Sign in' }),
		page.getByTestId('results').locator('summary')
	]) {
		expect((await target.boundingBox())!.height).toBeGreaterThanOrEqual(44);
	}
	await everyStep(page, 'new plan');

	await wizardStep(page, 'Build-up');
	const thickness = page.getByLabel('Thickness');
	await thickness.focus();
	await thickness.fill('6');
	const bar = page.getByTestId('results-bar');
	await expect(bar).toBeInViewport();
	// The starter's 12 × 10 ft; the bag count is the panel's, which follows the field.
	await expect(bar.getByTestId('bar-area')).toHaveText('120 ft²');
	const bags = await page.getByTestId('result-bags').innerText();
	await expect(bar.getByTestId('bar-bags')).toHaveText(new RegExp(`^${bags} ×`));
	await bar.getByRole('button').first().click();
	await expect(bar.getByText(/Mixing and placing/)).toBeVisible();
	await page.screenshot({ path: 'test-results/screens/phone-results-bar.png' });

	// The bar's figures stay on one line each ("1.63 yd³", not "1.63 / yd³").
	const volume = (await bar.getByTestId('bar-volume').boundingBox())!;
	const area = (await bar.getByTestId('bar-area').boundingBox())!;
	expect(volume.height).toBeLessThanOrEqual(area.height + 1);

	await wizardStep(page, 'Outline');
	expect((await page.getByText('Freestanding: no house wall').boundingBox())!.height).toBeGreaterThanOrEqual(44);
	// Every step is on screen at once (the list wraps; nothing hides past the edge), the current one too.
	const steps = page.getByTestId('step-list');
	expect(await steps.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true);
	for (const title of STEPS) {
		const box = (await steps.getByRole('button', { name: title }).boundingBox())!;
		expect(box.x, title).toBeGreaterThanOrEqual(0);
		expect(box.x + box.width, title).toBeLessThanOrEqual(390);
	}
	await expect(steps.locator('[aria-current="step"]')).toBeInViewport();
	// The L-shape's fields and house-wall choices are tall enough too (shown only once L is chosen).
	await page.getByLabel('L-shape (notched corner)').check();
	await tallEnough(page, 'outline, L-shape chosen');
	await boxesFullSize(page, 'outline, L-shape chosen');
	await page.getByLabel('Rectangle').check();
	// The edge table's controls: named for what they do, and 44 px or more each way.
	const edgeControls = [
		page.getByLabel('House wall along edge A–B'),
		page.getByRole('button', { name: 'Add a corner after A' }),
		page.getByRole('button', { name: 'Delete corner A' })
	];
	for (const c of edgeControls) await expect(c).toBeVisible();
	const targets = [page.getByTestId('house-wall-target').first(), edgeControls[1], edgeControls[2]];
	for (const t of targets) {
		const box = (await t.boundingBox())!;
		expect(box.width).toBeGreaterThanOrEqual(44);
		expect(box.height).toBeGreaterThanOrEqual(44);
	}
	// A tap on the target's side, away from the box itself, still ticks the wall.
	const wall = page.getByLabel('House wall along edge B–C');
	await expect(wall).not.toBeChecked();
	const target = page.getByTestId('house-wall-target').nth(1);
	await target.scrollIntoViewIfNeeded();
	const cell = (await target.boundingBox())!;
	// At the right edge, half-way down: 3 px from the row above, Chromium's touch adjustment finds two
	// 44 px targets (this row's and the one above) and the tap toggles neither.
	await page.touchscreen.tap(cell.x + cell.width - 3, cell.y + cell.height / 2);
	await expect(wall).toBeChecked();
	// Neighbouring rows' wall targets stand apart (they touched, so a tap on the seam found two).
	const rows = await page
		.getByTestId('house-wall-target')
		.evaluateAll((els) => els.map((e) => e.getBoundingClientRect()).map((r) => ({ top: r.top, bottom: r.bottom })));
	for (let i = 1; i < rows.length; i++) expect(rows[i].top - rows[i - 1].bottom, `gap above wall target ${i + 1}`).toBeGreaterThanOrEqual(8);
	await page.screenshot({ path: 'test-results/screens/phone-edge-table.png' });
	for (const hit of await page.getByTestId('corner-hit').all()) {
		const box = (await hit.boundingBox())!;
		expect(box.width).toBeGreaterThanOrEqual(44);
		expect(box.height).toBeGreaterThanOrEqual(44);
	}
	expect(errors).toEqual([]);
});

test('on a phone the edit page and the plan page of a saved plan do not scroll sideways', async ({ page }) => {
	test.setTimeout(120_000);
	await signUp(page, { name: 'Phoebe Small', email: uniqueEmail('phone'), password: 'small-screen-plan' });
	const created = await page.request.post('/api/plans', {
		data: {
			name: 'Phone patio',
			input: {
				units: 'imperial',
				sections: [
					{
						outline: [
							[0, 0],
							[14, 0],
							[14, 12],
							[0, 12]
						]
					}
				]
			}
		}
	});
	const { plan } = await created.json();
	await page.goto(`/plans/${plan.id}/edit`);
	await everyStep(page, 'edit page');
	await page.goto(`/plans/${plan.id}`);
	await noSidewaysScroll(page, 'plan page');
	// The long parts open in place and fit the phone too; each button is a thumb-sized target.
	for (const what of ['the layout sheet', 'the stake marks', 'the day plan']) {
		const show = page.getByRole('button', { name: `Show ${what}` });
		await expect(show).toBeVisible();
		expect((await show.boundingBox())!.height, what).toBeGreaterThanOrEqual(44);
		await show.click();
		await expect(page.getByRole('button', { name: `Hide ${what}` })).toHaveAttribute('aria-expanded', 'true');
	}
	await expect(page.getByTestId('layout-drawing')).toBeVisible();
	await expect(page.getByTestId('stake-marks')).toBeVisible();
	await noSidewaysScroll(page, 'plan page with its long parts open');
	// Nothing can be dropped on a touch screen: the photo box does not ask for it there.
	const photoBox = page.getByRole('region', { name: 'Add site photos' });
	await expect(photoBox.getByText('Photos of the site', { exact: true })).toBeVisible();
	await expect(photoBox.getByTestId('drop-hint')).toBeHidden();
	// The curing-reminder switch's label was one 26 px line.
	expect((await page.getByText('E-mail me curing reminders').boundingBox())!.height).toBeGreaterThanOrEqual(44);
});

test('scrolled to the end of each step, the page footer shows above the results bar, not under it', async ({ page }) => {
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	const bar = page.getByTestId('results-bar');
	const footer = page.locator('footer', { hasText: 'Stakeline helps you plan; it does not replace local codes' });
	for (const title of STEPS) {
		await wizardStep(page, title);
		await expect(bar).toBeInViewport();
		await page.evaluate(() => window.scrollTo(0, document.documentElement.scrollHeight));
		await expect(footer).toBeInViewport();
		const barTop = (await bar.boundingBox())!.y;
		const footerBox = (await footer.boundingBox())!;
		expect(footerBox.y + footerBox.height, `step ${title}: the footer's foot, against the bar's top`).toBeLessThanOrEqual(barTop);
	}
	expect(errors).toEqual([]);
});
