import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { newPlanSignedUp, openHydrated, savedPlanId, watchErrors, wizardStep as goTo } from './helpers';
import { pdfText } from './pdf-text';

// The engine inputs that got their own wizard fields: exposure, the day-by-day forecast, concrete
// temperature, pour names, strength and cement, reinforcement details, stakes and board lengths,
// base weights, trench shape, bag sizes and yields, water, ready-mix steps and fee, joints, curing,
// milestones and currency. A fresh visitor types into each and the results follow.

const panel = (page: Page) => page.getByTestId('results');
const cautions = (page: Page) => panel(page).locator('details li');

/** Types a value, leaves the field, and checks it kept what was typed. */
async function typeInto(page: Page, id: string, value: string) {
	const field = page.locator(`#${id}`);
	await field.fill(value);
	await field.blur();
	await expect(field).toHaveValue(value);
}
/** typeInto for each field in turn, in the order given. */
async function typeEach(page: Page, values: Record<string, string>) {
	for (const [id, value] of Object.entries(values)) await typeInto(page, id, value);
}
async function choose(page: Page, id: string, value: string) {
	await page.locator(`#${id}`).selectOption(value);
	await expect(page.locator(`#${id}`)).toHaveValue(value);
}
const bagCount = async (page: Page) => Number(await page.getByTestId('result-bags').textContent());

/** Site: exposure, one-value forecast with a low and concrete temperature, then day by day. */
async function site(page: Page) {
	await goTo(page, 'Site');
	await expect(cautions(page).filter({ hasText: 'No de-icing salt the first winter' })).toHaveCount(1); // moderate by default
	await expect(page.locator('#exposure-hint')).toContainText('Default: moderate.');
	await choose(page, 'exposure', 'negligible');
	await expect(cautions(page).filter({ hasText: 'No de-icing salt the first winter' })).toHaveCount(0);
	await choose(page, 'exposure', 'severe');
	await expect(cautions(page).filter({ hasText: 'No de-icing salt the first winter' })).toHaveCount(1);

	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(0);
	await typeInto(page, 'air-low', '34'); // below ACI 306R's 40 °F
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(1);
	await typeInto(page, 'air-low', '52');
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(0);
	await typeInto(page, 'concrete-temp', '100'); // above about 95 °F (ACI 305R)
	await expect(cautions(page).filter({ hasText: 'Hot weather' })).toHaveCount(1);
	await typeInto(page, 'concrete-temp', '72');
	await expect(cautions(page).filter({ hasText: 'Hot weather' })).toHaveCount(0);

	// Day by day: the single values fill a week; a cold night on day 3 is a cold-weather caution.
	await page.getByLabel('Enter the forecast day by day').check();
	await expect(page.locator('[id^="air-temp-"]')).toHaveCount(7);
	await expect(page.locator('#air-low-0')).toHaveValue('52');
	await page.getByRole('button', { name: 'Add a day' }).click();
	await expect(page.locator('[id^="air-temp-"]')).toHaveCount(8);
	await page.getByRole('button', { name: 'Remove the last day' }).click();
	await expect(page.locator('[id^="air-temp-"]')).toHaveCount(7);
	for (let i = 0; i < 7; i++) {
		await typeInto(page, `air-temp-${i}`, String(68 + i));
		await typeInto(page, `air-low-${i}`, String(55 + i));
	}
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(0);
	await typeInto(page, 'air-low-2', '36');
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(1);
	await typeInto(page, 'air-low-2', '57');
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(0);
}

/** Outline: the pour's name shows on its tab. */
async function outline(page: Page) {
	await goTo(page, 'Outline');
	await page.locator('#section-name').fill('Back patio');
	await expect(page.getByRole('tab', { name: 'Pour 1: Back patio' })).toBeVisible();
}

