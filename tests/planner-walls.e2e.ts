import { expect, test, type Page } from '@playwright/test';
import { newPlanSignedUp, openHydrated, savedPlanId as saved, watchErrors, wizardStep as goTo } from './helpers';

const wallBox = (page: Page, edge: string) => page.getByLabel(`House wall along edge ${edge}`);
const housesDrawn = (page: Page) => page.locator('svg line[data-house]');

test('an L around a house corner keeps both walls through save, reload, a split and the plan page', async ({ page }) => {
	test.setTimeout(120_000);
	const errors = watchErrors(page);
	await newPlanSignedUp(page, { name: 'Cora Nook', label: 'corner', password: 'around-the-corner' });
	await goTo(page, 'Outline');
	await page.getByLabel('L-shape (notched corner)').check();
	await page.getByLabel('Length (A–B)').fill('24');
	await page.getByLabel('Width (B–C side)').fill('18');
	await page.getByLabel('Notch length (C–D)').fill('8');
	await page.getByLabel('Notch width (D–E)').fill('6');
	await page.getByLabel('Around a house corner').check();
	await expect(page.getByTestId('preset-state')).toContainText('Not applied yet');
	await page.getByRole('button', { name: 'Use this L-shape' }).click();
	await expect(page.getByTestId('preset-state')).toContainText('This is the outline now');
	await expect(page.getByTestId('result-area')).toHaveText('384 ft²'); // 24 × 18 − 8 × 6 = 432 − 48
	await expect(wallBox(page, 'C–D')).toBeChecked();
	await expect(wallBox(page, 'D–E')).toBeChecked();
	await expect(wallBox(page, 'A–B')).not.toBeChecked();
	await expect(housesDrawn(page)).toHaveCount(2);
	// Revisiting the step shows the sizes that were applied, not the form's own defaults.
	await goTo(page, 'Pitch');
	// The High side list names each edge once: the default (the first wall) leads, and is not listed again.
	await expect(page.getByLabel('High side').locator('option')).toHaveText([
		'Along the first house wall (edge C–D)',
		'edge A–B',
		'edge B–C',
		'edge D–E (house wall)',
		'edge E–F',
		'edge F–A'
	]);
	// The preset starts with a cross fall, so water runs away from both walls (IRC R401.3).
	await expect(page.getByLabel('Cross fall')).toHaveValue('2');
	const pitch = page.getByLabel('Resulting pitch');
	await expect(pitch.getByText('Away from wall C–D')).toBeVisible();
	await expect(pitch.getByText('Away from wall D–E')).toBeVisible();
	await expect(pitch).not.toContainText('toward the house');
	await page.getByLabel('Cross fall').fill('-2');
	await expect(pitch).toContainText('2 % toward the house');
	await expect(pitch.getByRole('link', { name: 'Cross fall' })).toBeVisible();
	await page.getByLabel('Cross fall').fill('2');
	await expect(pitch).not.toContainText('toward the house');
	await goTo(page, 'Outline');
	await expect(page.getByLabel('Length (A–B)')).toHaveValue('24');
	await expect(page.getByLabel('Notch width (D–E)')).toHaveValue('6');

	const id = await saved(page);
	const stored = (await (await page.request.get(`/api/plans/${id}`)).json()).plan.input;
	expect([stored.houseEdge, ...stored.otherHouseEdges]).toEqual([
		{ section: 0, edge: 2 },
		{ section: 0, edge: 3 }
	]);
	await page.reload();
	await goTo(page, 'Outline');
	await expect(wallBox(page, 'C–D')).toBeChecked();
	await expect(wallBox(page, 'D–E')).toBeChecked();

	// Two pours: the cut runs across the long side; both walls stay walls on the pour beside them.
	await page.getByRole('button', { name: 'Split pour 1 in two' }).click();
	await expect(page.getByRole('tab', { name: 'Pour 2' })).toBeVisible();
	await expect(housesDrawn(page)).toHaveCount(2);
	await expect(page.getByTestId('result-area')).toHaveText('384 ft²');
	await saved(page);
	const split = (await (await page.request.get(`/api/plans/${id}`)).json()).plan;
	const walls = [split.input.houseEdge, ...split.input.otherHouseEdges];
	expect(walls).toHaveLength(2);
	// Each wall is still 8 ft and 6 ft long, as the notch was.
	const lengths = walls.map((w: { section: number; edge: number }) => {
		const o = split.input.sections[w.section].outline;
		const [a, b] = [o[w.edge], o[(w.edge + 1) % o.length]];
		return Math.hypot(b[0] - a[0], b[1] - a[1]);
	});
	expect(lengths.sort()).toEqual([6, 8]);

	await page.goto(`/plans/${id}`);
	await expect(housesDrawn(page)).toHaveCount(2);
	expect(errors).toEqual([]);
});

