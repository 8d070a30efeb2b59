import { expect, test } from '@playwright/test';
import sharp from 'sharp';
import { openHydrated, signUp, uniqueEmail, watchErrors } from './helpers';
import { fillProfile, insertPlan, pdf } from './pro-helpers';

test.describe.configure({ timeout: 180_000 });

const MB = 1024 * 1024;
const bigPdf = (mb: number) => ({
	name: 'scanned-licence.pdf',
	mimeType: 'application/pdf',
	buffer: Buffer.concat([pdf('big').buffer, Buffer.alloc(mb * MB, 32)])
});
const wordFile = {
	name: 'insurance.docx',
	mimeType: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
	buffer: Buffer.from('PK\u0003\u0004 not really')
};

test('contractor documents: a wrong type or an oversized file is refused in the browser with the reason, and nothing typed is lost', async ({ page }) => {
	const errors = watchErrors(page);
	const posts: string[] = [];
	page.on('request', (r) => r.method() === 'POST' && posts.push(r.url()));
	await signUp(page, { name: 'Bo Kettle', email: uniqueEmail('docs'), password: 'form-boards-9', role: 'contractor' });
	await expect(page).toHaveURL(/\/pro$/);
	await openHydrated(page, '/pro/profile');
	await fillProfile(page, 'Kettle Pads', { zip: '97321', radius: '20', unit: 'mi' });
	await expect(page.getByText('PDF, JPEG, PNG, or WebP, at most 5.0 MB.').first()).toBeVisible();
	posts.length = 0;

	await page.getByLabel('Licence document').setInputFiles(bigPdf(6));
	await expect(page.locator('#field-licence-error')).toHaveText(/^The licence document “scanned-licence.pdf” is 6\.0 MB; the limit is 5\.0 MB\./);
	expect(await page.getByLabel('Licence document').evaluate((i: HTMLInputElement) => i.files?.length)).toBe(0);
	await page.getByLabel('Insurance certificate').setInputFiles(wordFile);
	await expect(page.locator('#field-insurance-error')).toHaveText(/must be a PDF, a JPEG, a PNG, or a WebP image; “insurance.docx” is not/);
	expect(posts).toEqual([]); // nothing was sent
	await expect(page.getByLabel('Business name')).toHaveValue('Kettle Pads');
	await expect(page.getByLabel('Licence number')).toHaveValue('FH-CC-55120');

	// Good files clear the messages and the profile goes for review with everything typed.
	await page.getByLabel('Licence document').setInputFiles(pdf('licence'));
	await expect(page.locator('#field-licence-error')).toHaveCount(0);
	await page.getByLabel('Insurance certificate').setInputFiles(pdf('insurance'));
	await expect(page.locator('#field-insurance-error')).toHaveCount(0);
	await page.getByRole('button', { name: 'Send for review' }).click();
	await expect(page.getByText('is checking your licence and insurance')).toBeVisible();
	expect(errors).toEqual([]);
});

test('without JavaScript, a form over the body limit gets a page that says why, not a bare 413', async ({ browser }) => {
	const context = await browser.newContext({ javaScriptEnabled: false });
	const page = await context.newPage();
	await signUp(page, { name: 'Noor Flint', email: uniqueEmail('nojs'), password: 'no-scripts-here', role: 'contractor' });
	await page.goto('/pro/profile');
	await fillProfile(page, 'Flint Flatwork');
	await page.getByLabel('Licence document').setInputFiles(bigPdf(17));
	const [answer] = await Promise.all([
		page.waitForResponse((r) => r.request().method() === 'POST'),
		page.getByRole('button', { name: 'Send for review' }).click()
	]);
	expect(answer.status()).toBe(413);
	await expect(page.getByRole('heading', { name: 'The files are too large' })).toBeVisible();
	await expect(page.getByText(/the limit is 16\.0 MB/)).toBeVisible();
	await expect(page.getByText(/what you typed is still in the form/)).toBeVisible();
	await expect(page.getByRole('link', { name: 'Open the form again' })).toHaveAttribute('href', '/pro/profile');
	await context.close();
});

test('site photos: a wrong type or an oversized photo is refused before sending, a good one is added', async ({ page }) => {
	const errors = watchErrors(page);
	const email = uniqueEmail('photos');
	await signUp(page, { name: 'Eda Marsh', email, password: 'photo-of-yard', role: 'homeowner' });
	await expect(page).toHaveURL(/\/plans$/);
	const { id } = await insertPlan(email, { name: 'Shed pad', postcode: '97321' });
	await openHydrated(page, `/plans/${id}`);
	const sent: string[] = [];
	page.on('request', (r) => r.method() === 'POST' && r.url().endsWith('/photos') && sent.push(r.url()));
	await expect(page.getByText('JPEG, PNG, or WebP, up to 12 MB each.')).toBeVisible();

	const photo = await sharp({ create: { width: 320, height: 240, channels: 3, background: '#9bb88a' } })
		.jpeg()
		.toBuffer();
	await page.getByTestId('photo-input').setInputFiles([
		{ name: 'plan.pdf', mimeType: 'application/pdf', buffer: pdf('x').buffer },
		{ name: 'huge.jpg', mimeType: 'image/jpeg', buffer: Buffer.concat([photo, Buffer.alloc(13 * MB)]) },
		{ name: 'yard.jpg', mimeType: 'image/jpeg', buffer: photo }
	]);
	const uploads = page.getByTestId('upload');
	await expect(uploads.filter({ hasText: 'plan.pdf' })).toContainText('The photo must be a JPEG, a PNG, or a WebP image; “plan.pdf” is not.');
	await expect(uploads.filter({ hasText: 'huge.jpg' })).toContainText('is 13 MB; the limit is 12 MB');
	await expect(uploads.filter({ hasText: 'yard.jpg' })).toHaveAttribute('data-state', 'done');
	expect(sent).toHaveLength(1); // only the good photo went to the server
	await expect(page.getByRole('img', { name: /Site photo/ }).first()).toBeVisible();
	expect(errors).toEqual([]);
});
