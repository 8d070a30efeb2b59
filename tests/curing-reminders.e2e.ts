// The plan page's curing reminders and calendar file, from a fresh visitor's sign-up to the stop
// link in a reminder e-mail, against the built app, its job worker and the fake SMTP server.
import fs from 'node:fs/promises';
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import ical from 'node-ical';
import postgres from 'postgres';
import { curingReminders } from '../src/lib/plan/reminders';
import demoPlans from '../fixtures/demo-plans.json' with { type: 'json' };
import { openHydrated, signUp, uniqueEmail, watchErrors } from './helpers';
import { insertPlan } from './pro-helpers';

test.use({ timezoneId: 'America/Denver' });

test('a homeowner turns on curing reminders, adds the plan to a calendar, and stops them from the e-mail', async ({ page, browser }) => {
	test.setTimeout(180_000);
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	try {
		const email = uniqueEmail('curing');
		await signUp(page, { name: 'Ines Ardal', email, password: 'keep-it-moist-1' });
		const errors = watchErrors(page);
		const { id } = await insertPlan(email, { name: 'Curing patio', postcode: '97321' });
		const input = demoPlans.plans[0].input as { conditions: { pourDate: string } };
		const pourDate = input.conditions.pourDate;
		const days = curingReminders(input, pourDate);

		await openHydrated(page, `/plans/${id}`);
		const section = page.getByRole('region', { name: 'Curing days' });
		const status = section.getByTestId('reminder-status');
		await expect(status).toContainText(`Off. When on, you get an e-mail at 07:00 (America/Denver) on each of the ${days.length} curing days`);
		await section.getByLabel('E-mail me curing reminders').check();
		await expect(section.getByText('Curing reminders are on.')).toBeVisible();
		await expect(status).toContainText(`On: ${days.length} e-mails scheduled at 07:00 (America/Denver)`);
		expect((await new AxeBuilder({ page }).include('section[aria-labelledby="yard-title"]').analyze()).violations).toEqual([]);

		// The calendar file: every pour day and milestone of the plan, as all-day events.
		const [download] = await Promise.all([page.waitForEvent('download'), section.getByRole('link', { name: 'Add to calendar' }).click()]);
		expect(download.suggestedFilename()).toBe('Curing-patio.ics');
		const events = Object.values(ical.sync.parseICS(await fs.readFile((await download.path())!, 'utf8'))).filter((c): c is ical.VEvent => c.type === 'VEVENT');
		const pour = events.find((e) => /: Pour /.test(e.summary))!;
		expect(pour.datetype).toBe('date');
		expect(`${pour.start.getFullYear()}-${String(pour.start.getMonth() + 1).padStart(2, '0')}-${String(pour.start.getDate()).padStart(2, '0')}`).toBe(pourDate);
		for (const title of ['Strip the forms', 'Walk on it', 'Set furniture on it']) expect(events.some((e) => e.summary === `Curing patio: ${title}`)).toBe(true);

		// The first reminder day comes: its job runs in the app's worker and the mail reaches the fake mailbox.
		await sql`UPDATE graphile_worker._private_jobs SET run_at = now() WHERE key = ${`curing:${id}:${days[0].date}`}`;
		let text = '';
		await expect(async () => {
			const [m] = await sql`SELECT text FROM dev_mail WHERE "to" = ${email} AND text LIKE '%Curing reminder for Curing patio%'`;
			text = m?.text ?? '';
			expect(text).toContain('/reminders/stop?token=');
		}).toPass({ timeout: 60_000 });
		expect(text).toContain(days[0].items[0].title);
		const stopUrl = /(http\S+\/reminders\/stop\?token=\S+)/.exec(text)![1];

		// A stranger's browser (not signed in): one click stops them.
		const other = await browser.newContext();
		const stranger = await other.newPage();
		const strangerErrors = watchErrors(stranger);
		await stranger.goto(stopUrl);
		await expect(stranger.getByRole('heading', { name: 'Stop curing reminders' })).toBeVisible();
		await expect(stranger.getByText('“Curing patio”')).toBeVisible();
		await stranger.getByRole('button', { name: 'Stop these reminders' }).click();
		await expect(stranger.getByRole('heading', { name: 'Curing reminders stopped' })).toBeVisible();
		expect((await new AxeBuilder({ page: stranger }).analyze()).violations).toEqual([]);
		// An altered link is refused.
		await stranger.goto(stopUrl.replace(/.(?=$)/, (c) => (c === 'A' ? 'B' : 'A')));
		await expect(stranger.getByRole('heading', { name: 'This link does not work' })).toBeVisible();
		await other.close();

		await page.reload();
		await expect(section.getByLabel('E-mail me curing reminders')).not.toBeChecked();
		await expect(status).toContainText('Off.');
		expect(await sql`SELECT 1 FROM graphile_worker.jobs WHERE key LIKE ${`curing:${id}:%`}`).toHaveLength(0);

		// The crew starts the first pour two days late: the calendar file follows the logged day, as the
		// reminders do, and both the page and each entry say which day the dates count from.
		const ymd = (d: Date) => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
		const longDay = (iso: string) =>
			new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' }).format(
				new Date(`${iso}T00:00:00Z`)
			);
		const shortDay = (iso: string) => new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(`${iso}T00:00:00Z`));
		const late = new Date(Date.parse(`${pourDate}T12:00:00Z`) + 2 * 86_400_000).toISOString().slice(0, 10);
		await expect(section.getByTestId('ics-dates')).toContainText(`dated from the planned first pour, ${shortDay(pourDate)}.`);
		expect(pour.description).toContain(`Dates counted from the planned first pour, ${longDay(pourDate)}.`);
		const at = Date.parse(`${late}T12:00:00Z`);
		const logged = await page.request.post(`/plans/${id}/pour/records`, {
			data: {
				records: [
					{ kind: 'start', key: `late-start-${id}`, at, tz: 0, pour: 0 },
					{ kind: 'batch', key: `late-batch-${id}`, at: at + 60_000, tz: 0, pour: 0 }
				]
			}
		});
		expect(logged.status()).toBe(200);
		await page.reload();
		await expect(status).toContainText(`after the pour on ${shortDay(late)} (the day logged on the pour page)`);
		await expect(section.getByTestId('ics-dates')).toContainText(`dated from the first pour as logged on the pour page, ${shortDay(late)}.`);
		const [again] = await Promise.all([page.waitForEvent('download'), section.getByRole('link', { name: 'Add to calendar' }).click()]);
		const moved = Object.values(ical.sync.parseICS(await fs.readFile((await again.path())!, 'utf8'))).filter((c): c is ical.VEvent => c.type === 'VEVENT');
		const movedPour = moved.find((e) => e.uid === pour.uid)!;
		expect(ymd(movedPour.start)).toBe(late);
		expect(movedPour.description).toContain(
			`Dates counted from the first pour as logged on the pour page, ${longDay(late)} (planned for ${longDay(pourDate)}).`
		);
		// Every milestone moves with it, onto the days the reminders now count (two days on).
		const lateDays = curingReminders(input, late);
		for (const title of ['Strip the forms', 'Walk on it', 'Set furniture on it']) {
			const before = events.find((e) => e.summary === `Curing patio: ${title}`)!;
			const after = moved.find((e) => e.uid === before.uid)!;
			expect(Date.parse(ymd(after.start)) - Date.parse(ymd(before.start))).toBe(2 * 86_400_000);
			expect(lateDays.some((d) => d.date === ymd(after.start) && d.items.some((i) => i.title === title))).toBe(true);
		}
		expect([...errors, ...strangerErrors]).toEqual([]);
	} finally {
		await sql.end();
	}
});

