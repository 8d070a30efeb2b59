import { expect, type Browser, type BrowserContextOptions, type Cookie, type Page } from '@playwright/test';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import demo from '../fixtures/demo.json' with { type: 'json' };

export const demoPassword = demo.password;
export const demoUser = (role: string) => demo.users.find((u) => u.role === role)!;
/** The demo homeowner who owns the demo plan `planId` (fixtures/demo.json). */
export const demoPlanOwner = (planId: string) => demo.users.find((u) => (u as { plans?: string[] }).plans?.includes(planId))!;

/**
 * The demo accounts a test may start signed in as, with where the sign-in form lands each:
 * tests/auth.setup.ts signs each in once and keeps its cookies in sessionFile(email), and a test
 * starts signed in with `test.use({ storageState: sessionFile(email) })`. The session is shared by
 * every such test, so none of them may sign it out (signOut refuses); a test that signs out signs
 * itself in.
 */
export const storedSessions = [
	{ email: demoUser('admin').email, landsOn: /\/admin$/, home: '/admin' },
	{ email: demoUser('homeowner').email, landsOn: /\/plans$/, home: '/plans' },
	{ email: demoUser('contractor').email, landsOn: /\/pro$/, home: '/pro' },
	{ email: demoPlanOwner('castell-shed-pad').email, landsOn: /\/plans$/, home: '/plans' },
	// The two other demo firms, which the bid and lead journeys switch to part-way.
	{ email: 'june@quarrylaneslabs.example', landsOn: /\/pro$/, home: '/pro' },
	{ email: 'sam@mossgateforms.example', landsOn: /\/pro$/, home: '/pro' }
];
const SESSION_COOKIE = 'stakeline_session';
export const sessionFile = (email: string) => fileURLToPath(new URL(`../.data/auth/${email}.json`, import.meta.url));

/** A fresh visitor's browser context, also in a test that starts signed in: Playwright hands the test's `storageState` to every new context unless it is given one. */
export const visitorContext = (browser: Browser, options: BrowserContextOptions = {}) => browser.newContext({ storageState: undefined, ...options });

/**
 * Goes on in this page as a demo account of storedSessions, where its sign-in would land, for a
 * journey that changes hands part-way and is not about signing in (signIn drives the form): the
 * page's session cookie becomes the stored one, the one before it is left alone on the server. From
 * there, switch again with continueAs or go on as a visitor with dropSession, never signOut.
 * Not from a plan's own page: it hands the plan's other pages to the service worker to fetch in the
 * background, and each signed-in answer sets the session cookie again, so one arriving after the swap
 * brings the previous account back. There the journey signs out and in through the forms.
 */
export async function continueAs(page: Page, email: string) {
	const stored = storedSessions.find((s) => s.email === email);
	if (!stored) throw new Error(`${email} has no stored session (storedSessions in tests/helpers.ts)`);
	const { cookies }: { cookies: Cookie[] } = JSON.parse(readFileSync(sessionFile(email), 'utf8'));
	const session = cookies.filter((c) => c.name === SESSION_COOKIE);
	// Off the site first, as in dropSession: a late answer to the last user's page would set their
	// cookie again, and two firms both land on /pro, so the URL alone would not tell.
	await page.goto('about:blank');
	await page.context().clearCookies({ name: SESSION_COOKIE });
	await page.context().addCookies(session);
	await openHydrated(page, stored.home);
	await expect(page).toHaveURL(stored.landsOn);
	const now = (await page.context().cookies()).find((c) => c.name === SESSION_COOKIE)?.value;
	expect(now, `the session cookie is ${email}'s`).toBe(session[0]?.value);
}

/** Goes on as a visitor: drops the page's session cookie without ending the session (a stored one stays good for the tests after). */
export async function dropSession(page: Page) {
	// Off the site first: a response still on its way (every signed-in answer renews the cookie) would
	// set the cookie again after it was cleared.
	await page.goto('about:blank');
	await page.context().clearCookies({ name: SESSION_COOKIE });
}

export function uniqueEmail(label: string) {
	return `${label}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@e2e.stakeline.test`;
}

/**
 * Opens a page and waits until it has hydrated (the root layout marks <html data-hydrated>):
 * hydration re-applies the inputs' values, so typing before it ends can be wiped (seen on the
 * sign-in page once the app grew).
 */
export async function openHydrated(page: Page, url: string) {
	await page.goto(url);
	await hydrated(page);
}

/** Reloads the page and waits for it to hydrate again (see openHydrated). */
export async function reloadHydrated(page: Page) {
	await page.reload();
	await hydrated(page);
}

/** Waits until the page in front is hydrated: the signal a test waits for before it types or clicks. */
export async function hydrated(page: Page) {
	// A test may turn JavaScript off: then SvelteKit's inline start script (which sets a
	// __sveltekit_… global) never ran and the page is complete as served.
	const scripted = await page.evaluate(() => Object.keys(globalThis).some((k) => k.startsWith('__sveltekit_')));
	if (scripted) await expect(page.locator('html[data-hydrated]')).toBeAttached();
}
const openForm = openHydrated;

