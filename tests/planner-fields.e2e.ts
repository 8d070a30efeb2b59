import { expect, test, type Page } from '@playwright/test';
import { newPlanSignedUp, openHydrated, reloadHydrated, savedPlanId, watchErrors, wizardStep as goTo } from './helpers';

// Every step of a new plan, as a visitor types: each number field gets a new value and each
// select a new choice. A field added later without an entry below still gets typed into (the
// fallback), so "every field" stays true as the planner grows.
const VALUES: Record<string, string> = {
	'ref-below': '1.5',
	gap: '0.75',
	'air-temp': '65',
	humidity: '55',
	wind: '8',
	'shape-length': '14',
	'shape-width': '10',
	'shape-notch-length': '4',
	'shape-notch-width': '3',
	fall: '0.25',
	'cross-fall': '0.5',
	thickness: '5',
	waste: '8',
	'custom-depth': '5.5',
	'stake-spacing': '4',
	'base-depth': '5',
	bulking: '1.25',
	'edge-width': '10',
	'edge-depth': '4',
	'fill-share': '0.25',
	'fill-piece': '3',
	people: '3',
	'hand-minutes': '7',
	'drum-minutes': '5',
	'drum-mass': '120',
	'place-minutes': '3',
	'working-minutes': '100',
	'finish-minutes': '40',
	payload: '1200',
	'bag-price-0': '6.5',
	'bag-price-1': '5.25',
	'bag-price-2': '3.75',
	'readymix-price': '190',
	'air-low': '50',
	'concrete-temp': '68',
	'design-strength': '3500',
	'stake-length': '20',
	'board-length-0': '10',
	'board-length-1': '12',
	'board-length-2': '14',
	'board-length-3': '16',
	'base-overhang': '8',
	'stone-density': '1.5',
	'soil-density': '1.4',
	'mesh-width': '5',
	'mesh-length': '10',
	'wire-spacing': '6',
	'chair-spacing': '2.5',
	'bag-size-0': '90',
	'bag-size-1': '60',
	'bag-size-2': '40',
	'bag-yield-0': '0.68',
	'bag-yield-1': '0.45',
	'bag-yield-2': '0.3',
	'water-ratio': '0.09',
	'readymix-increment': '0.5',
	'readymix-minimum': '2',
	'short-load-fee': '60',
	'curing-coverage': '250',
	'forms-off-days': '2',
	'walk-days': '3',
	'furniture-days': '4'
};
// Selects: the choice to make; the edge table's lengths are typed by label below.
const CHOICES: Record<string, string> = {
	'high-edge': '0:2', // edge C–D; A–B, the house wall, is the first option (its default)
	'fall-unit': 'inPerFt',
	'cross-unit': 'totalDrop',
	reinforcement: 'mesh',
	lumber: 'custom',
	release: 'oil',
	edges: 'free',
	method: 'drum',
	exposure: 'severe',
	cement: 'typeIII',
	'mesh-form': 'roll',
	'edge-profile': 'tapered',
	'plan-size': '60',
	'joint-method': 'saw',
	'curing-method': 'compound',
	currency: 'CAD'
};

const stepBody = (page: Page) => page.locator('section[aria-labelledby="step-heading"]');

/** Types into every number field and changes every select of the step on screen. */
async function fillStep(page: Page, typed: Record<string, string>) {
	const done = new Set<string>();
	for (let round = 0; round < 5; round++) {
		let found = false;
		for (const field of await stepBody(page).locator('input[type=number][id]').all()) {
			const id = (await field.getAttribute('id'))!;
			if (done.has(id) || !(await field.isVisible())) continue;
			found = true;
			done.add(id);
			// Unknown fields (prices and the like): a small positive number within the field's bounds.
			const max = Number((await field.getAttribute('max')) ?? Infinity);
			const value = VALUES[id] ?? (id.startsWith('price-') ? '1.5' : String(Math.min(max, Number((await field.inputValue()) || 0) + 1)));
			await field.fill(value);
			await field.blur();
			await expect(field).toHaveValue(value);
			typed[id] = value;
		}
		for (const select of await stepBody(page).locator('select[id]').all()) {
			const id = (await select.getAttribute('id'))!;
			if (done.has(`select:${id}`) || !(await select.isVisible())) continue;
			found = true;
			done.add(`select:${id}`);
			const options = await select.locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
			const now = await select.inputValue();
			const value = CHOICES[id] ?? options.find((o) => o !== now)!;
			await select.selectOption(value);
			await expect(select).toHaveValue(value);
			typed[`select:${id}`] = value;
		}
		// A chunk fill only shows its fields once chosen.
		const chunks = stepBody(page).getByLabel('Lay broken concrete chunks in the trench');
		if ((await chunks.count()) && !(await chunks.isChecked())) {
			await chunks.check();
			found = true;
		}
		if (!found) break;
	}
}