/** Build-up: strength, cement, every reinforcement's details, stakes, boards, base, trench. */
async function buildUp(page: Page) {
	await goTo(page, 'Build-up');
	await expect(page.locator('#design-strength-hint')).toContainText('Default: 3,000 psi.');
	await typeInto(page, 'design-strength', '3500');
	await choose(page, 'cement', 'typeIII');
	await page.getByLabel('Cars or trucks will drive on it').check();

	await choose(page, 'reinforcement', 'fiber');
	await typeInto(page, 'fiber-per-bag', '1.5');
	await choose(page, 'reinforcement', 'rebar');
	await typeEach(page, { 'bar-spacing': '16', 'bar-diameter': '0.5', 'bar-stock': '10', 'lap-diameters': '30', 'chair-spacing': '2.5' });
	await choose(page, 'reinforcement', 'mesh');
	await choose(page, 'mesh-form', 'roll');
	await expect(page.getByText('Roll width')).toBeVisible();
	await typeEach(page, { 'mesh-width': '5', 'mesh-length': '150', 'wire-spacing': '6' });
	await expect(page.locator('#chair-spacing')).toHaveValue('2.5');

	// The schema's own plain message on bad input, then fixed.
	await expect(page.locator('#stake-length-hint')).toContainText('Default: 18 in.');
	await typeInto(page, 'stake-length', '90');
	await expect(page.locator('#stake-length-error')).toHaveText('Enter the stake length, 0–48 in.');
	await typeInto(page, 'stake-length', '24');
	await expect(page.locator('#stake-length-error')).toHaveCount(0);

	await expect(page.locator('[id^="board-length-"]')).toHaveCount(4);
	await page.getByRole('button', { name: 'Add a length' }).click();
	// 8, 10, 12 and 16 ft are all listed: the new one is 2 ft longer than the longest.
	await expect(page.locator('#board-length-4')).toHaveValue('18');
	await typeInto(page, 'board-length-4', '20');
	await page.getByRole('button', { name: 'Remove board length 1' }).click();
	await expect(page.locator('[id^="board-length-"]')).toHaveCount(4);
	await typeInto(page, 'board-length-0', '12');

	await typeEach(page, { 'base-overhang': '8', 'stone-density': '1.5', 'soil-density': '1.3' });
	await choose(page, 'edges', 'free');
	const volume = await page.getByTestId('result-volume').textContent();
	await choose(page, 'edge-profile', 'tapered');
	await expect(page.getByTestId('result-volume')).not.toHaveText(volume!); // a tapered trench takes less concrete
}

/** Crew: bags, water, ready-mix, joints, curing, milestones, currency and the new prices. */
async function crew(page: Page) {
	await goTo(page, 'Crew');
	const before = await bagCount(page);
	await typeInto(page, 'bag-yield-0', '0.5'); // less than the label's 0.60 ft³ per 80 lb: more bags
	await expect.poll(() => bagCount(page)).toBeGreaterThan(before);
	await typeInto(page, 'bag-size-1', '50');
	await typeInto(page, 'bag-yield-1', '0.375');
	await page.getByRole('button', { name: 'Add a bag size' }).click();
	// 80, 50 and 40 lb are listed: the new row starts at the first usual size that is not, 60 lb.
	await expect(page.locator('#bag-size-3')).toHaveValue('60');
	await typeInto(page, 'bag-size-3', '90');
	await page.getByRole('button', { name: 'Remove bag 4' }).click();
	await expect(page.locator('[id^="bag-size-"]')).toHaveCount(3);
	await choose(page, 'plan-size', '50');
	await expect(panel(page)).toContainText('Bags (50 lb)');
	await typeEach(page, { 'water-ratio': '0.09', 'readymix-increment': '0.5', 'readymix-minimum': '2' });

	await expect(page.getByTestId('result-curing')).toContainText('plastic sheet');
	await choose(page, 'curing-method', 'wet');
	await expect(page.getByTestId('result-curing')).toContainText('continuously wet');
	await choose(page, 'curing-method', 'compound');
	await expect(page.getByTestId('result-curing')).toContainText('curing compound');
	await typeInto(page, 'curing-coverage', '250');
	await choose(page, 'joint-method', 'saw');
	await typeEach(page, { 'forms-off-days': '2', 'walk-days': '3', 'furniture-days': '5', 'vehicle-percent': '75' });

	// Money is formatted in the chosen currency, and the price labels name it.
	await typeInto(page, 'bag-price-0', '6.5');
	await typeInto(page, 'bag-price-1', '4.5');
	await expect(page.getByTestId('result-cost')).toContainText('$');
	await expect(page.getByText('Bagged concrete mix, USD per 80 lb bag')).toBeVisible();
	await choose(page, 'currency', 'EUR');
	await expect(page.getByTestId('result-cost')).toContainText('€');
	await expect(page.getByText('Bagged concrete mix, EUR per 80 lb bag')).toBeVisible();
	await expect(page.getByText('Gravel for the base, EUR per yd³')).toBeVisible();
	await typeEach(page, { 'readymix-price': '180', 'short-load-fee': '75', 'price-curingCompound': '28', 'price-chair': '0.5' });
}

