// Curing reminders by e-mail: one job per reminder day (graphile-worker, run_at = the send hour in
// the homeowner's time zone), written in the same transaction as the change that moves them.
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { curingRemindersFrom, type CuringDaysAsLogged } from '$lib/plan/reminders';
import { parsePlanInput, type ParseResult } from '$lib/plan/schema';
import type { PourRecord } from '$lib/plan/pour-log';
import type { PlanResult } from '$lib/plan';
import { todayIn, validTimeZone, zonedTime } from '$lib/reader';
import { db } from '$lib/server/db';
import { appSecret, curingReminderSent, plan, user, type Plan } from '$lib/server/db/schema';
import { listPourRecords } from './pour-records';
import { queueMail } from './mail';
import { curingReminderMail } from './mail/reminder-mail';

export const CURING_REMINDER = 'curing_reminder';
/** Local hour the reminders go out: early enough to wet the slab before the day's heat. */
export const SEND_HOUR = 7;

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];
type Conn = Tx | typeof db;

const keyPrefix = (planId: string) => `curing:${planId}:`;

/** Removes the plan's reminder jobs not yet run (a running one finishes and is not retried). */
export async function cancelCuringReminders(conn: Conn, planId: string): Promise<void> {
	await conn.execute(sql`SELECT graphile_worker.remove_job(key) FROM graphile_worker.jobs WHERE key LIKE ${`${keyPrefix(planId)}%`}`);
}

/**
 * Replaces the plan's reminder jobs with those of its current pour date: one job per reminder day
 * from today on, at SEND_HOUR in the zone stored with the plan. Call in the transaction that
 * changes the plan, so the jobs move exactly when the plan does.
 */
export async function scheduleCuringReminders(
	conn: Conn,
	p: Pick<Plan, 'id' | 'input' | 'curingReminders' | 'reminderTimeZone'>,
	now = new Date()
): Promise<number> {
	await cancelCuringReminders(conn, p.id);
	if (!p.curingReminders) return 0;
	const { pourDate, days } = reminderDays(p, await listPourRecords(p.id, conn));
	if (!pourDate) return 0;
	const tz = validTimeZone(p.reminderTimeZone);
	const today = todayIn(tz, now);
	let n = 0;
	for (const d of days) {
		if (d.date < today) continue;
		await conn.execute(sql`SELECT graphile_worker.add_job(${CURING_REMINDER},
			json_build_object('planId', ${p.id}::text, 'pourDate', ${pourDate}::text, 'day', ${d.date}::text),
			run_at := ${zonedTime(d.date, SEND_HOUR, tz).toISOString()}::timestamptz, max_attempts := 5,
			job_key := ${keyPrefix(p.id) + d.date})`);
		n++;
	}
	return n;
}

/**
 * The plan's reminder days and the pour date they count from: the date the pour log records once
 * the crew has started a pour, else the planned date. Scheduling, the job and the status line all
 * read this one function, so a logged start moves the reminders, and a job queued for the planned
 * date is skipped once the log says otherwise.
 */
export function reminderDays(p: Pick<Plan, 'input'> | { parsed: ParseResult }, records: readonly PourRecord[], known?: PlanResult): CuringDaysAsLogged {
	try {
		return curingRemindersFrom('parsed' in p ? p.parsed : parsePlanInput(p.input), records, known);
	} catch {
		return { pourDate: null, days: [], logged: false, loggedLast: null };
	}
}

/** Turns the plan's reminders on or off (storing the zone to send in) and moves the jobs, in one transaction. */
export async function setCuringReminders(planId: string, ownerId: string, on: boolean, timeZone: string): Promise<Plan | undefined> {
	return db.transaction(async (tx) => {
		const [saved] = await tx
			.update(plan)
			.set({ curingReminders: on, ...(on ? { reminderTimeZone: validTimeZone(timeZone) } : {}) })
			.where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId)))
			.returning();
		if (saved) await scheduleCuringReminders(tx, saved);
		return saved;
	});
}

/**
 * The curing_reminder job. It re-reads the plan: nothing is sent when the plan is gone, reminders
 * were turned off, or the day is no longer a reminder day of the current pour date. The sent row
 * (primary key plan, pour date, day) is written with the message, so a day's mail goes once.
 */