/** The whole wizard, step by step; returns what was typed, by field id. */
async function fillEveryStep(page: Page) {
	const typed: Record<string, string> = {};
	await goTo(page, 'Site');
	await fillStep(page, typed);

	await goTo(page, 'Outline');
	await page.getByLabel('L-shape (notched corner)').check();
	await fillStep(page, typed);
	await page.getByLabel('Rectangle').check();
	await page.getByRole('button', { name: 'Use this rectangle' }).click();
	await expect(page.getByTestId('result-area')).toHaveText('140 ft²'); // 14 × 10 ft
	// The edge table: A–B longer; the rectangle stays square (its far side moves with it).
	await page.getByLabel('Length of edge A–B in ft').fill('15');
	await page.getByLabel('Length of edge A–B in ft').blur();
	await expect(page.getByLabel('Length of edge C–D in ft')).toHaveValue('15');
	// A length the plan cannot take stays in its field, marked, with the reason; nothing else moves.
	const ab = page.getByLabel('Length of edge A–B in ft');
	for (const [bad, why] of [
		['5000', 'at most 1000 ft around'],
		['-3', 'Enter a length above 0 ft.']
	]) {
		await ab.fill(bad);
		await ab.blur();
		await expect(ab).toHaveValue(bad);
		await expect(ab).toHaveAttribute('aria-invalid', 'true');
		// The drawing and figures keep the old outline, and the reason says so.
		await expect(page.getByRole('alert').filter({ hasText: why })).toContainText('The drawing and figures still use 15 ft.');
		await expect(page.getByLabel('Length of edge C–D in ft')).toHaveValue('15');
		await expect(page.getByTestId('result-area')).toHaveText('150 ft²');
	}
	await ab.fill('15');
	await ab.blur();
	await expect(ab).not.toHaveAttribute('aria-invalid');
	await page.getByLabel('Length of edge B–C in ft').fill('9');
	await page.getByLabel('Length of edge B–C in ft').blur();
	await page.getByLabel('Length of edge D–A in ft').fill('10');
	await page.getByLabel('Length of edge D–A in ft').blur();
	await expect(page.getByLabel('Length of edge B–C in ft')).toHaveValue('10');
	await expect(page.getByTestId('result-area')).toHaveText('150 ft²'); // 15 × 10 ft, still a rectangle
	await expect(page.getByLabel('House wall along edge A–B')).toBeChecked(); // the wall stays where it was

	await goTo(page, 'Pitch');
	// A new unit keeps the slope: 2 % is 0.24 in per ft (2 % × 12 in), and back gives 2 again.
	await expect(page.getByLabel('Fall', { exact: true })).toHaveValue('2');
	await page.locator('#fall-unit').selectOption('inPerFt');
	await expect(page.getByLabel('Fall', { exact: true })).toHaveValue('0.24');
	await page.locator('#fall-unit').selectOption('totalDrop');
	await expect(page.getByLabel('Fall', { exact: true })).toHaveValue('2.4'); // 2 % over the 10 ft run = 2.4 in
	await page.locator('#fall-unit').selectOption('percent');
	await expect(page.getByLabel('Fall', { exact: true })).toHaveValue('2');
	await fillStep(page, typed);
	// The fall was typed before its unit changed (which converted it); type it again in in per ft.
	await page.getByLabel('Fall', { exact: true }).fill('0.25');
	await page.getByLabel('Fall', { exact: true }).blur();
	typed.fall = '0.25';
	// The cross fall was typed and its unit changed; set it back to none so the fall alone shows.
	await page.getByLabel('Cross fall').fill('0');
	await page.getByLabel('Cross fall').blur();
	typed['cross-fall'] = '0';
	// ¼ in per ft = 0.25 ÷ 12 = 2.083 % (percent grade by definition); over the 10 ft run 10 × ¼ = 2.5 in.
	await expect(page.getByLabel('Resulting pitch')).toContainText('2.08 %');
	await expect(page.getByLabel('Resulting pitch')).toContainText('2.5 in');

	await goTo(page, 'Build-up');
	await fillStep(page, typed);
	// Depths out of range stay in the field, marked, with the range and unit; typing a good one clears it.
	// Bounds: boards 2–16 in, the trench 2–24 in below the slab (common practice, no published source).
	for (const [id, bad, why] of [
		['custom-depth', '1', 'Enter the board depth, 2–16 in.'],
		['custom-depth', '17', 'Enter the board depth, 2–16 in.'],
		['edge-depth', '1', 'Enter the trench depth below the slab, 2–24 in.'],
		['edge-depth', '25', 'Enter the trench depth below the slab, 2–24 in.']
	]) {
		const field = stepBody(page).locator(`#${id}`);
		await field.fill(bad);
		await field.blur();
		await expect(field).toHaveValue(bad);
		await expect(field).toHaveAttribute('aria-invalid', 'true');
		await expect(stepBody(page).locator(`#${id}-error`)).toHaveText(why);
		await field.fill(typed[id]);
		await field.blur();
		await expect(field).not.toHaveAttribute('aria-invalid');
		await expect(stepBody(page).locator(`#${id}-error`)).toHaveCount(0);
	}
	await goTo(page, 'Crew');
	await fillStep(page, typed);
	await goTo(page, 'Review');
	return typed;
}