/**
 * Signs up through the form and follows the confirmation link from the fake mailbox, which signs the
 * new account in (sign-up is confirm-first): ends where the link lands, /pro for a contractor, else
 * the page the sign-up form was opened for (`path`, e.g. '/signup?redirectTo=/plans/new') or /plans.
 */
export async function signUp(page: Page, o: { name: string; email: string; password: string; role?: 'homeowner' | 'contractor'; path?: string }) {
	await openForm(page, o.path ?? '/signup');
	if (o.role === 'contractor') await page.getByLabel(/Bid on local jobs/).check();
	await page.getByLabel('Your name').fill(o.name);
	await page.getByLabel('E-mail').fill(o.email);
	await page.getByLabel('Password', { exact: true }).fill(o.password);
	await submitAndWait(page, 'Create account');
	await expect(page.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();
	await openHydrated(page, await mailLink(page, o.email, /Confirm your e-mail/, { timeout: 60_000 }));
	await submitAndWait(page, 'Confirm my e-mail');
	await page.waitForURL((url) => url.pathname !== '/verify-email');
}

/** A homeowner who has just signed up, on the first step of a new plan: where the planner journeys that save begin. */
export async function newPlanSignedUp(page: Page, o: { name: string; label: string; password: string }) {
	await signUp(page, { name: o.name, email: uniqueEmail(o.label), password: o.password });
	await page.goto('/plans/new');
	await expect(page.getByRole('heading', { name: '1. Site' })).toBeVisible();
}

export async function signIn(page: Page, email: string, password: string) {
	await openForm(page, '/signin');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(password);
	await submitAndWait(page, 'Sign in');
}

/** Clicks a form's button and waits for the POST's answer, so its cookie is set before the next step. */
async function submitAndWait(page: Page, button: string) {
	await Promise.all([
		page.waitForResponse((r) => r.request().method() === 'POST' && new URL(r.url()).origin === new URL(page.url()).origin),
		page.getByRole('button', { name: button }).click()
	]);
}

export async function signOut(page: Page) {
	const token = (await page.context().cookies()).find((c) => c.name === SESSION_COOKIE)?.value;
	for (const { email } of storedSessions) {
		const file = sessionFile(email);
		const stored: { cookies: { value: string }[] } = existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) : { cookies: [] };
		if (token && stored.cookies.some((c) => c.value === token))
			throw new Error(`signOut would end ${email}'s stored session, which later tests start with: sign this test in itself`);
	}
	await page.getByRole('button', { name: 'Sign out' }).click();
	await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
}

/**
 * The first link of the newest message to `email` whose subject matches, read from the fake
 * mailbox. `timeout` (default 15 s) is how long to keep looking; pro journeys pass a longer one,
 * since on a loaded machine a page load alone can take seconds. `mentioning` picks this journey's
 * mail when journeys running beside it send the same address mail with the same subject (leads
 * near one town).
 */
export async function mailLink(page: Page, email: string, subject: RegExp, o: { timeout?: number; mentioning?: string } = {}): Promise<string> {
	const timeout = o.timeout ?? 15_000;
	let href: string | null = null;
	await expect(async () => {
		await page.goto(`/dev/mailbox?to=${encodeURIComponent(email)}`);
		const mail = page
			.getByTestId('mail')
			.filter({ has: page.getByRole('heading', { name: subject }) })
			.filter(o.mentioning ? { hasText: o.mentioning } : {})
			.first();
		href = await mail
			.getByTestId('mail-link')
			.first()
			.getAttribute('href', { timeout: Math.min(5_000, timeout / 3) });
		expect(href).toBeTruthy();
	}).toPass({ timeout });
	return href!;
}

/** Page errors seen from now on; a planner test ends by expecting none. */
export function watchErrors(page: Page) {
	const errors: string[] = [];
	page.on('pageerror', (e) => errors.push(e.message));
	// A content security policy violation is logged, not thrown: it counts as a page error too.
	page.on('console', (m) => {
		if (m.type() === 'error' && m.text().includes('Content Security Policy')) errors.push(m.text());
	});
	return errors;
}

/** Waits until the wizard has saved the signed-in visitor's plan (its editor's address names it) and returns the plan's id. */
export async function savedPlanId(page: Page) {
	await expect(page.getByTestId('save-status')).toHaveAttribute('data-status', 'saved', { timeout: 15_000 });
	await expect(page).toHaveURL(/\/plans\/[0-9a-f-]{36}\/edit$/);
	return page.url().split('/').at(-2)!;
}

/** Opens a planner step from the step list and waits for its heading. */
export async function wizardStep(page: Page, title: string) {
	await page
		.getByRole('navigation', { name: 'Plan steps' })
		.getByRole('button', { name: new RegExp(title) })
		.click();
	await expect(page.getByRole('heading', { name: new RegExp(`\\d\\. ${title}`) })).toBeVisible();
}
