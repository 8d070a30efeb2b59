import { expect, test } from '@playwright/test';
import { openHydrated, watchErrors, wizardStep } from './helpers';

test('undo brings back a deleted corner, redo removes it again, and Start over resets the plan', async ({ page }) => {
	test.setTimeout(90_000);
	const errors = watchErrors(page);
	await page.goto('/plans/new');
	await wizardStep(page, 'Outline');
	const corners = page.getByRole('button', { name: /^Section 1, corner / });
	await expect(corners).toHaveCount(4);
	await expect(page.getByTestId('result-area')).toHaveText('120 ft²'); // the starter: 12 × 10 ft

	await page.getByRole('button', { name: 'Delete corner B' }).click();
	await expect(corners).toHaveCount(3);
	await expect(page.getByTestId('result-area')).toHaveText('60 ft²'); // the triangle A, C, D: ½ × 12 × 10
	await page.getByRole('button', { name: 'Undo' }).click();
	await expect(corners).toHaveCount(4);
	await expect(page.getByTestId('result-area')).toHaveText('120 ft²');
	await page.getByRole('button', { name: 'Redo' }).click();
	await expect(corners).toHaveCount(3);

	// The keyboard: Delete on a focused corner, then Ctrl+Z and Shift+Ctrl+Z.
	await page.getByRole('button', { name: 'Undo' }).click();
	await page.getByRole('button', { name: /^Section 1, corner C,/ }).focus();
	await page.keyboard.press('Delete');
	await expect(corners).toHaveCount(3);
	await page.keyboard.press('Control+z');
	await expect(corners).toHaveCount(4);
	await page.keyboard.press('Control+Shift+z');
	await expect(corners).toHaveCount(3);
	await page.keyboard.press('Control+z');
	await expect(corners).toHaveCount(4);

	// A slow drag of corner C, paused halfway, is one undo step: Undo puts the outline back as it was.
	const c = page.getByRole('button', { name: /^Section 1, corner C,/ });
	const box = (await c.boundingBox())!;
	await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
	await page.mouse.down();
	await page.mouse.move(box.x + box.width / 2 + 30, box.y + box.height / 2 + 20, { steps: 5 });
	await page.waitForTimeout(1000); // a pause mid-drag, longer than the typing merge window
	await page.mouse.move(box.x + box.width / 2 + 60, box.y + box.height / 2 + 40, { steps: 5 });
	await page.mouse.up();
	await expect(page.getByTestId('result-area')).not.toHaveText('120 ft²');
	await page.getByRole('button', { name: 'Undo' }).click();
	await expect(page.getByTestId('result-area')).toHaveText('120 ft²');
	await expect(c).toHaveAccessibleName('Section 1, corner C, at 12 by 10 ft');
	await page.getByRole('button', { name: 'Redo' }).click();
	await expect(page.getByTestId('result-area')).not.toHaveText('120 ft²');
	await page.getByRole('button', { name: 'Undo' }).click();

	await wizardStep(page, 'Build-up');
	await page.getByLabel('Thickness').fill('6');
	await page.getByLabel('Thickness').press('Control+z'); // inside a field the plan's undo still applies
	await expect(page.getByLabel('Thickness')).toHaveValue('4');
	await page.getByLabel('Thickness').fill('6');
	await page.getByRole('button', { name: 'Start over' }).click();
	await expect(page.getByLabel('Thickness')).toHaveValue('4');
	await expect(page.getByTestId('result-area')).toHaveText('120 ft²');
	await page.getByRole('button', { name: 'Undo' }).click();
	await expect(page.getByLabel('Thickness')).toHaveValue('6');
	expect(errors).toEqual([]);
});

test('after a redo, undo walks back every step and a new edit can be redone', async ({ page }) => {
	test.setTimeout(60_000);
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await expect(page.getByRole('heading', { name: '1. Site' })).toBeVisible();
	const low = page.getByLabel('Expected overnight low (optional)');
	const humidity = page.getByLabel('Relative humidity');
	const undo = page.getByRole('button', { name: 'Undo' });
	const redo = page.getByRole('button', { name: 'Redo' });

	// The low is not in a new plan: once typed, it is a field the plan gained.
	await low.fill('30');
	await undo.click();
	await expect(low).toHaveValue('');
	await redo.click();
	await expect(low).toHaveValue('30');
	await expect(redo).toBeDisabled();
	await low.fill('');
	await undo.click();
	await expect(low).toHaveValue('30');
	await undo.click();
	await expect(low).toHaveValue('');
	await expect(undo).toBeDisabled(); // the plan as it opened
	await expect(redo).toBeEnabled();

	await humidity.fill('');
	await undo.click();
	await expect(humidity).toHaveValue('50');
	await expect(redo).toBeEnabled();
	await redo.click();
	await expect(humidity).toHaveValue('');
	expect(errors).toEqual([]);
});
