// The yard pages on a desktop screen (1366 × 768) and on paper: the pour-day page keeps a phone-wide
// column instead of stretching its buttons and fields across the window, the layout drawing uses the
// card's width, and a printed pour-day page or plan holds the record, not the controls.
import { expect, test } from '@playwright/test';
import { signUp, uniqueEmail, watchErrors } from './helpers';
import { axeClean, noSidewaysScroll, rectanglePlan } from './yard-helpers';

test.describe.configure({ timeout: 240_000 });

const input = rectanglePlan(12, 10, { airTemp: 70, house: true });

test('the pour-day page and the plan read well on a desktop screen and on paper', async ({ page }) => {
	await page.setViewportSize({ width: 1366, height: 768 });
	const errors = watchErrors(page);
	await signUp(page, { name: 'Desk Tester', email: uniqueEmail('desk'), password: 'a long desk password 42' });
	const created = await page.request.post('/api/plans', { data: { name: 'Desk patio', postcode: '97321', input } });
	expect(created.status()).toBe(201);
	const planId: string = (await created.json()).plan.id;

	// The layout drawing spreads over the card at this width (it was held to 768 px, its stake numbers about 8 px tall).
	await page.goto(`/plans/${planId}`);
	const sheet = page.getByTestId('layout-sheet');
	const drawing = (await page.getByTestId('layout-drawing').boundingBox())!;
	expect(drawing.width).toBeGreaterThan(800);
	expect(drawing.width).toBeLessThanOrEqual((await sheet.boundingBox())!.width);
	await noSidewaysScroll(page);

	// The pour page: one column about a phone wide; the one-tap buttons and fields stay in it.
	await page.getByTestId('pour-link').click();
	await page.waitForURL(`**/plans/${planId}/pour`);
	const pour = page.getByTestId('pour-0');
	await pour.getByRole('button', { name: /^Start/ }).click();
	const add = pour.getByTestId('add-batch');
	await add.click();
	await expect(pour.getByTestId('batch-count')).toHaveText('1');
	for (const box of [await pour.boundingBox(), await add.boundingBox(), await page.getByRole('button', { name: 'Log temperature' }).boundingBox()])
		expect(box!.width).toBeLessThanOrEqual(672);
	await page.getByLabel('Day’s low and high').check();
	await page.getByTestId('temp-low').fill('45');
	await page.getByTestId('temp-high').fill('61');
	await page.getByRole('button', { name: 'Log temperature' }).click();
	await expect(page.getByText('Temperature logged.')).toBeVisible();
	await page.getByRole('textbox', { name: /^Note/ }).fill('Forms checked, base damp.');
	await page.getByRole('button', { name: 'Log note' }).click();
	await expect(page.getByTestId('sync-state')).toHaveText('All records sent.', { timeout: 30_000 });
	await noSidewaysScroll(page);
	await axeClean(page);

	// On paper the pour page is the record: counts, readings and notes, without the buttons and forms.
	await page.emulateMedia({ media: 'print' });
	await expect(pour.getByTestId('batch-count')).toHaveText('1');
	await expect(page.getByTestId('temp-list')).toContainText('low 45 °F, high 61 °F');
	await expect(page.getByText('Forms checked, base damp.')).toBeVisible();
	for (const hidden of [
		add,
		page.getByRole('button', { name: 'Log temperature' }),
		page.getByRole('button', { name: 'Log note' }),
		page.getByRole('button', { name: 'Log bags used' })
	])
		await expect(hidden).toBeHidden();
	await expect(page.getByRole('heading', { name: 'Photos' })).toBeHidden();
	await page.emulateMedia({ media: 'screen' });

	// The plan on paper: the comparison with the log prints, without its closed "Daily temperatures used" toggle.
	await page.goto(`/plans/${planId}`);
	const logged = page.getByTestId('planned-vs-logged');
	await expect(logged.getByText('Daily temperatures used')).toBeVisible();
	await page.emulateMedia({ media: 'print' });
	await expect(logged.getByRole('heading', { name: 'Planned and as logged' })).toBeVisible();
	await expect(logged.getByText('Daily temperatures used')).toBeHidden();
	await page.emulateMedia({ media: 'screen' });
	await axeClean(page);
	expect(errors).toEqual([]);
});