test('a mail program stops the reminders with one click (RFC 8058); other cross-site form posts are still refused', async ({ page, playwright }) => {
	test.setTimeout(180_000);
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	try {
		const email = uniqueEmail('one-click');
		await signUp(page, { name: 'Oda Klinck', email, password: 'keep-it-moist-2' });
		const errors = watchErrors(page);
		const { id } = await insertPlan(email, { name: 'One-click pad', postcode: '97321' });
		const input = demoPlans.plans[0].input as { conditions: { pourDate: string } };
		const days = curingReminders(input, input.conditions.pourDate);

		// By keyboard: the switch is a 44 px row, and Space turns it on and off again. Pressed before
		// hydration, Space only ticks the box and nothing is sent (seen with two browsers at a time).
		await openHydrated(page, `/plans/${id}`);
		const section = page.getByRole('region', { name: 'Curing days' });
		const box = section.getByLabel('E-mail me curing reminders');
		expect((await section.locator('label').filter({ hasText: 'E-mail me curing reminders' }).boundingBox())!.height).toBeGreaterThanOrEqual(44);
		await box.focus();
		await page.keyboard.press('Space');
		await expect(section.getByText('Curing reminders are on.')).toBeVisible();
		await expect(box).toBeFocused();
		await page.keyboard.press('Space');
		await expect(section.getByText('Curing reminders are off; none will be sent.')).toBeVisible();
		await page.keyboard.press('Space');
		await expect(section.getByText('Curing reminders are on.')).toBeVisible();

		await sql`UPDATE graphile_worker._private_jobs SET run_at = now() WHERE key = ${`curing:${id}:${days[0].date}`}`;
		let headers: Record<string, string> = {};
		await expect(async () => {
			const [m] = await sql<
				{ headers: Record<string, string> | null }[]
			>`SELECT headers FROM dev_mail WHERE "to" = ${email} AND text LIKE '%Curing reminder for One-click pad%'`;
			headers = m?.headers ?? {};
			expect(headers['list-unsubscribe']).toBeTruthy();
		}).toPass({ timeout: 60_000 });
		expect(headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
		const url = /^<(https?:\/\/\S+\/reminders\/stop\?token=[\w.-]+)>$/.exec(headers['list-unsubscribe'])![1];

		// The mail program's post: no cookie, no Origin header, the body RFC 8058 prescribes.
		const mailer = await playwright.request.newContext();
		const form = { 'content-type': 'application/x-www-form-urlencoded' };
		const res = await mailer.post(url, { headers: form, data: 'List-Unsubscribe=One-Click', maxRedirects: 0 });
		expect(res.status()).toBe(200);
		// A client that accepts anything gets the action's answer, which names the plan stopped.
		expect(await res.text()).toContain('One-click pad');
		expect(await sql`SELECT 1 FROM graphile_worker.jobs WHERE key LIKE ${`curing:${id}:%`}`).toHaveLength(0);
		await page.reload();
		await expect(box).not.toBeChecked();

		// Anywhere else a form post without our origin is refused as before, with or without an Origin header.
		const signin = new URL('/signin', url).href;
		for (const origin of [undefined, 'https://elsewhere.example']) {
			const refused = await mailer.post(signin, { headers: { ...form, ...(origin ? { origin } : {}) }, data: 'email=a%40b.test&password=x', maxRedirects: 0 });
			expect(refused.status()).toBe(403);
			expect(await refused.text()).toBe('Cross-site POST form submissions are forbidden');
		}
		await mailer.dispose();
		expect(errors).toEqual([]);
	} finally {
		await sql.end();
	}
});
