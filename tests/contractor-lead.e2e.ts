import { expect, test } from '@playwright/test';
import { demoPassword, demoUser, openHydrated, signIn, signOut, signUp, uniqueEmail } from './helpers';
import { insertPlan } from './pro-helpers';

// Long journeys on a shared machine: give each the time a slow run needs.
test.describe.configure({ timeout: 300_000 });

const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

test('a contractor prices a lead from its spec sheet and bids from a phone', async ({ page }) => {
	test.setTimeout(300_000);
	const errors: string[] = [];
	page.on('pageerror', (e) => errors.push(e.message));
	const homeEmail = uniqueEmail('spec');
	await signUp(page, { name: 'Rhea Pellow', email: homeEmail, password: 'kitchen-patio-9', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	// The first demo plan: a 14 ft × 12 ft rectangle, 4 in thick, fibres in the mix.
	const { id: planId } = await insertPlan(homeEmail, { name: 'Kitchen patio', postcode: '97330' });
	await openHydrated(page, `/plans/${planId}/bids`);
	for (const box of await page.getByRole('checkbox').all()) await box.uncheck();
	await page.getByRole('checkbox', { name: /Ridgeback Flatwork/ }).check();
	await page.getByLabel('Within a month').check();
	await page.getByLabel('Finish wanted').selectOption('broom');
	await page.getByLabel('There now').selectOption('old_concrete');
	await page.getByLabel('Site access').fill('Side gate 36 in wide; no truck access to the back.');
	await page.getByRole('button', { name: 'Send the plan' }).click();
	await expect(page.getByText('Sent to 1 contractor.')).toBeVisible();

	// On a phone.
	await page.setViewportSize({ width: 390, height: 844 });
	await signOut(page);
	await signIn(page, demoUser('contractor').email, demoPassword);
	await expect(page).toHaveURL(/\/pro$/);
	await page.goto('/pro/leads');
	await page.getByTestId('lead-list').getByRole('link', { name: 'Kitchen patio' }).first().click();
	const spec = page.getByTestId('spec-sheet');
	await expect(spec.getByRole('heading', { name: 'Spec sheet' })).toBeVisible();
	await expect(spec.getByTestId('spec-outline')).toContainText('14 ft');
	await expect(spec.getByTestId('spec-outline')).toContainText('12 ft');
	await expect(spec.getByTestId('spec-area')).toHaveText('168 ft²'); // 14 × 12 by hand
	await expect(spec.getByTestId('spec-thickness')).toHaveText('4 in');
	await expect(spec.getByTestId('spec-reinforcement')).toHaveText('Fibres in the mix');
	await expect(spec.getByTestId('spec-fall')).toContainText('away from the house');
	await expect(spec.getByTestId('spec-control-joints')).toContainText('apart');
	await expect(spec.getByTestId('spec-base')).toContainText('compacted gravel');
	await expect(spec.getByTestId('spec-access')).toHaveText('Side gate 36 in wide; no truck access to the back.');
	await expect(spec).toContainText('Old concrete (break out and haul away)');
	await expect(spec).toContainText('Broom finish');
	await expect(spec.getByTestId('spec-when')).toContainText('Within a month — done by');
	// The DIY-only parts are folded away.
	await expect(page.getByTestId('diy-plan')).not.toHaveAttribute('open');
	await expect(page.getByTestId('frozen-plan')).toBeHidden();
	await expect(page.getByTestId('plan-figures')).toBeHidden();
	expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
	await page.screenshot({ path: 'test-results/screens/lead-spec-phone.png', fullPage: true });

	await page.getByTestId('jump-to-bid').click();
	await expect(page.getByLabel('Total price (USD)')).toBeInViewport();
	await page.getByLabel('Total price (USD)').fill('3,150');
	await page.getByLabel('Removal and haul-away').fill('600');
	await page.getByLabel('Earliest start').fill(inDays(7));
	await page.getByLabel('Duration (days)').fill('2');
	await page.getByLabel('Price valid until').fill(inDays(30));
	await page.getByLabel('Included', { exact: true }).fill('Break out the old slab, base, forms, pour, broom finish.');
	await page.getByRole('button', { name: 'Send the bid' }).click();
	await expect(page.getByText('Bid sent. The homeowner was told.')).toBeVisible();
	await expect(page.getByTestId('bid-status')).toHaveText('Open');
	expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
	expect(errors).toEqual([]);
});
