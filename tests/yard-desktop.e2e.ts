// The yard pages on a desktop screen (1366 × 768) and on paper: the pour-day page keeps a phone-wide
// column instead of stretching its buttons and fields across the window, the layout drawing uses the
// card's width, and a printed pour-day page or plan holds the record, not the controls.
import { expect, test } from '@playwright/test';
import { hydrated, signUp, uniqueEmail, watchErrors } from './helpers';
import { axeClean, noSidewaysScroll, rectanglePlan } from './yard-helpers';

test.describe.configure({ timeout: 240_000 });

const inUtc = (o: Intl.DateTimeFormatOptions) => (iso: string) =>
	new Intl.DateTimeFormat('en-US', { ...o, timeZone: 'UTC' }).format(new Date(`${iso}T00:00:00Z`));
const longDay = inUtc({ weekday: 'short', month: 'short', day: 'numeric', year: 'numeric' });
const shortDay = inUtc({ dateStyle: 'medium' });

/** The device's date `days` from now, YYYY-MM-DD. */
const dayFromNow = (days: number) => {
	const d = new Date(Date.now() + days * 86_400_000);
	return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 10);
};
// Planned a week out: the pour page says what starting early does, and a start taken back dates nothing.
const pourDate = dayFromNow(7);
const base = rectanglePlan(12, 10, { airTemp: 70, house: true });
const input = { ...base, conditions: { ...base.conditions, pourDate } };