export async function sendCuringReminder(job: { planId: string; pourDate: string; day: string }, origin: string): Promise<'sent' | 'skipped'> {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.select({ p: plan, email: user.email, name: user.name, off: user.mailOptOut })
			.from(plan)
			.innerJoin(user, eq(user.id, plan.ownerId))
			.where(eq(plan.id, job.planId));
		// The account page's switch for curing reminders wins over the plan's.
		if (!row || !row.p.curingReminders || row.off.includes('curing')) return 'skipped';
		const { pourDate, days } = reminderDays(row.p, await listPourRecords(row.p.id, tx));
		const day = pourDate === job.pourDate ? days.find((d) => d.date === job.day) : undefined;
		if (!day || !pourDate) return 'skipped';
		const [fresh] = await tx.insert(curingReminderSent).values({ planId: row.p.id, pourDate, day: day.date }).onConflictDoNothing().returning();
		if (!fresh) return 'skipped';
		const token = await unsubscribeToken(row.p.id, tx);
		await queueMail(
			row.email,
			curingReminderMail({
				name: row.name,
				planName: row.p.name,
				day,
				planUrl: `${origin}/plans/${row.p.id}`,
				stopUrl: `${origin}/reminders/stop?token=${encodeURIComponent(token)}`
			}),
			tx
		);
		return 'sent';
	});
}

/**
 * What the plan page shows of the reminders: the switch, the mail setting, the jobs waiting and sent.
 * The plan is read by its owner first: for someone else's plan nothing more is read.
 */
export async function curingReminderState(planId: string, ownerId: string) {
	const [row] = await db
		.select({ on: plan.curingReminders, timeZone: plan.reminderTimeZone, off: user.mailOptOut })
		.from(plan)
		.innerJoin(user, eq(user.id, plan.ownerId))
		.where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId)));
	if (!row) return null;
	const [jobs, [{ n }]] = await Promise.all([
		db.execute<{ key: string }>(
			sql`SELECT key FROM graphile_worker.jobs WHERE key LIKE ${`${keyPrefix(planId)}%`} AND attempts < max_attempts ORDER BY run_at`
		),
		db
			.select({ n: sql<number>`count(*)::int` })
			.from(curingReminderSent)
			.where(eq(curingReminderSent.planId, planId))
	]);
	return { ...row, scheduled: jobs.map((j) => j.key.slice(keyPrefix(planId).length)), sent: n };
}

/**
 * The reminders' status from their state and the plan's pour log. `parsed` is the plan's input as
 * the page already parsed it; `known` is the plan's stored result when the current engine wrote it,
 * so the page neither parses nor computes the plan a second time.
 */
export function curingReminderSummary(
	state: NonNullable<Awaited<ReturnType<typeof curingReminderState>>>,
	parsed: ParseResult,
	records: readonly PourRecord[],
	known?: PlanResult
) {
	const { pourDate, days, logged, loggedLast } = reminderDays({ parsed }, records, known);
	return {
		on: state.on,
		/** The account page's switch for this kind of mail is off. */
		mailOff: state.off.includes('curing'),
		timeZone: validTimeZone(state.timeZone),
		sendHour: SEND_HOUR,
		pourDate,
		/** The pour date is the one the pour log records, not the planned one. */
		logged,
		/** With several pours: the last one's logged day, which the days count from once it is logged. */
		loggedLast,
		days: days.length,
		/** Days with a reminder job waiting, soonest first. */
		scheduled: state.scheduled,
		sent: state.sent
	};
}

// Unsubscribe links: the plan id signed with a key kept in the database (made once, shared by
// every server), so a link works without signing in and cannot be made for another plan.

async function signingKey(conn: Conn): Promise<Buffer> {
	await conn
		.insert(appSecret)
		.values({ name: 'reminder-links', value: randomBytes(32).toString('base64url') })
		.onConflictDoNothing();
	const [row] = await conn.select().from(appSecret).where(eq(appSecret.name, 'reminder-links'));
	return Buffer.from(row.value, 'base64url');
}

const sign = (key: Buffer, planId: string) => createHmac('sha256', key).update(`curing-stop:${planId}`).digest('base64url');

export async function unsubscribeToken(planId: string, conn: Conn = db): Promise<string> {
	return `${planId}.${sign(await signingKey(conn), planId)}`;
}

/** The plan a stop link names, or null for a link that was not made here (or was altered). */
export async function verifyUnsubscribeToken(token: string | null | undefined): Promise<string | null> {
	const m = /^([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})\.([A-Za-z0-9_-]{43})$/.exec(token ?? '');
	if (!m) return null;
	const want = Buffer.from(sign(await signingKey(db), m[1]));
	const got = Buffer.from(m[2]);
	return want.length === got.length && timingSafeEqual(want, got) ? m[1] : null;
}

/** The stop link's page: the plan's name and whether its reminders are on. */
export async function reminderPlan(planId: string) {
	const [row] = await db.select({ id: plan.id, name: plan.name, on: plan.curingReminders }).from(plan).where(eq(plan.id, planId));
	return row ?? null;
}

/** One click from the e-mail: the plan's reminders stop and its jobs are removed, in one transaction. */
export async function stopCuringReminders(planId: string): Promise<boolean> {
	return db.transaction(async (tx) => {
		const [saved] = await tx.update(plan).set({ curingReminders: false }).where(eq(plan.id, planId)).returning({ id: plan.id });
		if (saved) await cancelCuringReminders(tx, planId);
		return !!saved;
	});
}