/** Every input and select value of every step, as shown, keyed by id. */
async function readEveryStep(page: Page, skip = /^shape-/) {
	const seen: Record<string, string> = {};
	for (const title of ['Site', 'Outline', 'Pitch', 'Build-up', 'Crew']) {
		await goTo(page, title);
		for (const el of await stepBody(page).locator('input[type=number], select').all()) {
			const id = (await el.getAttribute('id')) ?? (await el.getAttribute('aria-label'))!;
			if (!skip.test(id)) seen[`${title}:${id}`] = await el.inputValue();
		}
	}
	return seen;
}

test('a new visitor types into every field of every step: no page error, and the results follow', async ({ page }) => {
	test.setTimeout(300_000);
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await expect(page.getByRole('heading', { name: '1. Site' })).toBeVisible();
	const before = await page.getByTestId('result-bags').textContent();
	// A pour day already gone gets a note; a day ahead does not.
	await page.locator('#pour-date').fill('2020-05-04');
	await expect(page.getByTestId('pour-date-past')).toContainText('This day has passed');
	await page.locator('#pour-date').fill(`${new Date().getFullYear() + 1}-05-04`);
	await expect(page.getByTestId('pour-date-past')).toHaveCount(0);
	await page.locator('#pour-date').fill('');
	const typed = await fillEveryStep(page);
	expect(Object.keys(typed).length).toBeGreaterThan(70);
	// Thicker slab, larger area: more bags than the starter's 12 × 10 × 4 in.
	expect(Number(await page.getByTestId('result-bags').textContent())).toBeGreaterThan(Number(before));
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'local');
	// The visitor's plan is shown whole, and the way to keep it is offered.
	await expect(page.getByTestId('account-offer')).toBeVisible();
	await expect(page.getByRole('heading', { name: 'Stake marks' })).toBeVisible();
	await expect(page.getByRole('heading', { name: 'Mixing plan' })).toBeVisible();
	// Kept in this browser: a reload shows every value again.
	const shown = await readEveryStep(page);
	await page.reload();
	expect(await readEveryStep(page)).toEqual(shown);
	expect(errors).toEqual([]);
});

test('signed out, a field out of range and every edit after it are kept through a reload', async ({ page }) => {
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await goTo(page, 'Build-up');
	// 40 in is past the engine's 2–12 in, so the plan is refused while it stands.
	const thickness = stepBody(page).locator('#thickness');
	await thickness.fill('40');
	await thickness.blur();
	await expect(thickness).toHaveAttribute('aria-invalid', 'true');
	await goTo(page, 'Crew');
	await stepBody(page).locator('#people').fill('3');
	await stepBody(page).locator('#people').blur();
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'local');
	await reloadHydrated(page);
	await goTo(page, 'Crew');
	await expect(stepBody(page).locator('#people')).toHaveValue('3');
	await goTo(page, 'Build-up');
	await expect(stepBody(page).locator('#thickness')).toHaveValue('40');
	await expect(stepBody(page).locator('#thickness')).toHaveAttribute('aria-invalid', 'true');
	// Mended, the plan computes again from what was kept.
	await stepBody(page).locator('#thickness').fill('5');
	await stepBody(page).locator('#thickness').blur();
	await expect(stepBody(page).locator('#thickness')).not.toHaveAttribute('aria-invalid');
	await expect(page.getByTestId('result-bags')).toHaveText(/^\d+$/);
	expect(errors).toEqual([]);
});

