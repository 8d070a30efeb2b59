import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { continueAs, demoUser, openHydrated, signUp, uniqueEmail, watchErrors } from './helpers';
import { insertBid, insertPlan } from './pro-helpers';

// Three independent sweeps, so two browsers can share them (one test was the run's longest).
test.describe.configure({ mode: 'parallel', timeout: 300_000 });
test.use({ viewport: { width: 390, height: 844 } });

/** Each page: no serious or critical axe violation, nothing wider than the phone's screen. */
async function checkPage(page: Page, path: string, found: string[]) {
	await openHydrated(page, path);
	expect(page.url(), `${path} should not redirect`).toContain(path.split('?')[0]);
	const { violations } = await new AxeBuilder({ page }).analyze();
	for (const v of violations.filter((v) => v.impact === 'serious' || v.impact === 'critical'))
		found.push(`${path} ${v.id}: ${v.nodes.map((n) => n.target).join(', ')}`);
	const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
	if (scroll > client) found.push(`${path}: ${scroll} px wide on a ${client} px screen`);
	await page.screenshot({ path: `test-results/screens/phone${path.replace(/[^a-z0-9]+/gi, '-')}.png`, fullPage: true });
}

test('a homeowner’s bids pages and the approved contractor’s pages are axe-clean and fit a 390 px phone', async ({ page }) => {
	const errors = watchErrors(page);
	const found: string[] = [];
	const owner = uniqueEmail('pages');
	await signUp(page, { name: 'Pia Sandell', email: owner, password: 'narrow-screen', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	const { id: planId } = await insertPlan(owner, { name: 'Narrow walk', postcode: '97330', photo: true });
	await checkPage(page, `/plans/${planId}/bids`, found); // before sending: the contractor picker
	for (const box of await page.getByRole('checkbox').all()) await box.uncheck();
	await page.getByRole('checkbox', { name: /Ridgeback Flatwork/ }).check();
	await page.getByRole('button', { name: 'Send the plan' }).click();
	await expect(page.getByText('Sent to 1 contractor.')).toBeVisible();
	const leadId = await insertBid(planId, demoUser('contractor').email, {
		dollars: 2600,
		days: 2,
		inclusions: 'Forms, base, pour, broom finish, curing blanket for a week.'
	});
	await checkPage(page, `/plans/${planId}/bids`, found);
	await checkPage(page, `/plans/${planId}/bids/${leadId}`, found);
	await checkPage(page, '/account', found);

	await continueAs(page, demoUser('contractor').email);
	for (const path of ['/pro', '/pro/profile', '/pro/leads', `/pro/leads/${leadId}`, '/pro/billing', '/messages', '/account'])
		await checkPage(page, path, found);
	expect(found).toEqual([]);
	expect(errors).toEqual([]);
});

test('a contractor still awaiting review sees other states of the pro pages, axe-clean at 390 px', async ({ page }) => {
	const errors = watchErrors(page);
	const found: string[] = [];
	await continueAs(page, 'sam@mossgateforms.example');
	for (const path of ['/pro', '/pro/profile', '/pro/billing']) await checkPage(page, path, found);
	expect(found).toEqual([]);
	expect(errors).toEqual([]);
});

test('every admin page is axe-clean and fits a 390 px phone', async ({ page }) => {
	const errors = watchErrors(page);
	const found: string[] = [];
	await continueAs(page, demoUser('admin').email);
	await checkPage(page, '/admin', found);
	await checkPage(page, '/admin/users', found);
	// An address reads in pieces of a dozen letters or more, not a few (the table scrolls sideways instead).
	const emailWidths = await page
		.getByTestId('users-table')
		.locator('tbody td:nth-child(2)')
		.evaluateAll((tds) => tds.map((td) => td.getBoundingClientRect().width));
	expect(Math.min(...emailWidths)).toBeGreaterThanOrEqual(180);
	await checkPage(page, '/admin/users?role=contractor&status=approved&q=FH-CC', found);
	await page.getByTestId('users-table').getByRole('link', { name: 'Ridgeback Flatwork' }).click();
	await checkPage(page, new URL(page.url()).pathname, found);
	// A homeowner's page: the demo homeowner, whom this test only reads.
	const homeowner = demoUser('homeowner');
	await openHydrated(page, `/admin/users?q=${encodeURIComponent(homeowner.email)}`);
	await page.getByTestId('users-table').getByRole('link', { name: homeowner.name }).click();
	await checkPage(page, new URL(page.url()).pathname, found);
	await checkPage(page, '/admin/audit', found);
	await checkPage(page, '/admin/audit?action=approve&from=2020-01-01', found);
	await checkPage(page, '/account', found);
	expect(found).toEqual([]);
	expect(errors).toEqual([]);
});
