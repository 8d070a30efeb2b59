import { expect, test, type Page } from '@playwright/test';
import { formatMoney } from '../src/lib/money';
import { EXAMPLE_PRICES } from '../src/lib/plan/defaults';
import { smallPatio } from '../src/lib/plan/test-plans';
import { insertLead } from './billing-helpers';
import { openHydrated, reloadHydrated, sessionFile, signUp, uniqueEmail, visitorContext, watchErrors } from './helpers';
import { insertBid, insertPlan } from './pro-helpers';

test.describe.configure({ timeout: 240_000 });

/** Sends the plan for one kind of work to one contractor, filling every field of the form. */
async function sendFor(
	page: Page,
	planId: string,
	o: { scope: string; business: string; when: string; finish: string; surface: string; access: string; notes: string }
) {
	await openHydrated(page, `/plans/${planId}/bids`);
	await page.getByLabel('What you want done').selectOption({ label: o.scope });
	await page.getByRole('button', { name: 'Find contractors' }).click();
	await expect(page.getByLabel('What you want done')).toHaveValue(new RegExp(o.scope === 'The whole job' ? 'whole_job' : 'pour_finish'));
	// The list is redrawn for the chosen work (the address and the send form carry it) with some firms
	// ticked: untick until none is, then tick one.
	await expect(page).toHaveURL(/[?&]scope=/);
	await expect(page.locator('input[type="hidden"][name="scope"]')).toHaveValue(o.scope === 'The whole job' ? 'whole_job' : 'pour_finish');
	const ticked = page.getByRole('checkbox', { checked: true });
	await expect(async () => {
		while (await ticked.count()) await ticked.first().uncheck();
		await expect(ticked).toHaveCount(0);
	}).toPass();
	await page.getByRole('checkbox', { name: new RegExp(o.business) }).check();
	await expect(ticked).toHaveCount(1);
	await page.getByLabel(o.when).check();
	await page.getByLabel('Finish wanted').selectOption({ label: o.finish });
	await page.getByLabel('There now').selectOption({ label: o.surface });
	await page.getByLabel('Site access').fill(o.access);
	await page.getByLabel('Notes for the contractors').fill(o.notes);
	await page.getByRole('button', { name: 'Send the plan' }).click();
	await expect(page.getByText('Sent to 1 contractor.')).toBeVisible();
}