test('a freestanding shed pad with a chosen high edge, in two pours, saved and reloaded', async ({ page }) => {
	test.setTimeout(120_000);
	const errors = watchErrors(page);
	await newPlanSignedUp(page, { name: 'Shay Padd', label: 'pad', password: 'freestanding-pad' });
	await goTo(page, 'Outline');
	await page.getByLabel('Length (A–B)').fill('10');
	await page.getByLabel('Width (B–C side)').fill('12');
	await page.getByLabel('None: a freestanding pad').check();
	await page.getByRole('button', { name: 'Use this rectangle' }).click();
	await expect(page.getByLabel('Freestanding: no house wall along the slab (a shed pad, a path)')).toBeChecked();
	await expect(housesDrawn(page)).toHaveCount(0);

	await goTo(page, 'Pitch');
	// Freestanding, the default is the first edge, listed once.
	await expect(page.getByLabel('High side').locator('option')).toHaveText(['edge A–B (first edge)', 'edge B–C', 'edge C–D', 'edge D–A']);
	await page.getByLabel('High side').selectOption({ label: 'edge C–D' });
	await page.getByLabel('Fall', { exact: true }).fill('1');
	// 1 % over the 12 ft from C–D to A–B: 12 × 12 in × 1 % = 1.44 in.
	await expect(page.getByLabel('Resulting pitch')).toContainText('1.44 in');

	await goTo(page, 'Outline');
	await page.getByRole('button', { name: 'Split pour 1 in two' }).click();
	await expect(page.getByRole('tab', { name: 'Pour 2' })).toBeVisible();
	const id = await saved(page);
	await page.reload();
	await goTo(page, 'Pitch');
	// The cut runs across the 12 ft side: the old C–D is now the second pour's edge B–C.
	await expect(page.getByLabel('High side').locator('option:checked')).toHaveText('pour 2, edge B–C');
	await expect(page.getByLabel('Resulting pitch')).toContainText('1.44 in');
	const record = (await (await page.request.get(`/api/plans/${id}`)).json()).plan;
	const stored = record.input;
	// The edges the two pours share lie inside the slab: the list does not offer them as a high side.
	const inside = (record.result.geometry.sections as { edges: { kind: string }[] }[]).flatMap((sec, s) =>
		sec.edges.flatMap((e, i) => (e.kind === 'coldJoint' ? [`${s}:${i}`] : []))
	);
	expect(inside).toHaveLength(2);
	const offered = await page
		.getByLabel('High side')
		.locator('option')
		.evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
	expect(offered).toHaveLength(1 + 8 - 1 - 2); // the default, then the eight edges less the default and the two inside
	for (const v of inside) expect(offered).not.toContain(v);
	expect(stored.houseEdge).toBeNull();
	expect(stored.sections).toHaveLength(2);
	expect(stored.slope.highEdge).toEqual({ section: 1, edge: 1 });
	expect(errors).toEqual([]);
});

test('with every edge a house wall there is no trench, so chunks are not offered; a plan that loses its trench can let them go', async ({ page }) => {
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await goTo(page, 'Build-up');
	await page.locator('#edges').selectOption('free');
	const chunks = page.getByLabel('Lay broken concrete chunks in the trench');
	await chunks.check();
	await expect(page.getByTestId('no-trench')).toHaveCount(0);
	// Walls on all four sides (a slab filling a courtyard): no edge is thickened any more.
	await goTo(page, 'Outline');
	await expect(wallBox(page, 'A–B')).toBeChecked();
	for (const edge of ['B–C', 'C–D', 'D–A']) await wallBox(page, edge).check();
	await goTo(page, 'Build-up');
	await expect(page.getByTestId('no-trench')).toBeVisible();
	// Still ticked, so still shown, with the engine's reason, until the visitor lets the chunks go.
	await expect(page.locator('#fill-share-error')).toHaveText('Chunk fill goes in a thickened-edge trench, and this plan has none.');
	await chunks.click(); // not uncheck(): the box goes as it is cleared, and uncheck() waits to see it cleared
	await expect(chunks).toHaveCount(0);
	await expect(page.getByTestId('result-bags')).toHaveText(/^\d+$/);
	// One edge away from the house again: the trench, and the offer, come back.
	await goTo(page, 'Outline');
	await wallBox(page, 'C–D').uncheck();
	await goTo(page, 'Build-up');
	await expect(page.getByTestId('no-trench')).toHaveCount(0);
	await expect(chunks).not.toBeChecked();
	expect(errors).toEqual([]);
});

test('the pitch step’s advice for a wall that drains toward the house fits where the wall lies', async ({ page }) => {
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await goTo(page, 'Pitch');
	const wall = page.getByLabel('Resulting pitch').locator('div', { hasText: 'Away from wall A–B' });
	// High side opposite the wall: the fall runs straight at it; only moving the high side helps.
	await page.getByLabel('High side').selectOption({ label: 'edge C–D' });
	await expect(wall).toContainText('toward the house');
	await expect(wall).toContainText('Choose this wall as High side');
	await expect(wall).not.toContainText('Cross fall');
	// High side square to the wall: the wall is level, and a cross fall runs water off it.
	await page.getByLabel('High side').selectOption({ label: 'edge B–C' });
	await expect(wall).toContainText('Level: no fall');
	await expect(wall).toContainText('Set a Cross fall (or choose this wall as High side)');
	// Positive runs toward C, away from wall A–B: 2.5 % meets the 2 % of IRC R401.3.
	await page.getByLabel('Cross fall').fill('2.5');
	await page.getByLabel('Cross fall').blur();
	await expect(wall).toContainText('2.5 % ✓ IRC R401.3');
	// The same cross fall the other way runs water at the wall: the advice is to turn it round, not to set one.
	await page.getByLabel('Cross fall').fill('-2.5');
	await page.getByLabel('Cross fall').blur();
	await expect(wall).toContainText('2.5 % toward the house');
	await expect(wall).toContainText('The Cross fall runs water toward this wall or too little off it: try it the other way (the opposite sign)');
	await expect(wall).not.toContainText('Set a Cross fall');
	expect(errors).toEqual([]);
});
