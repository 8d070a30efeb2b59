import { expect, test } from '@playwright/test';
import { continueAs, demoUser, mailLink, openHydrated, sessionFile, signIn, signUp, uniqueEmail, visitorContext, watchErrors } from './helpers';

test.describe.configure({ timeout: 240_000 });

const today = () => new Date().toISOString().slice(0, 10);

test.describe('the demo admin, signed in once for the run', () => {
	test.use({ storageState: sessionFile(demoUser('admin').email) });

	test('an admin disables a homeowner with a reason: sessions end, sign-in refused, audited; enabling lets them back', async ({ page, browser }) => {
		const errors = watchErrors(page);
		const owner = { name: 'Rolf Ashby', email: uniqueEmail('disabled'), password: 'quiet-slab-71' };
		// The homeowner is signed in in another browser the whole time.
		const other = await visitorContext(browser);
		const theirs = await other.newPage();
		await signUp(theirs, { ...owner, role: 'homeowner' });
		await expect(theirs).toHaveURL(/\/plans$/);
		// A second sign-up whose link is never followed: the admin sees it as not confirmed.
		const idle = { name: 'Ines Varga', email: uniqueEmail('unconfirmed') };
		const stranger = await (await visitorContext(browser)).newPage();
		await openHydrated(stranger, '/signup');
		await stranger.getByLabel('Your name').fill(idle.name);
		await stranger.getByLabel('E-mail').fill(idle.email);
		await stranger.getByLabel('Password', { exact: true }).fill('quiet-slab-72');
		await stranger.getByRole('button', { name: 'Create account' }).click();
		await expect(stranger.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();
		await stranger.context().close();

		await openHydrated(page, '/admin');
		await expect(page).toHaveURL(/\/admin$/);
		// The admin's tabs are touch-sized like every other button (they were 36 px).
		for (const tab of await page.getByRole('navigation', { name: 'Admin' }).getByRole('link').all())
			expect((await tab.boundingBox())!.height).toBeGreaterThanOrEqual(44);
		await page.getByRole('navigation', { name: 'Admin' }).getByRole('link', { name: 'Users' }).click();
		await page.getByLabel('Name, e-mail, business or licence number').fill(owner.email);
		await page.getByLabel('Role').selectOption('homeowner');
		await page.getByLabel('Contractor status').selectOption('');
		await page.getByRole('button', { name: 'Show' }).click();
		const table = page.getByTestId('users-table');
		await expect(table.getByRole('row')).toHaveCount(2);
		await expect(table).not.toContainText('not confirmed'); // signed up through the e-mailed link
		await table.getByRole('link', { name: owner.name }).click();
		await expect(page.getByRole('heading', { name: owner.name })).toBeVisible();
		await expect(page.getByTestId('email-confirmed')).toHaveText(/^confirmed/);
		await expect(page.getByTestId('access-state')).toHaveText('can sign in');

		// A reason is required, and the message says so.
		await page.getByRole('button', { name: 'Disable account' }).click();
		await expect(page.locator('#field-reason-error')).toHaveText(/at least 5 characters/);
		await page.getByLabel('Reason').fill('Posted other people’s addresses in plan notes.');
		await page.getByRole('button', { name: 'Disable account' }).click();
		await expect(page.getByText('Disabled. The owner was signed out and e-mailed.')).toBeVisible();
		await expect(page.getByTestId('access-state')).toHaveText(/^disabled since/);
		await expect(page.getByLabel('Reason')).toHaveValue(''); // empty again for the next decision
		await expect(page.getByTestId('audit-table')).toContainText('Disable account');
		await expect(page.getByTestId('audit-table')).toContainText('Posted other people’s addresses in plan notes.');

		// Their open session is gone and the password no longer signs them in.
		await theirs.goto('/plans');
		await expect(theirs).toHaveURL(/\/signin/);
		await signIn(theirs, owner.email, owner.password);
		await expect(theirs.getByText('This account is disabled.')).toBeVisible();
		await expect(theirs).toHaveURL(/\/signin/);
		// The sign-in link is refused too.
		await openHydrated(theirs, '/signin/link');
		await theirs.getByLabel('E-mail').fill(owner.email);
		await theirs.getByRole('button', { name: 'Send the link' }).click();
		await expect(theirs.getByText(/a sign-in link is on its way/)).toBeVisible();
		await theirs.goto(await mailLink(theirs, owner.email, /sign-in link/, { timeout: 60_000 }));
		await theirs.getByRole('button', { name: 'Sign me in' }).click();
		await expect(theirs.getByText('This account is disabled.')).toBeVisible();
		// And they were told why.
		await theirs.goto(`/dev/mailbox?to=${encodeURIComponent(owner.email)}`);
		await expect(theirs.getByTestId('mail').filter({ hasText: 'Your Stakeline account is disabled' })).toContainText('Posted other people’s addresses');

		// The audit log, filtered by action, actor and days.
		await page.getByRole('navigation', { name: 'Admin' }).getByRole('link', { name: 'Audit log' }).click();
		await page.getByLabel('What').selectOption({ label: 'Disable account' });
		await page.getByLabel('Who').selectOption({ label: demoUser('admin').name });
		await page.getByLabel('From').fill(today());
		await page.getByLabel('To').fill(today());
		await page.getByRole('button', { name: 'Show' }).click();
		const audit = page.getByTestId('audit-table');
		await expect(audit.getByRole('row').filter({ hasText: owner.email })).toHaveCount(1);
		// Retried until the filtered page is in: every row left is a disable (a list read once could be the page before).
		await expect(audit.locator('tbody tr td:nth-child(3)').filter({ hasNotText: 'Disable account' })).toHaveCount(0);
		await page.getByLabel('From').fill('2020-01-01');
		await page.getByLabel('To').fill('2020-01-31');
		await page.getByRole('button', { name: 'Show' }).click();
		await expect(page.getByText('No admin action matches these filters.')).toBeVisible();
		await page.getByLabel('What').selectOption({ label: 'Approve' });
		await page.getByLabel('From').fill('2020-02-01');
		await page.getByLabel('To').fill('2020-01-01');
		await page.getByRole('button', { name: 'Show' }).click();
		await expect(page.getByText('The “From” day is after the “To” day')).toBeVisible();
		await page.getByRole('link', { name: 'Clear filters' }).click();
		await audit
			.getByRole('link', { name: new RegExp(owner.name) })
			.first()
			.click();

		// Enabling: a reason again, then they can sign in.
		await expect(page.getByRole('heading', { name: 'Enable the account' })).toBeVisible();
		await page.getByLabel('Reason').fill('Notes cleaned up; agreed to the rules.');
		await page.getByRole('button', { name: 'Enable account' }).click();
		await expect(page.getByText('Enabled. The owner was e-mailed.')).toBeVisible();
		await expect(page.getByTestId('access-state')).toHaveText('can sign in');
		await signIn(theirs, owner.email, owner.password);
		await expect(theirs).toHaveURL(/\/plans$/);
		await other.close();
		await openHydrated(page, '/admin/users');
		await page.getByLabel('Name, e-mail, business or licence number').fill(idle.email);
		await page.getByRole('button', { name: 'Show' }).click();
		await expect(page.getByTestId('users-table')).toContainText(idle.name);
		await expect(page.getByTestId('users-table')).toContainText('not confirmed');
		expect(errors).toEqual([]);
	});
});

test('an admin finds contractors by status and by licence number, and sees who confirmed their e-mail', async ({ page }) => {
	const errors = watchErrors(page);
	await continueAs(page, demoUser('admin').email);
	await openHydrated(page, '/admin/users');
	const table = page.getByTestId('users-table');
	await page.getByLabel('Role').selectOption('contractor');
	await page.getByLabel('Contractor status').selectOption({ label: 'Awaiting review' });
	await page.getByRole('button', { name: 'Show' }).click();
	await expect(table).toContainText('Mossgate Forms');
	await expect(table).not.toContainText('Ridgeback Flatwork');
	for (const badge of await table.getByTestId('contractor-status').all()) await expect(badge).toHaveText('Awaiting review');

	await page.getByLabel('Contractor status').selectOption('');
	// The licence number as printed, and typed without its dashes.
	for (const q of ['FH-CC-20417', 'fhcc20417']) {
		await page.getByLabel('Name, e-mail, business or licence number').fill(q);
		await page.getByRole('button', { name: 'Show' }).click();
		await expect(table.getByRole('row')).toHaveCount(2);
		await expect(table).toContainText('Ridgeback Flatwork');
		await expect(table).toContainText('Licence FH-CC-20417');
	}
	await table.getByRole('link', { name: 'Ridgeback Flatwork' }).click();
	// The demo firms confirmed their addresses.
	await expect(page.getByTestId('email-confirmed')).toHaveText(/^· e-mail confirmed$/);
	await page.getByRole('main').getByRole('link', { name: 'Account', exact: true }).click();
	await expect(page.getByTestId('email-confirmed')).toHaveText(/^confirmed /);
	expect(errors).toEqual([]);
});