test('the pour-day page and the plan read well on a desktop screen and on paper', async ({ page }) => {
	await page.setViewportSize({ width: 1366, height: 768 });
	const errors = watchErrors(page);
	// Installed on a laptop, the app is not held upright, and it does not call the device a phone.
	const manifest = await (await page.request.get('/manifest.webmanifest')).json();
	expect(manifest.orientation).toBe('any');
	expect(manifest.description).not.toMatch(/phone/i);
	await signUp(page, { name: 'Desk Tester', email: uniqueEmail('desk'), password: 'a long desk password 42' });
	const created = await page.request.post('/api/plans', { data: { name: 'Desk patio', postcode: '97321', input } });
	expect(created.status()).toBe(201);
	const planId: string = (await created.json()).plan.id;

	// The layout drawing stays inside its card at this width (its stake ids read at 12 px here: plan-sheets.e2e).
	await page.goto(`/plans/${planId}`);
	const sheet = page.getByTestId('layout-sheet');
	await sheet.getByRole('button', { name: 'Show the layout sheet' }).click();
	await expect(page.getByTestId('layout-drawing')).toBeVisible();
	const drawing = (await page.getByTestId('layout-drawing').boundingBox())!;
	expect(drawing.width).toBeGreaterThan(600);
	expect(drawing.width).toBeLessThanOrEqual((await sheet.boundingBox())!.width);
	await noSidewaysScroll(page);

	// The pour page: one column about a phone wide; the one-tap buttons and fields stay in it.
	await page.getByTestId('pour-link').click();
	await page.waitForURL(`**/plans/${planId}/pour`);
	await hydrated(page);
	const pour = page.getByTestId('pour-0');
	const start = pour.getByRole('button', { name: /^Start/ });
	const add = pour.getByTestId('add-batch');
	// A week before the planned day (the card names it), the page says what starting now would move.
	await expect(pour).toContainText(`planned for ${longDay(pourDate)}`);
	await expect(pour.getByTestId('start-date-note')).toHaveText(
		'Not the planned day: starting it today counts the curing days, the reminders and the calendar from today instead.'
	);
	// With the keyboard: Start gives way to +1 batch, and the keyboard's place goes with it.
	await start.focus();
	await page.keyboard.press('Enter');
	await expect(add).toBeFocused();
	// Started by mistake: taken back, the pour is not started and the plan's dates stay the planned ones.
	await pour.getByRole('button', { name: 'Take back the start' }).focus();
	await page.keyboard.press('Enter');
	await expect(start).toBeFocused();
	await expect(page.getByTestId('sync-state')).toHaveText('Nothing logged now: the take-back is sent too.', { timeout: 30_000 });
	await page.goto(`/plans/${planId}`);
	await expect(page.getByTestId('planned-vs-logged')).toContainText('Nothing logged yet');
	await expect(page.getByTestId('ics-dates')).toContainText(`dated from the planned first pour, ${shortDay(pourDate)}.`);
	await page.goBack();
	await hydrated(page);
	await start.focus();
	await page.keyboard.press('Enter');
	await expect(add).toBeFocused();
	await page.keyboard.press('Enter');
	await expect(pour.getByTestId('batch-count')).toHaveText('1');
	// "Placing done" by mistake is taken back the same way; the keyboard stays with the pour.
	await pour.getByRole('button', { name: 'Placing done' }).focus();
	await page.keyboard.press('Enter');
	await expect(pour.getByTestId('placing-done')).toBeFocused();
	await pour.getByRole('button', { name: 'Take back “Placing done”' }).click();
	await expect(pour.getByRole('button', { name: 'Placing done' })).toBeFocused();
	await expect(pour.getByTestId('placing-done')).toHaveCount(0);
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
	// The photo picker (a hidden file input in a button-like label) shows where the keyboard is.
	await page.getByRole('link', { name: 'the plan page' }).focus();
	await page.keyboard.press('Tab');
	await expect(page.getByTestId('photo-input')).toBeFocused();
	const picker = page.locator('label', { has: page.getByTestId('photo-input') });
	expect(await picker.evaluate((l) => getComputedStyle(l).outlineStyle)).toBe('solid');

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
	await hydrated(page);
	// With a mouse, photos can be dropped on the box, and it says so.
	await expect(page.getByRole('region', { name: 'Add site photos' }).getByTestId('drop-hint')).toHaveText('Drop photos of the site here');
	// The plan page's photo picker shows its focus too.
	await page.getByRole('region', { name: 'Add site photos' }).getByTestId('photo-input').focus();
	await page.keyboard.press('Shift+Tab');
	await page.keyboard.press('Tab');
	expect(
		await page
			.getByRole('region', { name: 'Add site photos' })
			.locator('label')
			.evaluate((l) => getComputedStyle(l).outlineStyle)
	).toBe('solid');
	const logged = page.getByTestId('planned-vs-logged');
	await expect(logged.getByText('Daily temperatures used')).toBeVisible();
	await page.emulateMedia({ media: 'print' });
	await expect(logged.getByRole('heading', { name: 'Planned and as logged' })).toBeVisible();
	await expect(logged.getByText('Daily temperatures used')).toBeHidden();
	await page.emulateMedia({ media: 'screen' });
	await axeClean(page);

	// The pour page opened three days after a pour (logged on another device): the clock stopped when
	// placing was done, 70 min after the first batch, and the finishing windows name their day.
	const other = await page.request.post('/api/plans', { data: { name: 'Old pour', postcode: '97321', input: base } });
	const otherId: string = (await other.json()).plan.id;
	const t0 = Date.now() - 3 * 86_400_000;
	const rec = (kind: string, minutes: number, i: number) => ({ kind, key: `old-pour-${kind}-${i}`, at: t0 + minutes * 60_000, tz: 0, pour: 0 });
	const sent = await page.request.post(`/plans/${otherId}/pour/records`, {
		data: {
			records: [
				rec('start', 0, 0),
				rec('batch', 5, 1),
				rec('batch', 40, 2),
				rec('end', 75, 3),
				// Three cold days from the pour on (28–40 °F against the plan's 70 °F).
				...[0, 1, 2].map((d) => ({
					kind: 'temp',
					key: `old-pour-temp-${d}`,
					at: t0 + d * 86_400_000 + 120 * 60_000,
					tz: 0,
					date: new Date(t0 + d * 86_400_000).toISOString().slice(0, 10),
					unit: 'F',
					low: 28,
					high: 40
				}))
			]
		}
	});
	expect(sent.status()).toBe(200);
	await page.goto(`/plans/${otherId}/pour`);
	await hydrated(page);
	const old = page.getByTestId('pour-0');
	await expect(old.getByText('Placing took')).toBeVisible();
	await expect(old.getByText('Since first batch')).toHaveCount(0);
	await expect(old.getByTestId('elapsed')).toHaveText('1:10:00');
	const zone = await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().timeZone);
	const weekday = new Intl.DateTimeFormat('en-US', { weekday: 'short', timeZone: zone }).format(new Date(t0 + 75 * 60_000 + 30 * 60_000));
	const windows = old.getByRole('listitem').filter({ hasText: 'bleed water' });
	await expect(windows).toContainText(new RegExp(`^${weekday}, [A-Z][a-z]{2} \\d{1,2}, \\d{1,2}:\\d{2}`));
	await expect(old.getByTestId('placing-done')).toContainText(new RegExp(`Placing done at [A-Z][a-z]{2}, [A-Z][a-z]{2} \\d{1,2}, \\d{1,2}:\\d{2}`));
	// The plan page says how much later than planned the cold days make each milestone.
	await page.goto(`/plans/${otherId}`);
	await expect(page.getByTestId('planned-vs-logged').getByTestId('logged-walk')).toContainText(/\(\d+ more days? than planned\)$/);
	expect(errors).toEqual([]);
});
