import { expect, test, type Page } from '@playwright/test';
import postgres from 'postgres';
import { todayIn } from '../src/lib/reader';
import {
	continueAs,
	demoPassword,
	demoUser,
	dropSession,
	mailLink,
	openHydrated,
	reloadHydrated,
	signIn,
	signOut,
	signUp,
	uniqueEmail,
	watchErrors
} from './helpers';
import { insertPlan } from './pro-helpers';

test.describe.configure({ timeout: 240_000 });

/** Messages written to the outbox for `to` whose subject matches: read from the database, so an absence is certain. */
async function outbox(to: string, subject: string) {
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	try {
		const rows = await sql`SELECT subject FROM mail_outbox WHERE "to" = ${to} AND subject LIKE ${`%${subject}%`}`;
		return rows.length;
	} finally {
		await sql.end();
	}
}

async function sendToRidgeback(page: Page, planId: string) {
	await openHydrated(page, `/plans/${planId}/bids`);
	for (const box of await page.getByRole('checkbox').all()) await box.uncheck();
	await page.getByRole('checkbox', { name: /Ridgeback Flatwork/ }).check();
	await page.getByRole('button', { name: 'Send the plan' }).click();
	await expect(page.getByText('Sent to 1 contractor.')).toBeVisible();
}

test('without scripts, the page that answers the saved e-mail choices shows them as saved', async ({ page, browser }) => {
	const me = { name: 'Ines Marlowe', email: uniqueEmail('noscript'), password: 'walkway-in-may' };
	await signUp(page, { ...me, role: 'homeowner' });
	const plain = await browser.newContext({ javaScriptEnabled: false });
	try {
		const p = await plain.newPage();
		await openHydrated(p, '/signin');
		await p.getByLabel('E-mail').fill(me.email);
		await p.getByLabel('Password').fill(me.password);
		await p.getByRole('button', { name: 'Sign in' }).click();
		await expect(p).toHaveURL(/\/plans$/);
		await openHydrated(p, '/account');
		const notices = p.getByRole('region', { name: 'E-mail notices' });
		await notices.getByLabel('New messages').uncheck();
		await notices.getByRole('button', { name: 'Save e-mail choices' }).click();
		// The answer to the plain form post is the page itself, rendered after the change.
		await expect(p.getByRole('region', { name: 'E-mail notices' }).getByText('Saved.')).toBeVisible();
		await expect(p.getByRole('region', { name: 'E-mail notices' }).getByLabel('New messages')).not.toBeChecked();
		await expect(p.getByRole('region', { name: 'E-mail notices' }).getByLabel('Bids on my plans (new, changed, withdrawn)')).toBeChecked();
	} finally {
		await plain.close();
	}
});