/** Every number field and select the new inputs use, as shown, by id. */
async function readNew(page: Page) {
	const seen: Record<string, string> = {};
	const ids =
		/^(exposure|air-(temp|low)(-\d+)?|concrete-temp|design-strength|cement|reinforcement|mesh-|wire-|chair-|stake-length|board-length-|base-overhang|stone-|soil-|edge-profile|bag-|plan-size|water-ratio|readymix-|curing-|joint-method|forms-off-|walk-|furniture-|vehicle-|currency|short-load-fee|price-)/;
	for (const title of ['Site', 'Outline', 'Build-up', 'Crew']) {
		await goTo(page, title);
		for (const el of await page.locator('section[aria-labelledby="step-heading"]').locator('input[id], select[id]').all()) {
			const id = (await el.getAttribute('id'))!;
			if (ids.test(id) || id === 'section-name') seen[id] = await el.inputValue();
		}
	}
	return seen;
}

async function fillAll(page: Page) {
	await site(page);
	await outline(page);
	await buildUp(page);
	await crew(page);
}

test('a new visitor sets every new input: no page error, and the results follow', async ({ page }) => {
	test.setTimeout(180_000);
	const errors = watchErrors(page);
	await page.goto('/plans/new');
	await expect(page.getByRole('heading', { name: '1. Site' })).toBeVisible();
	await fillAll(page);
	await goTo(page, 'Review');
	// The pour's name and the saw-cut joints reach the plan shown to a visitor.
	await expect(page.getByRole('heading', { name: /^Back patio:/ })).toBeVisible();
	const dayPlan = page.locator('section[aria-labelledby="plan-day-plan"]');
	await expect(dayPlan.getByText(/^Saw the control joints/)).toBeVisible();
	await expect(dayPlan.getByText(/spray the ASTM C309 curing compound/)).toBeVisible();
	const shown = await readNew(page);
	expect(Object.keys(shown).length).toBeGreaterThan(50);
	await page.reload();
	expect(await readNew(page)).toEqual(shown);
	expect(errors).toEqual([]);
});

test('signed in, the new inputs are saved and hold after a reload', async ({ page }) => {
	test.setTimeout(180_000);
	const errors = watchErrors(page);
	await newPlanSignedUp(page, { name: 'Ines Forecast', label: 'inputs', password: 'every-input-holds' });
	await fillAll(page);
	const id = await savedPlanId(page);
	const shown = await readNew(page);
	expect(shown).toMatchObject({
		exposure: 'severe',
		'air-low-2': '57',
		'section-name': 'Back patio',
		'stake-length': '24',
		'bag-yield-0': '0.5',
		currency: 'EUR',
		'curing-method': 'compound',
		'joint-method': 'saw',
		'short-load-fee': '75'
	});
	await page.reload();
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'saved');
	expect(await readNew(page)).toEqual(shown);
	const stored = (await (await page.request.get(`/api/plans/${id}`)).json()).plan.input;
	expect(stored.conditions.airLow).toEqual([55, 56, 57, 58, 59, 60, 61]);
	expect(stored.sections[0].name).toBe('Back patio');
	expect(stored.currency).toBe('EUR');
	expect(errors).toEqual([]);
});