test('signed in, every typed value is saved and comes back after a reload', async ({ page }) => {
	test.setTimeout(300_000);
	const errors = watchErrors(page);
	await newPlanSignedUp(page, { name: 'Wes Fielding', label: 'fields', password: 'every-field-typed' });
	const typed = await fillEveryStep(page);
	await savedPlanId(page);
	const shown = await readEveryStep(page);
	for (const [id, v] of Object.entries(typed)) {
		if (id.startsWith('shape-')) continue;
		const key = Object.keys(shown).find((k) => k.endsWith(`:${id.replace(/^select:/, '')}`));
		if (key) expect(Number(shown[key]) || shown[key], id).toEqual(Number(v) || v);
	}
	await page.reload();
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'saved');
	expect(await readEveryStep(page)).toEqual(shown);
	expect(errors).toEqual([]);
});

test('units imperial → metric → imperial leave every typed value unchanged', async ({ page }) => {
	test.setTimeout(300_000);
	const errors = watchErrors(page);
	await page.goto('/plans/new');
	await fillEveryStep(page);
	const shown = await readEveryStep(page, /^$/);
	const bags = await page.getByTestId('result-bags').textContent();
	await goTo(page, 'Site');
	await page.getByLabel('metres and millimetres').check();
	await goTo(page, 'Build-up');
	await expect(page.getByLabel('Thickness')).toHaveValue('127'); // 5 in × 25.4 = 127 mm (exact inch)
	// In metric every field, the shape sizes included, reads to the millimetre: no float noise.
	const metric = await readEveryStep(page, /^$/);
	for (const [id, v] of Object.entries(metric)) expect(v.split('.')[1]?.length ?? 0, `${id} = ${v}`).toBeLessThanOrEqual(3);
	// The crew step (on screen after the read) words its hints in the plan's units alone.
	const crew = stepBody(page);
	await expect(crew.getByLabel('Minutes to wheel and place 36 kg of mix')).toBeVisible();
	await expect(crew.getByLabel('How long the mix stays workable at 21 °C')).toBeVisible();
	await expect(crew).toContainText('0.019 m³ per 40 kg'); // 0.60 ft³ per 80 lb × 0.0283 m³/ft³ × 40 ÷ 36.29 kg (bag labels)
	// No step of a metric plan words a figure in imperial units.
	for (const title of ['Site', 'Outline', 'Pitch', 'Build-up', 'Crew']) {
		await goTo(page, title);
		await expect(stepBody(page), title).not.toContainText(/\d\s?(lb|°F|psi|mph|yd³|ft²|ft³|gal|ft)\b|\d\s?in\b(?! two)/);
	}
	await goTo(page, 'Outline');
	// The outline was moved off the rectangle's origin, so the shape form keeps what was typed
	// there, converted: 14 ft × 0.3048 = 4.2672 → 4.267 m; the edge A–B is 15 ft = 4.572 m.
	await expect(page.locator('#shape-length')).toHaveValue('4.267');
	await expect(page.getByLabel('Length of edge A–B in m')).toHaveValue('4.572');
	await goTo(page, 'Site');
	await page.getByLabel('feet and inches').check();
	expect(await readEveryStep(page, /^$/)).toEqual(shown);
	await expect(page.getByTestId('result-bags')).toHaveText(bags!);

	// With an outline the engine refuses, the switch says why and the units stay.
	await goTo(page, 'Outline');
	await page.getByLabel('Length of edge A–B in ft').fill('0');
	await page.getByLabel('Length of edge A–B in ft').blur();
	await page.getByRole('button', { name: 'Section 1, corner B,' }).focus();
	for (let i = 0; i < 15; i++) await page.keyboard.press('Shift+ArrowLeft');
	await goTo(page, 'Site');
	await page.getByLabel('metres and millimetres').click(); // refused: the radio goes back
	await expect(page.getByTestId('units-message')).toContainText('The units stay as they are');
	await expect(page.getByLabel('feet and inches')).toBeChecked();
	await expect(page.getByLabel('High point of the slab below it by')).toHaveValue('1.5');
	expect(errors).toEqual([]);
});
