import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { extraLead, leadPack, monthlyPlan, price } from '../src/lib/billing-plans';
import { insertLead, setUsage } from './billing-helpers';
import { continueAs, demoUser, openHydrated, reloadHydrated, signIn, uniqueEmail, watchErrors } from './helpers';
import { approvedNewContractor, insertPlan } from './pro-helpers';

// A long journey on a shared machine (sign-up, review, two trips to the payment page).
test.describe.configure({ timeout: 300_000 });

const fakePage = /^http:\/\/127\.0\.0\.1:\d+\/pay\/cs_test_\w+$/;

async function fitsAndAxeClean(page: Page) {
	const { violations } = await new AxeBuilder({ page }).analyze();
	expect(violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual([]);
	expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(await page.evaluate(() => document.documentElement.clientWidth));
}

test('a contractor without a plan sees only what a lead is, pays for a plan on the payment page, and opens the lead', async ({ page }) => {
	const errors = watchErrors(page);
	const stamp = Date.now();
	const pro = {
		name: 'Rhea Tamsin',
		email: uniqueEmail('billing'),
		password: 'pay-for-leads-7',
		business: `Tamsin Flatwork ${stamp}`,
		zip: '97321',
		plan: false
	};
	await approvedNewContractor(page, pro);
	// A homeowner's plan reaches the contractor as a lead (sending is covered in contractor-bid.e2e.ts).
	const { id: planId, result } = await insertPlan(demoUser('homeowner').email, { name: `Garden path ${stamp}`, postcode: '97321' });
	const leadId = await insertLead(planId, pro.email, { town: 'Albany, OR', respondInDays: 7 });

	await page.setViewportSize({ width: 390, height: 844 });
	await signIn(page, pro.email, pro.password);
	await expect(page).toHaveURL(/\/pro$/);
	await expect(page.getByTestId('billing-desk')).toContainText('To open a lead’s details, choose a plan.');

	// The lead is listed (town, scope, timing), its details are not.
	await page.goto('/pro/leads');
	await expect(page.getByTestId('leads-locked')).toBeVisible();
	const row = page
		.getByTestId('lead-list')
		.getByRole('listitem')
		.filter({ hasText: `Garden path ${stamp}` });
	await expect(row).toContainText('details need a plan');
	await expect(row).toContainText('Albany, OR');
	await row.getByRole('link').click();
	await expect(page).toHaveURL(new RegExp(`/pro/billing\\?lead=${leadId}$`));
	const teaser = page.getByTestId('lead-teaser');
	await expect(teaser).toContainText('A lead is waiting near Albany, OR');
	await expect(teaser).toContainText(`The whole job, about ${Math.round(result.area.squareFeet)} sq ft · Within a month`);
	await expect(page.getByTestId('billing-status')).toHaveText('No plan');
	await expect(page.getByText('No invoices yet.')).toBeVisible();
	await fitsAndAxeClean(page);
	// Not in the page's data either.
	const data = await (await page.request.get(`/pro/leads/${leadId}/__data.json`)).text();
	expect(data).not.toContain('Garden path');

	// To the payment page and back without paying: nothing changes.
	await page.getByRole('button', { name: `Start ${monthlyPlan.name} (${price(monthlyPlan.monthlyCents)} a month)` }).click();
	await expect(page).toHaveURL(fakePage);
	await expect(page.getByText('nothing is charged')).toBeVisible();
	await page.getByRole('button', { name: 'Cancel and go back' }).click();
	await expect(page).toHaveURL(/\/pro\/billing\?checkout=cancelled$/);
	await expect(
		page.getByRole('status').filter({ hasText: 'You left the payment page without paying; nothing was charged and nothing changed.' })
	).toBeVisible();
	await expect(page.getByTestId('billing-status')).toHaveText('No plan');

	// Again, and pay this time.
	await page.getByRole('button', { name: `Start ${monthlyPlan.name}` }).click();
	await expect(page).toHaveURL(fakePage);
	await expect(page.getByRole('heading', { name: monthlyPlan.name })).toBeVisible();
	await expect(page.getByText(`${(monthlyPlan.monthlyCents / 100).toFixed(2)} USD a month`)).toBeVisible();
	await page.getByLabel('Test card').selectOption('good');
	await page.getByRole('button', { name: 'Pay' }).click();
	await expect(page).toHaveURL(/\/pro\/billing\?checkout=done&session=cs_test_\w+$/);
	await expect(page.getByText('Payment received. Thank you.')).toBeVisible();
	await expect(page.getByTestId('billing-status')).toHaveText('Active');
	await expect(page.getByTestId('leads-used')).toHaveText(`0 of ${monthlyPlan.leadsIncluded}`);
	await expect(page.getByTestId('invoices').getByRole('listitem')).toHaveCount(1);
	await expect(page.getByTestId('invoices')).toContainText(`${monthlyPlan.name}`);
	await expect(page.getByTestId('invoices')).toContainText(`${price(monthlyPlan.monthlyCents)} · paid`);
	await fitsAndAxeClean(page);

	// The lead opens now, and uses one of the plan's leads.
	await page.goto(`/pro/leads/${leadId}`);
	await expect(page.getByRole('heading', { name: `Garden path ${stamp}` })).toBeVisible();
	await expect(page.getByTestId('spec-area')).toHaveText(`${Math.round(result.area.squareFeet)} ft²`);
	await page.goto('/pro/billing');
	await expect(page.getByTestId('leads-used')).toHaveText(`1 of ${monthlyPlan.leadsIncluded}`);
	await page.goto('/pro');
	await expect(page.getByTestId('billing-desk')).toContainText(`${monthlyPlan.leadsIncluded - 1} of ${monthlyPlan.leadsIncluded} leads left this period`);

	// Cancel at the end of the period, then change one's mind.
	await page.goto('/pro/billing');
	await page.getByRole('button', { name: 'Cancel at the end of this period' }).click();
	await expect(page.getByText('Your plan ends at the end of this period. Until then nothing changes.')).toBeVisible();
	await expect(page.getByTestId('billing-status')).toHaveText('Active (ends at period end)');
	await page.getByRole('button', { name: 'Keep my plan' }).click();
	await expect(page.getByText('Your plan carries on; it is no longer set to end.')).toBeVisible();
	await expect(page.getByTestId('billing-status')).toHaveText('Active');

	// Extra leads: a pack of credits, paid on the same kind of page.
	await page.getByRole('button', { name: `Buy ${leadPack.leads} extra leads` }).click();
	await expect(page).toHaveURL(fakePage);
	await page.getByLabel('Test card').selectOption('good');
	await page.getByRole('button', { name: 'Pay' }).click();
	await expect(page.getByText('Payment received: your lead credits are added.')).toBeVisible();
	await expect(page.getByTestId('lead-credits')).toHaveText(String(leadPack.leads));
	await expect(page.getByTestId('invoices').getByRole('listitem')).toHaveCount(2);

	// Past the plan's included leads with no credit left: a new lead opens only after the contractor agrees to its price.
	await setUsage(pro.email, { leadsUsed: monthlyPlan.leadsIncluded, credits: 0 });
	const { id: secondPlanId } = await insertPlan(demoUser('homeowner').email, { name: `Side walk ${stamp}`, postcode: '97321' });
	const extraId = await insertLead(secondPlanId, pro.email, { town: 'Tangent, OR', respondInDays: 5 });
	await page.goto('/pro/leads');
	await expect(page.getByTestId('leads-extra')).toContainText(`opens as an extra lead for ${price(extraLead.cents)} on your next invoice`);
	await page.goto(`/pro/leads/${extraId}`);
	await expect(page).toHaveURL(new RegExp(`/pro/billing\\?lead=${extraId}$`));
	await expect(page.getByTestId('lead-teaser')).toContainText(`Opening this one adds ${price(extraLead.cents)} to your next invoice`);
	await expect(page.getByTestId('extra-leads')).toContainText('None this period');
	await fitsAndAxeClean(page);
	await page.getByRole('button', { name: `Open this lead for ${price(extraLead.cents)}` }).click();
	await expect(page).toHaveURL(new RegExp(`/pro/leads/${extraId}$`));
	await expect(page.getByRole('heading', { name: `Side walk ${stamp}` })).toBeVisible();
	await page.goto('/pro/billing');
	await expect(page.getByTestId('extra-leads')).toHaveText(`1 this period: ${price(extraLead.cents)} on your next invoice`);

	// Billing receipts are a switch of their own on the account page.
	await openHydrated(page, '/account');
	const notices = page.getByRole('region', { name: 'E-mail notices' });
	const receipts = notices.getByLabel('Billing receipts (plan started, monthly payment received, lead credits added)');
	await expect(receipts).toBeChecked();
	await receipts.uncheck();
	await notices.getByRole('button', { name: 'Save e-mail choices' }).click();
	await expect(notices.getByText('Saved.')).toBeVisible();
	await reloadHydrated(page);
	await expect(
		page.getByRole('region', { name: 'E-mail notices' }).getByLabel('Billing receipts (plan started, monthly payment received, lead credits added)')
	).not.toBeChecked();

	// The admin sees the same state on the contractor's page.
	await continueAs(page, demoUser('admin').email);
	await page.goto(`/admin/users?q=${encodeURIComponent(pro.email)}`);
	await page.getByTestId('users-table').getByRole('link', { name: pro.business }).click();
	await expect(page.getByTestId('admin-billing-status')).toHaveText('Active');
	await expect(page.getByTestId('admin-billing')).toContainText(`${monthlyPlan.leadsIncluded} of ${monthlyPlan.leadsIncluded} this period · 0 credits`);
	await expect(page.getByTestId('admin-billing')).toContainText('checkout.session.completed');
	await expect(page.getByTestId('admin-extra-leads')).toHaveText(`1 this period · ${price(extraLead.cents)} on the next invoice`);
	await expect(page.getByTestId('admin-billing')).toContainText('extra lead');
	expect(errors).toEqual([]);
});
