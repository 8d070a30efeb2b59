import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { formatDay, formatDayLong } from '../src/lib/reader';
import { respondBy } from '../src/lib/leads';
import { continueAs, demoPassword, dropSession, mailLink, openHydrated, signIn, signOut, signUp, uniqueEmail, watchErrors } from './helpers';
import { insertPlan } from './pro-helpers';

// Long journeys on a shared machine: give each the time a slow run needs.
test.describe.configure({ timeout: 300_000 });
// Dates are shown in the reader's locale: this reader's browser asks for British English.
test.use({ locale: 'en-GB' });

const DELL = 'dell@ridgebackflatwork.example';
const JUNE = 'june@quarrylaneslabs.example';
const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

async function sendBid(page: Page, total: string) {
	await page.getByLabel('Total price (USD)').fill(total);
	await page.getByLabel('Earliest start').fill(inDays(6));
	await page.getByLabel('Duration (days)').fill('2');
	await page.getByLabel('Price valid until').fill(inDays(30));
	await page.getByRole('button', { name: 'Send the bid' }).click();
	await expect(page.getByText('Bid sent. The homeowner was told.')).toBeVisible();
}

async function chooseOnly(page: Page, businesses: RegExp[]) {
	for (const box of await page.getByRole('checkbox').all()) await box.uncheck();
	for (const b of businesses) await page.getByRole('checkbox', { name: b }).check();
}