test("a freestanding pad's chosen high edge is marked on the plan page: 2D view, build card, layout sheet and PDF", async ({ page }) => {
	test.setTimeout(120_000);
	const errors = watchErrors(page);
	await newPlanSignedUp(page, { name: 'Hal Uphill', label: 'high-edge', password: 'the-high-side-shows' });
	await goTo(page, 'Outline');
	await page.getByLabel('Freestanding: no house wall along the slab').check();
	await goTo(page, 'Pitch');
	await choose(page, 'high-edge', '0:2'); // edge C–D, the back of the 12 × 10 ft starter
	const id = await savedPlanId(page);
	await page.goto(`/plans/${id}`);
	await expect(page.getByTestId('outline-high-edge')).toBeVisible();
	await expect(page.locator('figure svg line[data-high]')).toHaveCount(1);
	await expect(page.locator('figure svg text', { hasText: 'high side' })).toHaveCount(1);
	const card = page.getByTestId('build-card');
	await expect(
		card
			.locator('div', { hasText: /^High side/ })
			.getByRole('definition')
			.first()
	).toHaveText('edge C–D');
	const sheet = page.getByTestId('layout-sheet');
	await sheet.getByRole('button', { name: 'Show the layout sheet' }).click();
	await expect(sheet.getByTestId('sheet-high-edge')).toHaveText('high side, edge C–D');
	await expect(sheet.getByTestId('layout-drawing').locator('line[data-high]')).toHaveCount(1);
	await expect(sheet.getByTestId('layout-drawing').getByText('HIGH SIDE', { exact: true })).toBeVisible();
	const pdf = await page.request.get(`/plans/${id}/plan.pdf`);
	expect(pdf.status()).toBe(200);
	const text = (await pdfText(await pdf.body())).replace(/\s+/g, ' ');
	expect(text).toContain('High side edge C–D');
	expect(text).toContain('Green dashes: the high side, edge C–D');
	expect(text).toContain('HIGH SIDE');
	expect(errors).toEqual([]);
});

test('day by day, a low typed into one day changes only that day, and an emptied low stays empty and uses its mean', async ({ page }) => {
	test.setTimeout(90_000);
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await expect(page.getByRole('heading', { name: '1. Site' })).toBeVisible();
	await typeInto(page, 'pour-date', '2031-05-01');
	await page.getByLabel('Enter the forecast day by day').check();
	const low = (day: number) => page.getByLabel(`Day ${day} low in °F`);
	const otherLowsEmpty = async (but?: number) => {
		for (let day = 1; day <= 7; day++) if (day !== but) await expect(low(day), `day ${day}'s low`).toHaveValue('');
	};
	// What this browser keeps of the signed-out plan: the lows as the engine reads them.
	const keptLows = () => page.evaluate(() => JSON.parse(localStorage.getItem('stakeline:draft') ?? '{}').input?.conditions.airLow);
	await otherLowsEmpty();

	await low(2).click();
	await page.keyboard.type('50');
	await expect(low(2)).toHaveValue('50');
	await otherLowsEmpty(2);
	await expect.poll(keptLows).toEqual([null, 50, null, null, null, null, null]);
	await page.keyboard.press('Backspace');
	await page.keyboard.press('Backspace');
	await expect(low(2)).toHaveValue('');
	await low(2).blur();
	await otherLowsEmpty();
	await expect.poll(keptLows).toBeUndefined();

	// An empty low follows its day's mean: a 38 °F mean on day 1 is a cold day (≤ 40 °F, ACI 306R).
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(0);
	await typeInto(page, 'air-temp-0', '38');
	await expect(low(1)).toHaveValue('');
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(1);
	await typeInto(page, 'air-temp-0', '60');
	await expect(cautions(page).filter({ hasText: 'Cold weather' })).toHaveCount(0);
	await typeInto(page, 'air-low-2', '45');
	await typeInto(page, 'air-temp-0', '62');
	await expect(low(3)).toHaveValue('45');
	await otherLowsEmpty(3);
	expect(errors).toEqual([]);
});

test.describe('on a phone', () => {
	test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

	test('the new fields fit a 390 px screen without sideways scroll and pass axe', async ({ page }) => {
		test.setTimeout(120_000);
		const errors = watchErrors(page);
		await page.goto('/plans/new');
		const check = async (where: string) => {
			const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
			expect(scroll, `${where} is wider than the screen`).toBeLessThanOrEqual(client);
			const { violations } = await new AxeBuilder({ page }).include('section[aria-labelledby="step-heading"]').analyze();
			expect(violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${where} ${v.id}: ${v.nodes[0]?.target}`)).toEqual([]);
		};
		await goTo(page, 'Site');
		await page.getByLabel('Enter the forecast day by day').check();
		await typeInto(page, 'air-low-0', '45');
		await check('site, day by day');
		await goTo(page, 'Build-up');
		await choose(page, 'edges', 'free');
		for (const r of ['mesh', 'rebar', 'fiber']) {
			await choose(page, 'reinforcement', r);
			await check(`build-up, ${r}`);
		}
		await goTo(page, 'Crew');
		await choose(page, 'curing-method', 'compound');
		await check('crew');
		expect(errors).toEqual([]);
	});
});
