import { expect, test } from '@playwright/test';
import { continueAs, demoUser, dropSession, mailLink, openHydrated, signIn, signOut, signUp, uniqueEmail } from './helpers';
import { daysFromNow, fillProfile, pdf, pngCertificate } from './pro-helpers';

// Long journeys on a shared machine: give each the time a slow run needs.
test.describe.configure({ timeout: 300_000 });

test('a contractor onboards with documents, an admin approves, and only they two can open the documents', async ({ page }) => {
	const email = uniqueEmail('vet');
	const business = `Larkspur Flatwork ${Date.now()}`;
	await signUp(page, { name: 'Tove Larkin', email, password: 'pour-day-sunny', role: 'contractor' });
	await expect(page.getByRole('heading', { name: 'Not yet submitted' })).toBeVisible();
	await page.getByRole('link', { name: 'Set up the business profile' }).click();
	await expect(page.getByLabel('Contact person')).toHaveValue('Tove Larkin');

	await fillProfile(page, business);
	// An insurance date already past is refused: an expired certificate cannot be sent for review.
	await page.getByLabel('Insurance expires on').fill('2020-05-31');
	// Text with a .pdf name and type is refused by its content; the other values stay.
	await page
		.getByLabel('Licence document')
		.setInputFiles({ name: 'licence.pdf', mimeType: 'application/pdf', buffer: Buffer.from('only words, no PDF here\n') });
	await page.getByLabel('Insurance certificate').setInputFiles(await pngCertificate());
	await page.getByRole('button', { name: 'Send for review' }).click();
	await expect(page.locator('#field-licence-error')).toHaveText(/must be a PDF, a JPEG, a PNG, or a WebP image; this file is not one of them/);
	await expect(page.getByText('Files you chose were not kept')).toBeVisible();
	await expect(page.locator('#field-insuranceExpiresOn-error')).toHaveText(/This date has passed/);
	await expect(page.getByLabel('Licence expires on')).toHaveValue(daysFromNow(400));
	await page.getByLabel('Insurance expires on').fill(daysFromNow(200));
	await expect(page.getByLabel('Business name')).toHaveValue(business);
	await expect(page.getByLabel('Pour and finish')).toBeChecked();
	await expect(page.getByLabel('Unit')).toHaveValue('km');
	await page.screenshot({ path: 'test-results/screens/pro-profile-rejected-file.png', fullPage: true });

	await page.getByLabel('Licence document').setInputFiles(pdf('licence'));
	await page.getByLabel('Insurance certificate').setInputFiles(await pngCertificate());
	await page.getByRole('button', { name: 'Send for review' }).click();
	await expect(page).toHaveURL(/\/pro$/);
	await expect(page.getByRole('heading', { name: 'Awaiting review' })).toBeVisible();
	await expect(page.getByText('is checking your licence and insurance')).toBeVisible();

	await page.goto('/pro/profile');
	const licenceHref = (await page.getByRole('link', { name: 'licence.pdf' }).getAttribute('href'))!;
	const insuranceHref = (await page.getByRole('link', { name: 'insurance-certificate.png' }).getAttribute('href'))!;
	const own = await page.request.get(licenceHref);
	expect(own.status()).toBe(200);
	expect(own.headers()['content-type']).toBe('application/pdf');
	expect((await own.body()).subarray(0, 5).toString()).toBe('%PDF-');
	expect((await page.request.get(insuranceHref)).headers()['content-type']).toBe('image/png');

	// The admin works through the queue.
	await continueAs(page, demoUser('admin').email);
	await page.getByTestId('vetting-queue').getByRole('link', { name: business }).click();
	await expect(page.getByTestId('contractor-status')).toHaveText('Awaiting review');
	await expect(page.getByRole('link', { name: 'insurance-certificate.png' })).toBeVisible();
	expect((await page.request.get(licenceHref)).status()).toBe(200);
	await page.getByRole('button', { name: 'Send back' }).click();
	await expect(page.locator('#field-reason-error')).toHaveText(/Say what the contractor needs to know/);
	await page.getByRole('button', { name: 'Approve' }).click();
	await expect(page.getByText('Saved. The contractor was e-mailed.')).toBeVisible();
	await expect(page.getByTestId('contractor-status')).toHaveText('Approved');
	await page.screenshot({ path: 'test-results/screens/admin-contractor-approved.png', fullPage: true });

	await page.goto('/admin/audit');
	await expect(page.getByTestId('audit-table').getByRole('row').nth(1)).toContainText(`Ada Vellum`);
	await expect(page.getByTestId('audit-table').getByRole('row').nth(1)).toContainText(`Approve`);
	await expect(page.getByTestId('audit-table').getByRole('row').nth(1)).toContainText(business);
	await page.goto(`/admin/users?q=${encodeURIComponent(email)}&role=contractor`);
	await expect(page.getByTestId('users-table').getByRole('row')).toHaveCount(2);
	await page.goto(`/admin/users?q=${encodeURIComponent(email)}&role=homeowner`);
	await expect(page.getByText('No account matches. Clear a filter to see more.')).toBeVisible();
	await expect(page.getByTestId('users-table')).toHaveCount(0);

	const link = await mailLink(page, email, /pro account is approved/, { timeout: 60_000 });
	expect(link).toMatch(/\/pro$/);
	await dropSession(page);

	await signIn(page, email, 'pour-day-sunny');
	await expect(page.getByRole('heading', { name: 'Approved' })).toBeVisible();

	// Another contractor: the documents do not exist for them; admin pages are closed.
	await continueAs(page, demoUser('contractor').email);
	expect((await page.request.get(licenceHref)).status()).toBe(404);
	expect((await page.goto('/admin/users'))?.status()).toBe(403);
	expect((await page.goto('/admin/audit'))?.status()).toBe(403);

	await continueAs(page, demoUser('homeowner').email);
	expect((await page.request.get(insuranceHref)).status()).toBe(403);
	expect((await page.goto('/admin'))?.status()).toBe(403);
	expect((await page.goto('/pro/profile'))?.status()).toBe(403);
	await dropSession(page);

	const anonymous = await page.request.get(licenceHref, { maxRedirects: 0 });
	expect(anonymous.status()).toBe(303);
	expect(anonymous.headers()['location']).toMatch(/^\/signin/);
});

