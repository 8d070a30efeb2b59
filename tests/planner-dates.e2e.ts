import { expect, test, type Page } from '@playwright/test';
import { openHydrated, watchErrors } from './helpers';

// The first pour day as a visitor types it into the date box (month, day, year in en-US). The
// year part takes up to six digits, so 0612192027 gives 192027-06-12, not an ISO date.
async function typeDate(page: Page, keys: string) {
	const box = page.locator('#pour-date');
	await box.fill('');
	await box.blur();
	await box.focus(); // an empty box starts at the month
	await page.keyboard.type(keys);
	await box.blur();
}

test('a pour day with a six-digit year: ticking the day-by-day forecast is no page error, and the days come back once the date is real', async ({ page }) => {
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	await typeDate(page, '0612192027');
	await expect(page.locator('#pour-date')).toHaveValue('192027-06-12');
	await page.getByLabel('Enter the forecast day by day').check();
	const days = page.getByRole('table', { name: 'Forecast by day' }).getByRole('rowheader');
	// No date beside a day while the pour day is not a real one.
	await expect(days).toHaveText(['1', '2', '3', '4', '5', '6', '7']);
	await typeDate(page, '06122027');
	await expect(page.locator('#pour-date')).toHaveValue('2027-06-12');
	await expect(days.first()).toHaveText('1 · 2027-06-12');
	await expect(days.last()).toHaveText('7 · 2027-06-18');
	expect(errors).toEqual([]);
});

test('a pour day too far ahead says so, under the field and in the step’s list alike, in words for a date box', async ({ page }) => {
	const errors = watchErrors(page);
	await openHydrated(page, '/plans/new');
	const box = page.locator('#pour-date');
	const under = page.locator('#pour-date-error');
	const summary = page.getByTestId('step-errors');
	const tooFar = 'The pour date is too far ahead: a plan takes days up to 31 December 9999.';
	for (const [keys, value] of [
		['0612192027', '192027-06-12'], // six digits: sorts before today as text, yet is not a day gone by
		['061220277', '20277-06-12']
	]) {
		await typeDate(page, keys);
		await expect(box).toHaveValue(value);
		await expect(box).toHaveAttribute('aria-invalid', 'true');
		await expect(under).toHaveText(tooFar);
		await expect(summary).toHaveText(tooFar);
		await expect(page.getByTestId('pour-date-past')).toHaveCount(0);
		// The side panel's "marked field" is the one marked.
		await expect(page.getByTestId('results')).toContainText('Fix the marked field in the Site step to see the numbers.');
	}
	await expect(page.getByText('YYYY-MM-DD')).toHaveCount(0);
	await typeDate(page, `0612${new Date().getFullYear() + 1}`);
	await expect(box).not.toHaveAttribute('aria-invalid');
	await expect(under).toHaveCount(0);
	await expect(summary).toHaveCount(0);
	expect(errors).toEqual([]);
});
