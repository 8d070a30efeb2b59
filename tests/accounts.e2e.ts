import { expect, test } from '@playwright/test';
import { demoPassword, demoUser, mailLink, openHydrated, signIn, signOut, signUp, uniqueEmail } from './helpers';

test('a homeowner signs up, gets no session until the e-mailed link is followed, then signs out and back in', async ({ page }) => {
	const email = uniqueEmail('home');
	await openHydrated(page, '/signup');
	await page.getByLabel('Your name').fill('Rowan Teale');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password', { exact: true }).fill('garden-path-42');
	await page.getByRole('button', { name: 'Create account' }).click();
	await expect(page.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();
	await expect(page.getByText(`We sent a message to ${email}`)).toBeVisible();
	await page.screenshot({ path: 'test-results/screens/signup-check-mail.png' });
	// Confirm-first: no session yet, and the password alone does not sign in.
	await page.goto('/plans');
	await expect(page).toHaveURL(/\/signin\?redirectTo=%2Fplans$/);
	await signIn(page, email, 'garden-path-42');
	await expect(page.getByText('Just signed up? Open the link we e-mailed you first.')).toBeVisible();

	const link = await mailLink(page, email, /Confirm your e-mail/);
	await openHydrated(page, link);
	await page.getByRole('button', { name: 'Confirm my e-mail' }).click();
	await expect(page).toHaveURL(/\/plans$/);
	await expect(page.getByRole('heading', { name: 'My plans' })).toBeVisible();
	await expect(page.getByText('We sent a link to')).toHaveCount(0);
	// A confirmation link works only once.
	await page.goto(link);
	await expect(page.getByRole('heading', { name: 'This link no longer works' })).toBeVisible();

	await page.goto('/account');
	await expect(page.getByText('E-mail confirmed.')).toBeVisible();
	await signOut(page);
	await signIn(page, email, 'garden-path-42');
	await expect(page).toHaveURL(/\/plans$/);
});

test('bad sign-up input shows a message beside each field and keeps what was typed', async ({ page }) => {
	await openHydrated(page, '/signup');
	await page.getByLabel('Your name').fill('Ivy Marsh');
	await page.getByLabel('E-mail').fill('ivy-at-nowhere');
	await page.getByLabel('Password', { exact: true }).fill('short');
	await page.getByRole('button', { name: 'Create account' }).click();
	await expect(page.locator('#field-email-error')).toHaveText('That does not look like an e-mail address.');
	await expect(page.locator('#field-password-error')).toHaveText('Use at least 10 characters.');
	await expect(page.getByLabel('Your name')).toHaveValue('Ivy Marsh');
	await expect(page.getByLabel('E-mail')).toHaveValue('ivy-at-nowhere');
	await expect(page.getByLabel('Password', { exact: true })).toHaveValue('');
	await page.screenshot({ path: 'test-results/screens/signup-errors.png', fullPage: true });

	await page.getByLabel('Your name').fill('');
	await page.getByRole('button', { name: 'Create account' }).click();
	await expect(page.locator('#field-name-error')).toHaveText('Enter your name.');
});

test('sign-up answers a taken address exactly as a new one, and e-mails the owner of the taken one', async ({ page, request }) => {
	const origin = new URL(test.info().project.use.baseURL!).origin;
	const owner = uniqueEmail('owner');
	await signUp(page, { name: 'Ada Owner', email: owner, password: 'owners-password-1' });
	await signOut(page);
	const fresh = uniqueEmail('fresh');
	const post = (email: string) =>
		request.post('/signup', {
			form: { name: 'Copy Cat', email, password: 'long-enough-pass', role: 'contractor', redirectTo: '' },
			headers: { origin, accept: 'application/json', 'x-sveltekit-action': 'true' },
			maxRedirects: 0
		});
	const [taken, created] = [await post(owner.toUpperCase()), await post(fresh)];
	const answer = async (res: Awaited<ReturnType<typeof post>>, email: string) => ({
		status: res.status(),
		cookie: res.headers()['set-cookie'] ?? null,
		body: (await res.text()).replaceAll(email.toLowerCase(), 'ADDRESS')
	});
	const a = await answer(taken, owner);
	expect(a).toEqual(await answer(created, fresh));
	expect(a.status).toBe(200);
	expect(a.cookie).toBeNull();

	// The owner hears of the attempt; the new address gets its confirmation link.
	await page.goto(await mailLink(page, owner, /Someone tried to create a Stakeline account/));
	await expect(page).toHaveURL(/\/signin$/);
	await mailLink(page, fresh, /Confirm your e-mail/);
	// Nothing about the owner's account changed: it still signs in with its own password and role.
	await signIn(page, owner, 'owners-password-1');
	await expect(page).toHaveURL(/\/plans$/);
});

test('a new contractor sees that the profile is not yet submitted for review', async ({ page }) => {
	await signUp(page, { name: 'Lena Fossbrook', email: uniqueEmail('pro'), password: 'forms-and-stakes', role: 'contractor' });
	await expect(page).toHaveURL(/\/pro$/);
	await expect(page.getByRole('heading', { name: 'Not yet submitted' })).toBeVisible();
	await page.screenshot({ path: 'test-results/screens/pro-awaiting-review.png' });
});

test('admins reach /admin; a homeowner gets 403 there; a visitor is sent to sign in and back', async ({ page }) => {
	await signIn(page, demoUser('admin').email, demoPassword);
	await expect(page).toHaveURL(/\/admin$/);
	await expect(page.getByRole('heading', { name: 'Contractors awaiting review' })).toBeVisible();
	await expect(page.getByText('Mossgate Forms')).toBeVisible();
	await signOut(page);

	// The first admin comes from ADMIN_EMAIL / ADMIN_PASSWORD (set for the test server).
	await signIn(page, 'first-admin@stakeline.test', 'first-admin-password');
	await expect(page).toHaveURL(/\/admin$/);
	await signOut(page);

	await signIn(page, demoUser('homeowner').email, demoPassword);
	const res = await page.goto('/admin');
	expect(res?.status()).toBe(403);
	await expect(page.getByRole('heading', { name: 'Not for this account' })).toBeVisible();
	expect((await page.goto('/pro'))?.status()).toBe(403);
	await signOut(page);

	await openHydrated(page, '/admin');
	await expect(page).toHaveURL(/\/signin\?redirectTo=%2Fadmin$/);
	await page.getByLabel('E-mail').fill(demoUser('admin').email);
	await page.getByLabel('Password').fill(demoPassword);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(/\/admin$/);
});

test('password reset through the mailbox ends old sessions and the old password', async ({ page, browser }) => {
	const email = uniqueEmail('reset');
	await signUp(page, { name: 'Otto Brindle', email, password: 'first-password-1' });
	await expect(page).toHaveURL(/\/plans$/);

	const other = await browser.newPage();
	await openHydrated(other, '/forgot-password');
	await other.getByLabel('E-mail').fill(email);
	await other.getByRole('button', { name: 'Send the link' }).click();
	await expect(other.getByText(`If an account uses ${email}`)).toBeVisible();
	const link = await mailLink(other, email, /new Stakeline password/);
	await openHydrated(other, link);
	await other.getByLabel('New password').fill('second-password-2');
	await other.getByRole('button', { name: 'Save the new password' }).click();
	await expect(other.getByText('Your password is changed.')).toBeVisible();

	// The first browser's session was ended by the reset.
	await page.goto('/plans');
	await expect(page).toHaveURL(/\/signin/);
	await signIn(page, email, 'first-password-1');
	await expect(page.getByText('That e-mail and password do not match an account.')).toBeVisible();
	await signIn(page, email, 'second-password-2');
	await expect(page).toHaveURL(/\/plans$/);
	// The link is single-use.
	await other.goto(link);
	await expect(other.getByText('This link has expired or was used already.')).toBeVisible();
	await other.close();
});

test('repeated failed sign-ins are throttled with the wait time', async ({ page }) => {
	const email = uniqueEmail('throttle');
	await signUp(page, { name: 'Pim Larch', email, password: 'right-password-9' });
	await signOut(page);
	for (let i = 0; i < 5; i++) {
		await signIn(page, email, `wrong-password-${i}`);
		await expect(page.getByText('That e-mail and password do not match an account.')).toBeVisible();
	}
	// Even the right password waits now.
	await signIn(page, email, 'right-password-9');
	await expect(page.getByText(/Too many sign-in attempts from here\. For your safety, please wait 15 minutes/)).toBeVisible();
	await expect(page).toHaveURL(/\/signin/);

	// The way around: a one-time sign-in link by e-mail.
	await page.getByRole('link', { name: 'E-mail me a sign-in link instead' }).click();
	await expect(page.getByLabel('E-mail')).toHaveValue(email);
	await page.getByRole('button', { name: 'Send the link' }).click();
	await expect(page.getByText(`If an account uses ${email}, a sign-in link is on its way.`)).toBeVisible();
	const link = await mailLink(page, email, /sign-in link/);
	await page.goto(link);
	await page.getByRole('button', { name: 'Sign me in' }).click();
	await expect(page).toHaveURL(/\/plans$/);
});

test.describe('without JavaScript', () => {
	test.use({ javaScriptEnabled: false });

	test('sign-in and sign-out still work as plain forms', async ({ page }) => {
		await signIn(page, demoUser('contractor').email, demoPassword);
		await expect(page).toHaveURL(/\/pro$/);
		await expect(page.getByRole('heading', { name: 'Approved' })).toBeVisible();
		await page.getByRole('button', { name: 'Sign out' }).click();
		await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
	});
});

test('on a 390 px phone a long address on the check-your-mail page wraps inside the card', async ({ page }) => {
	await page.setViewportSize({ width: 390, height: 844 });
	const email = uniqueEmail('a-rather-long-address-for-a-phone');
	await openHydrated(page, '/signup');
	await page.getByLabel('Your name').fill('Wren Longfield');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password', { exact: true }).fill('long-address-wraps');
	await page.getByRole('button', { name: 'Create account' }).click();
	await expect(page.getByText(`We sent a message to ${email}`)).toBeVisible();
	const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
	expect(scroll).toBeLessThanOrEqual(client);
});