test.describe('without JavaScript', () => {
	test.use({ javaScriptEnabled: false });

	test('the profile form reports missing fields and documents, and the send-back loop is seen from both sides', async ({ page }) => {
		test.setTimeout(300_000);
		const email = uniqueEmail('nojs');
		const business = `Brask Base & Form ${Date.now()}`;
		await signUp(page, { name: 'Ivo Brask', email, password: 'plain-forms-ok', role: 'contractor' });
		await openHydrated(page, '/pro/profile');
		await page.getByLabel('Business name').fill(business);
		await page.getByLabel('ZIP code').fill('00000');
		await page.getByRole('button', { name: 'Send for review' }).click();
		await expect(page.locator('#field-phone-error')).toHaveText('Enter a phone number with its area code.');
		await expect(page.locator('#services-error')).toHaveText('Choose at least one service.');
		await expect(page.locator('#field-licence-error')).toHaveText('Add your licence document.');
		await expect(page.getByLabel('Business name')).toHaveValue(business);

		await fillProfile(page, business);
		await page.getByLabel('ZIP code').fill('00000');
		await page.getByLabel('Licence document').setInputFiles(pdf('brask-licence'));
		await page.getByLabel('Insurance certificate').setInputFiles(pdf('brask-insurance'));
		await page.getByRole('button', { name: 'Send for review' }).click();
		await expect(page.locator('#field-servicePostcode-error')).toHaveText('We do not know this ZIP code. Please check it.');
		await page.getByLabel('ZIP code').fill('97321');
		await page.getByLabel('Licence document').setInputFiles(pdf('brask-licence'));
		await page.getByLabel('Insurance certificate').setInputFiles(pdf('brask-licence'));
		await page.getByRole('button', { name: 'Send for review' }).click();
		await expect(page).toHaveURL(/\/pro$/);
		await signOut(page);

		// The queue shows its length on every admin page (the e-mail to every admin is checked in vetting.integration.spec.ts).
		const admin = demoUser('admin').email;
		await continueAs(page, admin);
		await page.goto('/admin/users');
		expect(Number(await page.getByTestId('queue-count').textContent())).toBeGreaterThan(0);
		await page.getByRole('link', { name: /Vetting queue/ }).click();
		await page.getByTestId('vetting-queue').getByRole('link', { name: business }).click();
		await expect(page.getByRole('heading', { name: business })).toBeVisible();
		await expect(page.getByTestId('changes-since-review')).toHaveCount(0); // first review: everything is new
		await page.getByLabel('Reason').fill('Please upload the insurance certificate, not the licence twice.');
		await page.getByRole('button', { name: 'Send back' }).click();
		await expect(page.getByTestId('contractor-status')).toHaveText('Sent back: documents needed');
		await expect(page.getByLabel('Reason')).toHaveValue(''); // the box clears after a decision
		await dropSession(page);

		// The contractor follows the e-mail to the profile page, where the reason is.
		await signIn(page, email, 'plain-forms-ok');
		await expect(page.getByRole('heading', { name: 'Sent back: documents needed' })).toBeVisible();
		await expect(page.getByTestId('status-reason')).toHaveText('Please upload the insurance certificate, not the licence twice.');
		await openHydrated(page, await mailLink(page, email, /profile was sent back/, { timeout: 60_000 }));
		await expect(page).toHaveURL(/\/pro\/profile$/);
		await expect(page.getByTestId('sent-back')).toContainText('Please upload the insurance certificate, not the licence twice.');
		await page.getByLabel('Insurance certificate').setInputFiles(pdf('brask-insurance'));
		await page.getByLabel('Phone').fill('(541) 555-0177');
		await page.getByRole('button', { name: 'Send for review again' }).click();
		await expect(page).toHaveURL(/\/pro$/);
		await expect(page.getByRole('heading', { name: 'Awaiting review' })).toBeVisible();

		// The admin sees what changed since the send-back, and the replaced file as history.
		await continueAs(page, admin);
		await page.getByTestId('vetting-queue').getByRole('link', { name: business }).click();
		await expect(page.getByTestId('changes-since-review')).toContainText('Phone');
		await expect(page.getByTestId('changes-since-review')).toContainText('New insurance certificate');
		await expect(page.getByTestId('changes-since-review')).not.toContainText('Licence');
		await expect(page.getByTestId('earlier-documents')).toContainText('Insurance certificate: brask-licence.pdf');
		await expect(page.getByRole('link', { name: 'brask-insurance.pdf' })).toBeVisible();
		await page.screenshot({ path: 'test-results/screens/admin-changes-since-review.png', fullPage: true });
		await page.getByRole('button', { name: 'Approve' }).click();
		await expect(page.getByTestId('contractor-status')).toHaveText('Approved');
		await dropSession(page);

		await signIn(page, email, 'plain-forms-ok');
		await expect(page.getByRole('heading', { name: 'Approved' })).toBeVisible();
	});
});