test('a homeowner closes a request without hiring; the firm sees the respond-by date and is told', async ({ page }) => {
	const errors = watchErrors(page);
	const homeEmail = uniqueEmail('closer');
	await signUp(page, { name: 'Ilse Brannock', email: homeEmail, password: 'porch-pad-closed', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	const { id: planId } = await insertPlan(homeEmail, { name: 'Porch pad', postcode: '97330' });

	// Every field of the send form.
	await openHydrated(page, `/plans/${planId}/bids`);
	await page.getByLabel('What you want done').selectOption('pour_finish');
	await page.getByRole('button', { name: 'Find contractors' }).click();
	await expect(page).toHaveURL(/scope=pour_finish/);
	await chooseOnly(page, [/Ridgeback Flatwork/]);
	await page.getByLabel('In the next two weeks').check();
	await page.getByLabel('Finish wanted').selectOption('float');
	await page.getByLabel('There now').selectOption('gravel');
	await page.getByLabel('Site access').fill('Through the side gate, 40 in.');
	// A bad phone is refused, with what to fix; the rest of the form is kept.
	await page.getByLabel('Site address').fill('12 Wren Hollow Road, Corvallis');
	await page.getByLabel('Phone', { exact: true }).fill('call me');
	await page.getByLabel('Notes for the contractors').fill('Any weekday works.');
	await page.getByRole('button', { name: 'Send the plan' }).click();
	await expect(page.locator('#field-phone-error')).toHaveText(/Enter a phone number with its area code/);
	await expect(page.getByLabel('Site access')).toHaveValue('Through the side gate, 40 in.');
	await page.getByLabel('Phone', { exact: true }).fill('541 555 0110');
	await page.getByRole('button', { name: 'Send the plan' }).click();
	await expect(page.getByText('Sent to 1 contractor.')).toBeVisible();
	await expect(page.getByTestId('request-state')).toHaveText('Open for bids');
	const due = respondBy(new Date(), 'soon');
	await expect(page.getByText(`reply due by ${formatDay(due, { locale: 'en-GB' })}`)).toBeVisible();

	await signOut(page);
	await signIn(page, DELL, demoPassword);
	await expect(page).toHaveURL(/\/pro$/);
	const leadUrl = await mailLink(page, DELL, /New lead near Corvallis, OR/, { timeout: 60_000, mentioning: 'Porch pad' });
	await page.goto(leadUrl);
	await expect(page.getByTestId('firms-asked')).toHaveText('You are the only firm asked for this plan.');
	await expect(page.getByTestId('respond-by')).toContainText(formatDayLong(due, 'en-GB'));
	await expect(page.locator('main')).not.toContainText('Wren Hollow');
	await sendBid(page, '3,100');
	await dropSession(page);

	await signIn(page, homeEmail, 'porch-pad-closed');
	await expect(page).toHaveURL(/\/plans$/);
	await page.goto(`/plans/${planId}/bids`);
	await page.getByText('Close this request without hiring…').click();
	await expect(page.getByTestId('close-request')).toContainText('told you closed it without hiring anyone');
	await page.getByRole('button', { name: 'Yes, close the request' }).click();
	await expect(page.getByText('Request closed. 1 contractor was told you hired nobody.')).toBeVisible();
	await expect(page.getByTestId('request-state')).toHaveText('Closed without hiring');
	await expect(page.getByTestId('bid-row').getByTestId('bid-status')).toHaveText('Request closed without hiring');
	await expect(page.getByText('Accept…')).toHaveCount(0);
	await expect(page.getByTestId('close-request')).toHaveCount(0);

	await signOut(page);
	await signIn(page, DELL, demoPassword);
	await expect(page).toHaveURL(/\/pro$/);
	expect(await mailLink(page, DELL, /A request near Corvallis, OR was closed/, { timeout: 60_000 })).toBe(leadUrl);
	await page.goto(leadUrl);
	await expect(page.getByTestId('lead-status')).toHaveText('Request closed without hiring');
	await expect(page.getByText('The homeowner closed this request without hiring anyone.').first()).toBeVisible();
	await expect(page.getByRole('button', { name: 'Send the bid' })).toHaveCount(0);
	expect(errors).toEqual([]);
});

test('the hired firm alone gets the site address and phone; the homeowner marks the job done', async ({ page }) => {
	const errors = watchErrors(page);
	const homeEmail = uniqueEmail('hirer');
	await signUp(page, { name: 'Corin Vale', email: homeEmail, password: 'garden-pad-done', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	const { id: planId } = await insertPlan(homeEmail, { name: 'Garden pad', postcode: '97330' });
	await page.goto(`/plans/${planId}/bids?scope=pour_finish`);
	await chooseOnly(page, [/Ridgeback Flatwork/, /Quarry Lane Slabs/]);
	await page.getByRole('button', { name: 'Send the plan' }).click(); // no address yet: asked on accepting
	await expect(page.getByText('Sent to 2 contractors.')).toBeVisible();

	await signOut(page);

	const leads: Record<string, string> = {};
	for (const [email, total] of [
		[DELL, '2,900'],
		[JUNE, '2,700']
	]) {
		await signIn(page, email, demoPassword);
		await expect(page).toHaveURL(/\/pro$/);
		leads[email] = await mailLink(page, email, /New lead near Corvallis, OR/, { timeout: 60_000, mentioning: 'Garden pad' });
		await page.goto(leads[email]);
		await expect(page.getByTestId('firms-asked')).toHaveText('2 firms were asked for this plan.');
		await sendBid(page, total);
		await signOut(page);
	}

	await signIn(page, homeEmail, 'garden-pad-done');
	await expect(page).toHaveURL(/\/plans$/);
	await openHydrated(page, `/plans/${planId}/bids`);
	const dell = page.getByTestId('bid-row').filter({ hasText: 'Ridgeback Flatwork' });
	await dell.getByText('Accept…').click();
	await dell.getByLabel('Site address').fill('7');
	await dell.getByLabel('Phone for the contractor').fill('555');
	await dell.getByRole('button', { name: 'Yes, accept this bid' }).click();
	const again = page.getByTestId('bid-row').filter({ hasText: 'Ridgeback Flatwork' });
	await expect(again.getByText('Enter the street address of the site, with the town (at least 8 characters).')).toBeVisible();
	await expect(again.getByText('Enter a phone number with its area code.')).toBeVisible();
	await again.getByLabel('Site address').fill('3 Alder Bend, Corvallis');
	await again.getByLabel('Phone for the contractor').fill('(541) 555-0176');
	await again.getByRole('button', { name: 'Yes, accept this bid' }).click();
	await expect(page.getByText('Bid accepted.')).toBeVisible();
	await expect(page.getByTestId('request-state')).toHaveText('Contractor hired');
	await expect(page.getByTestId('hired')).toContainText('3 Alder Bend, Corvallis · (541) 555-0176');
	await expect(page.getByTestId('close-request')).toHaveCount(0);
	const { violations } = await new AxeBuilder({ page }).analyze();
	expect(violations.map((v) => v.id)).toEqual([]);

	// The winner: address and phone on the lead.
	await signOut(page);
	await signIn(page, DELL, demoPassword);
	await expect(page).toHaveURL(/\/pro$/);
	await page.goto(leads[DELL]);
	await expect(page.getByTestId('lead-status')).toHaveText('Won');
	await expect(page.getByTestId('site-address')).toHaveText('3 Alder Bend, Corvallis');
	await expect(page.getByTestId('homeowner-phone')).toHaveText('(541) 555-0176');

	// The other firm: told it was not selected, and nothing of the address or phone, not even in the page's data.
	await continueAs(page, JUNE);
	await page.goto(leads[JUNE]);
	await expect(page.getByTestId('lead-status')).toHaveText('Not selected');
	await expect(page.getByTestId('site-address')).toHaveCount(0);
	await expect(page.locator('main')).not.toContainText('Alder Bend');
	const data = await (await page.request.get(`${new URL(leads[JUNE]).pathname}/__data.json`)).text();
	expect(data).not.toContain('Alder Bend');
	expect(data).not.toContain('555-0176');
	await dropSession(page);

	await signIn(page, homeEmail, 'garden-pad-done');
	await expect(page).toHaveURL(/\/plans$/);
	await page.goto(`/plans/${planId}/bids`);
	await page.getByText('Mark the job done…').click();
	await page.getByRole('button', { name: 'Yes, the job is done' }).click();
	await expect(page.getByText('Marked done. The contractor was told')).toBeVisible();
	await expect(page.getByTestId('request-state')).toHaveText('Job done');
	await expect(page.getByTestId('job-done')).toContainText('Ridgeback Flatwork');
	await expect(page.getByTestId('mark-done')).toHaveCount(0);
	await expect(page.getByRole('button', { name: 'Send the plan' })).toHaveCount(0);

	await signOut(page);
	await signIn(page, DELL, demoPassword);
	await expect(page).toHaveURL(/\/pro$/);
	expect(await mailLink(page, DELL, /The job near Corvallis, OR is marked done/, { timeout: 60_000 })).toBe(leads[DELL]);
	await page.goto(leads[DELL]);
	await expect(page.getByTestId('lead-status')).toHaveText('Job done');
	await expect(page.getByTestId('site-address')).toHaveText('3 Alder Bend, Corvallis');
	expect(errors).toEqual([]);
});

test('the admin sees credentials running out, and the firm sees its dates on the pro desk', async ({ page }) => {
	const errors = watchErrors(page);
	await continueAs(page, 'ada.vellum@fernhollow.example');
	await page.getByRole('navigation', { name: 'Admin' }).getByRole('link', { name: 'Expiring credentials' }).click();
	await expect(page).toHaveURL(/\/admin\/expiring$/);
	// The demo's Quarry Lane Slabs insurance runs out within a month of loading the demo; its 30-day reminder went.
	const row = page.getByTestId('expiring-row').filter({ hasText: 'Quarry Lane Slabs' });
	await expect(row).toContainText('Insurance');
	await expect(row).toContainText(/in \d+ days/);
	await expect(row).toContainText('reminders sent: 30 days');
	await expect(page.getByTestId('expiring-row').filter({ hasText: 'Ridgeback Flatwork' })).toHaveCount(0);
	// The reviewer sees both dates on the firm's page.
	await row.getByRole('link', { name: 'Quarry Lane Slabs' }).click();
	await expect(page.locator('dt').filter({ hasText: /^Insurance expires$/ })).toBeVisible();
	await expect(page.locator('dt').filter({ hasText: /^Licence expires$/ })).toBeVisible();

	await continueAs(page, JUNE);
	await expect(page.getByTestId('credential-dates')).toContainText(/Insurance expires .* \(in \d+ days: renew it on your profile\)/);
	await mailLink(page, JUNE, /Your insurance on Stakeline expires in \d+ days/, { timeout: 60_000 });
	expect(errors).toEqual([]);
});
