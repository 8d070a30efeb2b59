// Offline, a plan that was never opened on this device has no kept copy: the service worker answers
// with Stakeline's own offline page (what works and what does not, and links to the plans kept
// here) instead of the browser's error page, whether the address is typed or a link is followed.
import { expect, test, type Page } from '@playwright/test';
import { signUp, uniqueEmail, watchErrors } from './helpers';
import { axeClean, keptOffline, noSidewaysScroll, rectanglePlan } from './yard-helpers';

test.describe.configure({ timeout: 240_000 });

const input = rectanglePlan(10, 8, { airTemp: 65, house: false });

/** The offline page's parts a reader relies on. */
async function expectOfflinePage(page: Page, nowhere: string) {
	await expect(page.getByRole('heading', { level: 1, name: 'No connection' })).toBeVisible();
	await expect(page.getByTestId('offline-page')).toHaveText('This page is not kept on this device, so it cannot open without a connection.');
	const kept = page.getByTestId('kept-plans');
	await expect(kept.getByRole('link', { name: 'Kept patio' })).toBeVisible();
	await expect(kept.getByRole('link', { name: 'pour day' })).toHaveCount(1);
	await expect(kept.getByText(nowhere)).toHaveCount(0);
	await expect(page.getByRole('heading', { name: 'Needs a connection' })).toBeVisible();
	await expect(
		page.getByText(
			'Plans never opened on this device, editing a plan, bids and messages, and adding photos from the plan page (the pour-day page keeps them until the connection returns).'
		)
	).toBeVisible();
	await expect(page.getByRole('link', { name: 'Try again' })).toBeVisible();
}

test('offline, a plan never opened here shows our offline page with the plans kept on the phone', async ({ page, context }) => {
	await page.setViewportSize({ width: 390, height: 844 });
	const errors = watchErrors(page);
	await signUp(page, { name: 'Offline Tester', email: uniqueEmail('offline'), password: 'a long offline password 42' });
	const create = async (name: string) => {
		const res = await page.request.post('/api/plans', { data: { name, postcode: '97321', input } });
		expect(res.status()).toBe(201);
		return (await res.json()).plan.id as string;
	};
	const kept = await create('Kept patio');
	const never = await create('Never opened pad');

	// Online: open one plan only. Its layout registers the worker, which keeps its pages and the list.
	await page.goto(`/plans/${kept}`);
	await expect(page.getByTestId('plan-title')).toHaveText('Kept patio');
	await keptOffline(page, [`/plans/${kept}`, `/plans/${kept}/pour`, '/plans']);

	await context.setOffline(true);

	// The address of the plan never opened, typed in: our page, not the browser's, with a 503.
	const answer = await page.goto(`/plans/${never}`);
	expect(answer?.status()).toBe(503);
	await expectOfflinePage(page, 'Never opened pad');
	await noSidewaysScroll(page);
	await axeClean(page);

	// Its link leads to the kept plan, which reads offline as before.
	await page.getByTestId('kept-plans').getByRole('link', { name: 'Kept patio' }).click();
	await expect(page.getByTestId('plan-title')).toHaveText('Kept patio');
	await expect(page.getByTestId('offline-note')).toContainText('Offline — as of');

	// From the kept list, following the link of the plan never opened (a client-side navigation) ends on the same page.
	await page.goto('/plans');
	await expect(page.getByTestId('offline-note')).toBeVisible();
	await page.getByRole('link', { name: 'Never opened pad' }).first().click();
	await page.waitForURL(`**/plans/${never}`);
	await expectOfflinePage(page, 'Never opened pad');

	// A page that is never kept (the editor of the kept plan) gets it too, and its pour-day link works offline.
	await page.goto(`/plans/${kept}/edit`);
	await expectOfflinePage(page, 'Never opened pad');
	await page.getByTestId('kept-plans').getByRole('link', { name: 'pour day' }).click();
	await page.waitForURL(`**/plans/${kept}/pour`);
	await expect(page.getByTestId('pour-0')).toBeVisible();

	// Back online, "Try again" opens the plan itself.
	await page.goto(`/plans/${never}`);
	await expectOfflinePage(page, 'Never opened pad');
	await context.setOffline(false);
	await page.getByRole('link', { name: 'Try again' }).click();
	await expect(page.getByTestId('plan-title')).toHaveText('Never opened pad');
	expect(errors).toEqual([]);
});
