// Curing reminders end to end on the real PostgreSQL, the job queue and the fake SMTP server.
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { curingReminders } from '$lib/plan/reminders';
import { addDays } from '$lib/plan/schedule';
import { todayIn, zonedTime } from '$lib/reader';
import { db } from './db';
import { curingReminderSent, devMail, mailOutbox, plan, user } from './db/schema';
import { parsePlanInput } from '$lib/plan/schema';
import { startWorker } from './jobs';
import { mailIdle } from './mail';
import { createPlan, deletePlan, updatePlan } from './plans';
import {
	curingReminderState,
	curingReminderSummary,
	sendCuringReminder,
	setCuringReminders,
	stopCuringReminders,
	unsubscribeToken,
	verifyUnsubscribeToken
} from './reminders';
import { createUser } from './users';
import { listPourRecords, savePourRecords } from './pour-records';
import type { PourRecord } from '$lib/plan/pour-log';
import { useTestDatabase } from './integration-setup';
import { smallPatio } from '$lib/plan/test-plans';

useTestDatabase();

const TZ = 'America/Denver';
const origin = 'http://stakeline.test';
const owner = () =>
	createUser({
		name: 'Curing Owner',
		email: `curing-${crypto.randomUUID()}@it.stakeline.test`,
		password: 'curing-password',
		role: 'homeowner',
		verified: true
	});
const input = (pourDate: string) => ({ ...smallPatio(), conditions: { airTemp: 60, pourDate } });
/** The plan's reminder jobs waiting in the queue: day → run_at. */
const jobsOf = async (planId: string) =>
	Object.fromEntries(
		(
			await db.execute<{ key: string; run_at: Date }>(
				sql`SELECT key, run_at FROM graphile_worker.jobs WHERE key LIKE ${`curing:${planId}:%`} AND attempts < max_attempts ORDER BY run_at`
			)
		).map((j) => [j.key.split(':').at(-1)!, new Date(j.run_at).toISOString()])
	);
/** The status line as the plan page reads it: the state by owner, then the summary from the parsed input and the log. */
async function curingReminderStatus(planId: string, ownerId: string) {
	const state = await curingReminderState(planId, ownerId);
	if (!state) return null;
	const [found] = await db.select({ input: plan.input }).from(plan).where(eq(plan.id, planId));
	return curingReminderSummary(state, parsePlanInput(found.input), await listPourRecords(planId));
}
const expected = (pourDate: string) =>
	Object.fromEntries(curingReminders(input(pourDate), pourDate).map((d) => [d.date, zonedTime(d.date, 7, TZ).toISOString()]));

