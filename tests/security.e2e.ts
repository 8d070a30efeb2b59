import http from 'node:http';
import { expect, test } from '@playwright/test';
import { demoPassword, demoUser, openHydrated, signIn, watchErrors } from './helpers';

// watchErrors fails the test on any page error or any script, style or connection the page's CSP blocked.
test('pages carry a CSP with a nonce and no inline scripts; the planner, 3D and strength chart run under it', async ({ page }) => {
	const problems = watchErrors(page);
	const home = await page.goto('/');
	const csp = home!.headers()['content-security-policy'];
	const scriptSrc = csp.split(';').find((d) => d.trim().startsWith('script-src'))!;
	expect(scriptSrc).toMatch(/'nonce-[\w+/=]+'/);
	expect(scriptSrc).not.toContain('unsafe-inline');
	expect(csp).toContain("frame-ancestors 'none'");
	// The fonts are preloaded with the page (no reflow when they arrive), each weight once, as woff2.
	const preloads = home!.headers()['link'] ?? '';
	expect(preloads).toMatch(/nunito-latin-400-normal\.[\w-]+\.woff2>; rel="preload"; as="font"/);
	expect(preloads).not.toMatch(/\.woff>/);

	await openHydrated(page, '/plans/new');
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();

	const owner = demoUser('homeowner');
	await signIn(page, owner.email, demoPassword);
	await expect(page).toHaveURL(/\/plans$/);
	await page
		.getByRole('link', { name: /patio|pad|walk/i })
		.first()
		.click();
	// The strength chart's marks are placed by style attributes, which the policy lets through: its milestone pins rise to the right.
	const pins = page.getByTestId('strength-chart').locator('span[title*=": day "]');
	const [first, last] = [await pins.first().boundingBox(), await pins.last().boundingBox()];
	expect(last!.x).toBeGreaterThan(first!.x + 100);
	expect(last!.y).toBeLessThan(first!.y);
	await page.getByRole('button', { name: 'Show 3D preview' }).click();
	// The first frame drawn: the viewer's code and the scene have loaded, so any policy violation has shown.
	await expect(page.getByTestId('preview-canvas')).toHaveAttribute('data-ready', '');
	expect(problems).toEqual([]);
});

test('sign-in never redirects off the site, whatever form the target takes', async ({ page }) => {
	const problems = watchErrors(page);
	const owner = demoUser('homeowner');
	for (const target of ['%2F.%2F%2Fevil.example', '%2F%2Fevil.example', '%2F%5Cevil.example', '%2F%09%2Fevil.example']) {
		await page.context().clearCookies();
		await openHydrated(page, `/signin?redirectTo=${target}`);
		await page.getByLabel('E-mail').fill(owner.email);
		await page.getByLabel('Password').fill(demoPassword);
		await page.getByRole('button', { name: 'Sign in' }).click();
		await expect(page).toHaveURL(/^http:\/\/127\.0\.0\.1:\d+\/plans$/);
	}
	expect(problems).toEqual([]);
});

test('a 20 MB body is refused with 413 and the limit', async ({ request }) => {
	const res = await request.post('/forgot-password', {
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: new URL(test.info().project.use.baseURL!).origin },
		data: Buffer.alloc(20 * 1024 * 1024, 'a')
	});
	expect(res.status()).toBe(413);
	expect(await res.text()).toContain('the limit is 16.0 MB');
});

/** Posts `total` bytes without Content-Length (chunked), 64 kB at a time; resolves with the answer. */
function postChunked(url: string, total: number): Promise<{ status: number; text: string }> {
	return new Promise((resolve, reject) => {
		const req = http.request(url, {
			method: 'POST',
			headers: { 'content-type': 'application/x-www-form-urlencoded', 'transfer-encoding': 'chunked', origin: new URL(url).origin, accept: 'application/json' }
		});
		req.on('response', (res) => {
			let text = '';
			res.setEncoding('utf8');
			res.on('data', (d) => (text += d));
			res.on('end', () => resolve({ status: res.statusCode!, text }));
			res.on('error', reject);
		});
		// The server may answer and close before every byte is written; the answer is what counts.
		req.on('error', (err) => (/ECONNRESET|EPIPE/.test(String(err)) ? undefined : reject(err)));
		const chunk = Buffer.alloc(64 * 1024, 'a');
		let sent = 0;
		const write = () => {
			while (sent < total) {
				const part = chunk.subarray(0, Math.min(chunk.length, total - sent));
				sent += part.length;
				if (!req.write(part)) return void req.once('drain', write);
			}
			req.end();
		};
		write();
	});
}

test('a chunked body over the limit gets the same 413 and limit as a sized one; a small one goes through', async ({ baseURL }) => {
	const big = await postChunked(`${baseURL}/forgot-password`, 20 * 1024 * 1024);
	expect(big.status).toBe(413);
	expect(big.text).toContain('the limit is 16.0 MB');
	const api = await postChunked(`${baseURL}/api/plans`, 17 * 1024 * 1024);
	expect(api.status).toBe(413);
	expect(api.text).toContain('the limit is 16.0 MB');
	// Under the limit the form reads the body as usual: a field error, not a 413 or a 500.
	const small = await postChunked(`${baseURL}/forgot-password`, 1000);
	expect(small.status).toBe(200);
	expect(JSON.parse(small.text)).toMatchObject({ type: 'failure', status: 400 });
});
