// Shared by the yard journeys (offline, desktop and print): a plain rectangular pad, the axe check,
// the sideways-scroll check and the wait for the offline worker.
import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';

/** A `width` × `depth` ft pad, two people mixing by hand, at `airTemp` °F, against the house when asked. */
export const rectanglePlan = (width: number, depth: number, o: { airTemp: number; house: boolean }) => ({
	units: 'imperial',
	sections: [
		{
			outline: [
				[0, 0],
				[width, 0],
				[width, depth],
				[0, depth]
			]
		}
	],
	houseEdge: o.house ? { section: 0, edge: 0 } : null,
	crew: { people: 2, method: 'hand' },
	conditions: { airTemp: o.airTemp, humidity: 50, wind: 5 }
});

export const axeClean = async (page: Page) => expect((await new AxeBuilder({ page }).analyze()).violations).toEqual([]);

export const noSidewaysScroll = async (page: Page) =>
	expect(await page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth)).toBe(true);

/**
 * Waits until the offline worker has kept every address given, then reloads once so the page itself
 * is controlled by the worker (the first visit came before it registered).
 */
export async function keptOffline(page: Page, addresses: string[]) {
	await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
	await expect
		.poll(
			() =>
				page.evaluate(async (list) => {
					const kept = await caches.open('plan-pages');
					for (const a of list) if (!(await kept.match(a))) return false;
					return true;
				}, addresses),
			{ timeout: 30_000 }
		)
		.toBe(true);
	await page.reload();
	await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller)).toBe(true);
}