test('a homeowner compares bids for two kinds of work, one kind at a time, and accepts one after confirming', async ({ page }) => {
	const errors = watchErrors(page);
	const email = uniqueEmail('compare');
	await signUp(page, { name: 'Ilse Marrow', email, password: 'two-scopes-here', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	// Corvallis: both demo firms serve it; Quarry Lane only pours and finishes.
	const { id: planId, result } = await insertPlan(email, { name: 'Side walk', postcode: '97330' });

	await sendFor(page, planId, {
		scope: 'The whole job',
		business: 'Ridgeback Flatwork',
		when: 'Within a month',
		finish: 'Broom finish (non-slip)',
		surface: 'Grass or bare soil (strip sod and topsoil)',
		access: 'Side gate 36 in wide',
		notes: 'Whole job, please.'
	});
	await sendFor(page, planId, {
		scope: 'Pour and finish',
		business: 'Quarry Lane Slabs',
		when: 'This season',
		finish: 'Float finish',
		surface: 'Gravel',
		access: 'Truck can reach the drive',
		notes: 'I prepare the base myself.'
	});

	await insertBid(planId, 'dell@ridgebackflatwork.example', { dollars: 3100, days: 2, inclusions: 'Dig, base, forms, pour, broom finish.' });
	await insertBid(planId, 'june@quarrylaneslabs.example', { dollars: 1350, days: 1, inclusions: 'Pour and float finish.' });

	await openHydrated(page, `/plans/${planId}/bids`);
	const filter = page.getByTestId('scope-filter');
	await expect(filter.getByRole('button')).toHaveText(['Pour and finish (1)', 'The whole job (1)']);
	// Like with like: one kind of work at a time, starting with the first.
	const rows = page.getByTestId('bid-row');
	await expect(page.getByTestId('compared-scope')).toHaveText('Pour and finish');
	await expect(rows).toHaveCount(1);
	await expect(rows.first()).toContainText('Quarry Lane Slabs');
	await expect(rows.first().getByTestId('bid-price')).toHaveText(formatMoney(135_000));
	// Part of the work is not compared with DIY materials for the whole slab.
	await expect(rows.first().getByTestId('bid-vs-diy')).toHaveText('—');

	await filter.getByRole('button', { name: /The whole job/ }).click();
	await expect(filter.getByRole('button', { name: /The whole job/ })).toHaveAttribute('aria-pressed', 'true');
	await expect(page.getByTestId('compared-scope')).toHaveText('The whole job');
	await expect(rows).toHaveCount(1);
	await expect(rows.first()).toContainText('Ridgeback Flatwork');
	await expect(rows.first().getByTestId('bid-price')).toHaveText(formatMoney(310_000));
	const diy = Math.round(result.materials.diyTotal.amount * 100);
	await expect(rows.first().getByTestId('bid-vs-diy')).toHaveText(`${310_000 >= diy ? '+' : '−'}${formatMoney(Math.abs(310_000 - diy))}`);
	await filter.getByRole('button', { name: /Pour and finish/ }).click();
	await expect(page.getByTestId('compared-scope')).toHaveText('Pour and finish');

	// Accepting asks first, names the price and what follows; closing the question changes nothing.
	const mine = rows.first();
	await mine.getByText('Accept…').click();
	const ask = mine.getByTestId('accept-bid');
	await expect(ask).toContainText(`Hire Quarry Lane Slabs for ${formatMoney(135_000)}?`);
	await expect(ask).toContainText('The other contractor is told they were not selected.');
	await mine.getByText('Accept…').click();
	await expect(mine.getByRole('button', { name: 'Yes, accept this bid' })).toBeHidden();
	await reloadHydrated(page);
	await expect(page.getByTestId('compared-scope')).toHaveText('Pour and finish');
	await rows.first().getByText('Accept…').click();
	// The hired firm gets the site address and a phone number, asked for here.
	await rows.first().getByLabel('Site address').fill('18 Larch Row, Albany');
	await rows.first().getByLabel('Phone for the contractor').fill('(541) 555-0142');
	await rows.first().getByRole('button', { name: 'Yes, accept this bid' }).click();
	await expect(page.getByText('Bid accepted.')).toBeVisible();
	await expect(page.getByTestId('compared-scope')).toHaveText('Pour and finish');
	await expect(rows.first().getByTestId('bid-status')).toHaveText('Accepted');
	await page
		.getByTestId('scope-filter')
		.getByRole('button', { name: /The whole job/ })
		.click();
	await expect(rows.first().getByTestId('bid-status')).toHaveText('Not selected');
	await expect(page.getByText('Accept…')).toHaveCount(0);
	expect(errors).toEqual([]);
});

test('a plan with no prices says so to both sides, and a bid on it is not compared with a DIY cost of $0', async ({ page, browser }) => {
	const errors = watchErrors(page);
	const email = uniqueEmail('unpriced');
	await signUp(page, { name: 'Odile Brack', email, password: 'no-prices-yet', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	// A 12 × 10 ft pad with every price left empty, sent for the whole job to Ridgeback (Corvallis).
	const { id: planId } = await insertPlan(email, { name: 'Bare pad', postcode: '97330', input: smallPatio() });
	const leadId = await insertLead(planId, 'dell@ridgebackflatwork.example', { town: 'Corvallis, OR', respondInDays: 7 });
	await insertBid(planId, 'dell@ridgebackflatwork.example', { dollars: 4200, days: 2, inclusions: 'Everything.' });

	await openHydrated(page, `/plans/${planId}/bids`);
	const figures = page.getByTestId('plan-figures');
	await expect(figures).toContainText("Materials if done yourself Not priced — add prices in the planner's Crew step", { useInnerText: true });
	const rows = page.getByTestId('bid-row');
	await expect(rows).toHaveCount(1);
	await expect(rows.first().getByTestId('bid-price')).toHaveText(formatMoney(420_000));
	// No DIY cost, so no difference: neither the column nor a "+$4,200.00".
	await expect(page.getByRole('columnheader', { name: 'Over DIY materials' })).toHaveCount(0);
	await expect(page.getByTestId('bid-vs-diy')).toHaveCount(0);
	await expect(page.getByTestId('compare-notes')).toContainText("Your plan's materials are not priced, so no bid is compared with doing it yourself");
	await expect(page.locator('main')).not.toContainText('+$');
	await expect(page.locator('main')).not.toContainText('$0.00');

	// The plan's own page says the same in its summary and under the materials.
	await openHydrated(page, `/plans/${planId}`);
	await expect(page.getByTestId('diy-total')).toHaveText('Not priced');
	await expect(page.locator('main')).toContainText("add prices in the planner's Crew step");
	await expect(page.locator('main')).not.toContainText('$0.00');

	// The contractor's copy says only that it is not priced.
	const pro = await (await visitorContext(browser, { storageState: sessionFile('dell@ridgebackflatwork.example') })).newPage();
	await openHydrated(pro, `/pro/leads/${leadId}`);
	await pro.getByTestId('diy-plan').locator('summary').click();
	await expect(pro.getByTestId('plan-figures')).toContainText('Materials if done yourself Not priced', { useInnerText: true });
	await expect(pro.getByTestId('diy-total')).toHaveText('Not priced');
	await expect(pro.getByTestId('diy-plan')).not.toContainText('Crew step');
	await expect(pro.getByTestId('diy-plan')).not.toContainText('$0.00');
	await pro.context().close();

	// Priced in euros: a bid in US dollars is not subtracted from a euro total either.
	const { id: euroPlan } = await insertPlan(email, {
		name: 'Euro pad',
		postcode: '97330',
		input: { ...smallPatio(), currency: 'EUR', prices: EXAMPLE_PRICES.imperial }
	});
	await insertLead(euroPlan, 'dell@ridgebackflatwork.example', { town: 'Corvallis, OR', respondInDays: 7 });
	await insertBid(euroPlan, 'dell@ridgebackflatwork.example', { dollars: 3900, days: 2, inclusions: 'Everything.' });
	await openHydrated(page, `/plans/${euroPlan}/bids`);
	await expect(page.getByTestId('bid-row')).toHaveCount(1);
	await expect(page.getByTestId('bid-vs-diy')).toHaveCount(0);
	await expect(page.getByTestId('compare-notes')).toContainText("Your plan's prices are in EUR and bids are in US dollars, so no bid is compared");
	expect(errors).toEqual([]);
});