describe('curing reminders', () => {
	const soon = addDays(todayIn(TZ), 10);

	it('are scheduled for the pour date at 07:00 in the homeowner’s zone, and move when the date changes', async () => {
		const u = await owner();
		const p = await createPlan(u.id, { name: 'Side walk', input: input(soon) });
		expect(await jobsOf(p.id)).toEqual({});
		await setCuringReminders(p.id, u.id, true, TZ);
		const first = expected(soon);
		expect(Object.keys(first).length).toBeGreaterThan(5);
		expect(await jobsOf(p.id)).toEqual(first);
		// 07:00 in Denver is 13:00 or 14:00 UTC, by the season.
		for (const at of Object.values(first)) expect([13, 14]).toContain(new Date(at).getUTCHours());

		const later = addDays(soon, 3);
		const saved = await updatePlan(p.id, u.id, { revision: p.revision, input: input(later) });
		const moved = expected(later);
		expect(await jobsOf(p.id)).toEqual(moved);
		expect(Object.keys(moved)[0]).toBe(addDays(Object.keys(first)[0], 3));
		const status = await curingReminderStatus(p.id, u.id);
		expect(status).toMatchObject({ on: true, pourDate: later, scheduled: Object.keys(moved), sent: 0, timeZone: TZ });
		// Someone else's plan: no state (read by owner before anything else).
		expect(await curingReminderState(p.id, (await owner()).id)).toBeNull();

		// A name-only save leaves them; turning off removes them all.
		await updatePlan(p.id, u.id, { revision: saved!.revision, name: 'Side walk, renamed' });
		expect(await jobsOf(p.id)).toEqual(moved);
		await setCuringReminders(p.id, u.id, false, TZ);
		expect(await jobsOf(p.id)).toEqual({});
	});

	it('are each sent through SMTP exactly once with two workers running', async () => {
		const u = await owner();
		const p = await createPlan(u.id, { name: 'Back pad', input: input(soon) });
		await setCuringReminders(p.id, u.id, true, TZ);
		const days = curingReminders(input(soon), soon);
		// Time passes: every reminder day comes due at once, for two workers to race over.
		await db.execute(sql`UPDATE graphile_worker._private_jobs SET run_at = now() WHERE key LIKE ${`curing:${p.id}:%`}`);
		await Promise.all([startWorker({ origin, cron: false }), startWorker({ origin, cron: false })]);
		const received = async () => (await db.select().from(devMail).where(eq(devMail.to, u.email))).map((m) => m.text);
		await expect.poll(async () => (await received()).length, { timeout: 30_000 }).toBe(days.length);
		await expect.poll(async () => Object.keys(await jobsOf(p.id)).length).toBe(0);
		await expect
			.poll(
				async () => (await db.execute(sql`SELECT 1 FROM graphile_worker.jobs j JOIN mail_outbox m ON j.key = 'mail:' || m.id WHERE m.to = ${u.email}`)).length
			)
			.toBe(0);
		const texts = await received();
		expect(texts).toHaveLength(days.length);
		for (const d of days)
			expect(
				texts.filter((t) => t.includes(`day ${d.day} after the first pour`)),
				d.date
			).toHaveLength(1);
		expect(await db.select().from(mailOutbox).where(eq(mailOutbox.to, u.email))).toHaveLength(days.length);
		expect(await db.select().from(curingReminderSent).where(eq(curingReminderSent.planId, p.id))).toHaveLength(days.length);
		// Each carries its stop link; running a day's job again sends nothing more.
		expect(texts[0]).toMatch(new RegExp(`${origin}/reminders/stop\\?token=${p.id}\\.[\\w-]{43}`));
		// … and the headers that let the mail program stop them with one click (RFC 2369, RFC 8058), as received over SMTP.
		for (const m of await db.select().from(devMail).where(eq(devMail.to, u.email))) {
			expect(m.headers?.['list-unsubscribe']).toMatch(new RegExp(`^<${origin}/reminders/stop\\?token=${p.id}\\.[\\w-]{43}>$`));
			expect(m.headers?.['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
		}
		expect(await sendCuringReminder({ planId: p.id, pourDate: soon, day: days[0].date }, origin)).toBe('skipped');
		await mailIdle();
	});

	it('stop from the e-mail’s signed link without signing in; an altered link is refused', async () => {
		const u = await owner();
		const p = await createPlan(u.id, { name: 'Shed base', input: input(soon) });
		await setCuringReminders(p.id, u.id, true, TZ);
		const token = await unsubscribeToken(p.id);
		expect(await verifyUnsubscribeToken(token)).toBe(p.id);
		const other = await createPlan(u.id, { name: 'Other', input: input(soon) });
		expect(await verifyUnsubscribeToken(`${other.id}${token.slice(36)}`)).toBeNull();
		expect(await verifyUnsubscribeToken(`${token.slice(0, -2)}AA`)).toBeNull();
		expect(await verifyUnsubscribeToken('')).toBeNull();
		expect(await stopCuringReminders(p.id)).toBe(true);
		expect(await jobsOf(p.id)).toEqual({});
		expect((await curingReminderStatus(p.id, u.id))?.on).toBe(false);
	});

	it('are cancelled with the plan, and not sent when the account turned curing reminders off', async () => {
		const u = await owner();
		const p = await createPlan(u.id, { name: 'Gone', input: input(soon) });
		await setCuringReminders(p.id, u.id, true, TZ);
		expect(Object.keys(await jobsOf(p.id)).length).toBeGreaterThan(0);
		await deletePlan(p.id, u.id);
		expect(await jobsOf(p.id)).toEqual({});

		const quiet = await owner();
		await db
			.update(user)
			.set({ mailOptOut: ['curing'] })
			.where(eq(user.id, quiet.id));
		const q = await createPlan(quiet.id, { name: 'Quiet', input: input(soon) });
		await setCuringReminders(q.id, quiet.id, true, TZ);
		expect((await curingReminderStatus(q.id, quiet.id))?.mailOff).toBe(true);
		const [day] = curingReminders(input(soon), soon);
		expect(await sendCuringReminder({ planId: q.id, pourDate: soon, day: day.date }, origin)).toBe('skipped');
		expect(await db.select().from(mailOutbox).where(eq(mailOutbox.to, quiet.email))).toEqual([]);
	});

	it('move to the pour day the pour log records, and skip a job left from the planned day', async () => {
		const u = await owner();
		const p = await createPlan(u.id, { name: 'Logged late', input: input(soon) });
		await setCuringReminders(p.id, u.id, true, TZ);
		expect(await jobsOf(p.id)).toEqual(expected(soon));
		// A note and a temperature do not date the pour; the start tapped two days late does.
		const rec = (r: Record<string, unknown>, date: string, key: string) => ({ key, at: Date.parse(`${date}T18:00:00Z`), tz: 0, ...r }) as PourRecord;
		await savePourRecords(p.id, [rec({ kind: 'note', text: 'Rain, pour put off' }, soon, 'note-0001')]);
		expect(await jobsOf(p.id)).toEqual(expected(soon));
		const logged = addDays(soon, 2);
		await savePourRecords(p.id, [rec({ kind: 'start', pour: 0 }, logged, 'start-0001'), rec({ kind: 'batch', pour: 0 }, logged, 'batch-0001')]);
		expect(await jobsOf(p.id)).toEqual(expected(logged));
		expect(await curingReminderStatus(p.id, u.id)).toMatchObject({ on: true, pourDate: logged, logged: true, scheduled: Object.keys(expected(logged)) });
		const [planned] = curingReminders(input(soon), soon);
		expect(await sendCuringReminder({ planId: p.id, pourDate: soon, day: planned.date }, origin)).toBe('skipped');
		// Turned off and on again, they are scheduled from the logged day, not the planned one.
		await setCuringReminders(p.id, u.id, false, TZ);
		await setCuringReminders(p.id, u.id, true, TZ);
		expect(await jobsOf(p.id)).toEqual(expected(logged));
	});

	it('go back to the planned day when a start tapped by mistake is taken back', async () => {
		const u = await owner();
		const p = await createPlan(u.id, { name: 'Tried the button', input: input(soon) });
		await setCuringReminders(p.id, u.id, true, TZ);
		const early = addDays(soon, -3);
		const rec = (r: Record<string, unknown>, key: string) => ({ key, at: Date.parse(`${early}T18:00:00Z`), tz: 0, ...r }) as PourRecord;
		await savePourRecords(p.id, [rec({ kind: 'start', pour: 0 }, 'start-0001')]);
		expect(await jobsOf(p.id)).toEqual(expected(early));
		await savePourRecords(p.id, [rec({ kind: 'undo', pour: 0, of: 'start-0001' }, 'undo-0001')]);
		expect(await jobsOf(p.id)).toEqual(expected(soon));
		expect(await curingReminderStatus(p.id, u.id)).toMatchObject({ on: true, pourDate: soon, logged: false });
	});

	it('skip a job left from an earlier pour date', async () => {
		const u = await owner();
		const p = await createPlan(u.id, { name: 'Moved', input: input(addDays(soon, 5)) });
		await setCuringReminders(p.id, u.id, true, TZ);
		const [old] = curingReminders(input(soon), soon);
		expect(await sendCuringReminder({ planId: p.id, pourDate: soon, day: old.date }, origin)).toBe('skipped');
	});
});
