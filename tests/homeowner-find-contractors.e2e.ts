import { expect, test } from '@playwright/test';
import { openHydrated, signUp, uniqueEmail, watchErrors } from './helpers';
import { insertApprovedContractor, insertPlan } from './pro-helpers';

test.describe.configure({ timeout: 180_000 });

test('the bids page says what to do when no contractor serves the ZIP code, and when every one of them has the plan', async ({ page }) => {
	const errors = watchErrors(page);
	const email = uniqueEmail('find');
	await signUp(page, { name: 'Hale Corrin', email, password: 'who-serves-here', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);

	// Portland: no demo or test firm reaches it (they are around Corvallis and Albany, 30 mi at most).
	const { id: far } = await insertPlan(email, { name: 'City walk', postcode: '97201' });
	await openHydrated(page, `/plans/${far}/bids`);
	const none = page.getByTestId('no-matches');
	await expect(none.getByTestId('match-count')).toHaveText('No approved contractor serves ZIP code 97201 for the whole job yet.');
	await expect(none.getByRole('link', { name: 'edit the plan' })).toHaveAttribute('href', `/plans/${far}/edit`);
	await expect(none.getByRole('link', { name: 'download its PDF' })).toHaveAttribute('href', `/plans/${far}/plan.pdf`);
	await expect(none).toContainText('Come back later');
	await expect(page.getByRole('checkbox')).toHaveCount(0);
	await expect(page.getByRole('button', { name: 'Send the plan' })).toHaveCount(0);

	// Missoula: one firm of this test's own, and nobody else within hundreds of miles.
	const business = await insertApprovedContractor({ business: `Clark Fork Pads ${Date.now()}`, zip: '59801', radiusMi: 10 });
	const { id: planId } = await insertPlan(email, { name: 'Shed pad', postcode: '59801' });
	await openHydrated(page, `/plans/${planId}/bids`);
	await expect(page.getByRole('heading', { name: 'Get bids from local contractors' })).toBeVisible();
	await expect(page.getByTestId('match-count')).toHaveText("1 approved contractor serves this plan's ZIP code for this work.");
	await expect(page.getByRole('checkbox', { name: new RegExp(business) })).toBeChecked();
	await page.getByLabel('Site access').fill('Open lot, truck to the pad.');
	await page.getByRole('button', { name: 'Send the plan' }).click();
	await expect(page.getByText('Sent to 1 contractor.')).toBeVisible();

	// Nobody left to pick: the count stays true and says they have it, with no empty form.
	await expect(page.getByTestId('match-count')).toHaveText("1 approved contractor serves this plan's ZIP code for this work, and has the plan.");
	await expect(page.getByTestId('everyone-asked')).toContainText('There is no one else to ask here for this work yet.');
	await expect(page.getByRole('heading', { name: 'Contractors near this plan' })).toBeVisible();
	await expect(page.getByRole('heading', { name: 'Ask more contractors' })).toHaveCount(0);
	await expect(page.getByRole('checkbox')).toHaveCount(0);
	await expect(page.getByRole('button', { name: 'Send the plan' })).toHaveCount(0);
	await expect(page.getByRole('link', { name: business })).toBeVisible();
	expect(errors).toEqual([]);
});