test('a homeowner turns message e-mails off (bids stay on) and moves the account to a new address', async ({ page }) => {
	const errors = watchErrors(page);
	const me = { name: 'Tove Lindqvist', email: uniqueEmail('settings'), password: 'patio-by-june' };
	await signUp(page, { ...me, role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	const { id: planId } = await insertPlan(me.email, { name: 'Herb bed pad', postcode: '97330' });
	await sendToRidgeback(page, planId);

	await openHydrated(page, '/account');
	const notices = page.getByRole('region', { name: 'E-mail notices' });
	// A homeowner sees the homeowner's switches only, all on at first.
	await expect(notices.getByRole('checkbox')).toHaveCount(3);
	await expect(notices.getByLabel('Bids on my plans (new, changed, withdrawn)')).toBeChecked();
	await expect(notices.getByLabel('New messages')).toBeChecked();
	await expect(notices.getByLabel('Curing reminders for plans I turned them on for')).toBeChecked();
	await expect(notices).not.toContainText('New leads');
	await notices.getByLabel('New messages').uncheck();
	await notices.getByRole('button', { name: 'Save e-mail choices' }).click();
	await expect(notices.getByText('Saved.')).toBeVisible();
	await reloadHydrated(page);
	await expect(page.getByRole('region', { name: 'E-mail notices' }).getByLabel('New messages')).not.toBeChecked();
	await expect(page.getByRole('region', { name: 'E-mail notices' }).getByLabel('Bids on my plans (new, changed, withdrawn)')).toBeChecked();

	// The contractor writes and bids: the message shows in Stakeline but sends no e-mail; the bid does.
	await continueAs(page, demoUser('contractor').email);
	await openHydrated(page, '/pro/leads');
	await page.getByTestId('lead-list').getByRole('link', { name: 'Herb bed pad' }).first().click();
	await page.getByLabel(/^Write to/).fill('Is the pad for a greenhouse?');
	await page.getByRole('button', { name: 'Send the message' }).click();
	await expect(page.getByTestId('messages')).toContainText('Is the pad for a greenhouse?');
	const day = (n: number) => todayIn('UTC', new Date(Date.now() + n * 86_400_000));
	await page.getByLabel('Total price (USD)').fill('1800');
	await page.getByLabel('Earliest start').fill(day(5));
	await page.getByLabel('Duration (days)').fill('1');
	await page.getByLabel('Price valid until').fill(day(30));
	await page.getByRole('button', { name: 'Send the bid' }).click();
	await expect(page.getByText('Bid sent. The homeowner was told.')).toBeVisible();
	await dropSession(page);
	expect(await outbox(me.email, 'New bid from Ridgeback Flatwork')).toBe(1);
	expect(await outbox(me.email, 'New message from')).toBe(0);

	// A new address: refused for a wrong password or a taken address, then confirmed from the new inbox.
	await signIn(page, me.email, me.password);
	await openHydrated(page, '/account');
	const change = page.getByRole('region', { name: 'Change e-mail' });
	const newEmail = uniqueEmail('moved');
	await change.getByLabel('New e-mail').fill(demoUser('homeowner').email);
	await change.getByLabel('Your password').fill(me.password);
	await change.getByRole('button', { name: 'Send the link' }).click();
	await expect(change.locator('#field-email-error')).toHaveText('Another account uses this address.');
	await expect(change.getByLabel('New e-mail')).toHaveValue(demoUser('homeowner').email);
	await change.getByLabel('New e-mail').fill(newEmail);
	await change.getByLabel('Your password').fill('not-my-password');
	await change.getByRole('button', { name: 'Send the link' }).click();
	await expect(change.locator('#field-email-current-error')).toHaveText('That is not your current password.');
	await change.getByLabel('Your password').fill(me.password);
	await change.getByRole('button', { name: 'Send the link' }).click();
	await expect(change.getByText(`Sent to ${newEmail}.`)).toBeVisible();
	// Nothing moved yet; the old address is told of the request.
	await expect(page.getByRole('main')).toContainText(me.email);
	await mailLink(page, me.email, /A change of your Stakeline e-mail was asked for/, { timeout: 60_000 });
	await page.goto(await mailLink(page, newEmail, /Confirm your new e-mail/, { timeout: 60_000 }));
	await page.getByRole('button', { name: 'Use this address' }).click();
	await expect(page.getByText(`Done: your account now uses ${newEmail}.`)).toBeVisible();
	await mailLink(page, me.email, /Your Stakeline e-mail was changed/, { timeout: 60_000 });
	await page.goto('/account');
	await signOut(page);
	await signIn(page, me.email, me.password);
	await expect(page.getByText('That e-mail and password do not match an account.')).toBeVisible();
	await signIn(page, newEmail, me.password);
	await expect(page).toHaveURL(/\/plans$/);
	await page.goto('/account');
	await expect(page.getByRole('main')).toContainText(newEmail);
	expect(errors).toEqual([]);
});

test("a contractor's leads list uses the unit they chose, else their language's; dates follow their time zone", async ({ browser }) => {
	// A German-speaking contractor in Berlin: kilometres and Berlin's day unless they choose otherwise.
	const context = await browser.newContext({ locale: 'de-DE', timezoneId: 'Pacific/Kiritimati' });
	const page = await context.newPage();
	const errors = watchErrors(page);
	const owner = uniqueEmail('unit-owner');
	await signUp(page, { name: 'Ada Brenner', email: owner, password: 'km-or-miles', role: 'homeowner' });
	const { id: planId } = await insertPlan(owner, { name: 'Bin store pad', postcode: '97321' });
	await sendToRidgeback(page, planId);

	await signOut(page);
	await signIn(page, demoUser('contractor').email, demoPassword);
	await expect(page).toHaveURL(/\/pro$/);
	await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Leads' }).click();
	const item = page.getByTestId('lead-list').getByRole('listitem').filter({ hasText: 'Bin store pad' }).first();
	await expect(item).toContainText(/ km · /);

	await openHydrated(page, '/account');
	const unit = page.getByLabel('Show distances in');
	await expect(unit).toHaveValue('auto');
	await expect(unit.locator('option[value=auto]')).toHaveText(/kilometres/);
	await unit.selectOption('mi');
	await page.getByRole('button', { name: 'Save the unit' }).click();
	await expect(page.getByRole('region', { name: 'Distances in your leads' }).getByText('Saved.')).toBeVisible();
	await page.goto('/pro/leads');
	await expect(item).toContainText(/ mi · /);
	await expect(item).not.toContainText(/ km · /);

	// The bid form's first allowed day is the contractor's own today.
	await item.getByRole('link', { name: 'Bin store pad' }).click();
	await expect(page.getByText(/Albany, OR · [\d.]+ mi from you/)).toBeVisible();
	await expect(page.getByLabel('Earliest start')).toHaveAttribute('min', todayIn('Pacific/Kiritimati'));

	// Back to the language's default, as the demo data had it.
	await openHydrated(page, '/account');
	await page.getByLabel('Show distances in').selectOption('auto');
	await page.getByRole('button', { name: 'Save the unit' }).click();
	await expect(page.getByRole('region', { name: 'Distances in your leads' }).getByText('Saved.')).toBeVisible();
	await page.goto('/pro/leads');
	await expect(item).toContainText(/ km · /);
	await context.close();
	expect(errors).toEqual([]);
});
