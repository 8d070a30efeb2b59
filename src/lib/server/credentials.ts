import { and, asc, eq, isNotNull, lt, lte, or, sql } from 'drizzle-orm';
import { daysUntil, reminderDue, statusAfterExpiry } from '$lib/contractor-status';
import { formatDayLong } from '$lib/reader';
import type { DocumentKind } from '$lib/schemas/contractor';
import { db } from '$lib/server/db';
import { contractor, credentialReminder, user } from '$lib/server/db/schema';
import { expireLeads, tellHomeownersOfContractorChange } from './leads';
import { queueMail } from './mail';
import { credentialLapsedMail, credentialReminderMail } from './mail/pro-notices';

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** The calendar day (UTC) of `now`, as the date columns store it. */
export const isoDay = (now: Date) => now.toISOString().slice(0, 10);

/** Days ahead the admin's list looks; reminders start at 30. */
export const EXPIRING_WINDOW_DAYS = 45;

const credentialDates = (c: { licenceExpiresOn: string | null; insuranceExpiresOn: string | null }) =>
	(
		[
			['licence', c.licenceExpiresOn],
			['insurance', c.insuranceExpiresOn]
		] as [DocumentKind, string | null][]
	).filter((e): e is [DocumentKind, string] => e[1] !== null);

/** True when neither date has passed on `today` (a missing date is not an expired one). */
export const credentialsCurrent = (c: { licenceExpiresOn: string | null; insuranceExpiresOn: string | null }, today: string) =>
	credentialDates(c).every(([, d]) => d >= today);

/**
 * Approved contractors (with their user's name and e-mail) whose licence or insurance date
 * compares to `day` by `cmp` (`lt`: before it, `lte`: on or before it); one contractor when `only`.
 */
const approvedWithADate = (tx: Tx, cmp: typeof lt, day: string, only?: string) =>
	tx
		.select({ row: contractor, name: user.name, email: user.email })
		.from(contractor)
		.innerJoin(user, eq(user.id, contractor.userId))
		.where(
			and(
				eq(contractor.status, 'approved'),
				or(cmp(contractor.licenceExpiresOn, day), cmp(contractor.insuranceExpiresOn, day)),
				only ? eq(contractor.userId, only) : undefined
			)
		);

/**
 * Approved accounts with a licence or insurance date before `today` lapse (the expiry table in
 * contractor-status), in the caller's transaction, each row locked: the contractor is told, and
 * so is every homeowner with an open bid or an accepted job from them.
 */
async function lapseExpired(tx: Tx, today: string, origin: string, only?: string) {
	const rows = await approvedWithADate(tx, lt, today, only).for('update', { of: contractor, skipLocked: true });
	for (const { row, name, email } of rows) {
		const to = statusAfterExpiry(row.status);
		if (to === row.status) continue;
		const kinds = credentialDates(row)
			.filter(([, d]) => d < today)
			.map(([k]) => k);
		const reason =
			kinds.map((k) => `Your ${k} expired on ${formatDayLong(k === 'licence' ? row.licenceExpiresOn! : row.insuranceExpiresOn!)}.`).join(' ') +
			' Upload the renewed document with its new date.';
		await tx.update(contractor).set({ status: to, statusReason: reason, updatedAt: new Date() }).where(eq(contractor.userId, row.userId));
		await queueMail(email, credentialLapsedMail(name, kinds, `${origin}/pro/profile`), tx);
		await tellHomeownersOfContractorChange(tx, row.userId, row.businessName ?? name, 'lapsed', origin);
	}
	return rows.length;
}

/**
 * Sends the 30- and 7-day reminders that are due. The reminder row is inserted first and the mail
 * only written when the insert took: the primary key makes each reminder go once per expiry date,
 * even when two app servers sweep at the same moment.
 */
async function sendReminders(tx: Tx, today: string, origin: string, only?: string) {
	const horizon = isoDay(new Date(Date.parse(`${today}T00:00:00Z`) + 30 * 86_400_000));
	const rows = await approvedWithADate(tx, lte, horizon, only);
	let sent = 0;
	for (const { row, name, email } of rows) {
		for (const [kind, expiresOn] of credentialDates(row)) {
			const left = daysUntil(expiresOn, today);
			const due = reminderDue(left);
			if (!due) continue;
			const took = await tx.insert(credentialReminder).values({ contractorId: row.userId, kind, expiresOn, daysBefore: due }).onConflictDoNothing().returning();
			if (!took.length) continue;
			await queueMail(email, credentialReminderMail(name, kind, formatDayLong(expiresOn), left, `${origin}/pro/profile`), tx);
			sent++;
		}
	}
	return sent;
}

/**
 * The periodic sweep: lapses expired credentials, sends the reminders due and expires leads past
 * their respond-by date, all as of `now`. One transaction under a PostgreSQL advisory lock, so
 * when several app servers run it only one does the work; the others return null at once.
 */
export async function sweep(now = new Date(), origin = '') {
	const today = isoDay(now);
	const out = await db.transaction(async (tx) => {
		const [{ locked }] = await tx.execute<{ locked: boolean }>(sql`select pg_try_advisory_xact_lock(hashtext('stakeline:sweep')) as locked`);
		if (!locked) return null;
		return {
			lapsed: await lapseExpired(tx, today, origin),
			reminders: await sendReminders(tx, today, origin),
			leadsExpired: await expireLeads(tx, today, origin)
		};
	});
	return out;
}

/**
 * The same rules for one contractor, evaluated when their pages load, so an expiry between two
 * sweeps takes effect at once. The row lock (skip locked) keeps it from racing the sweep.
 */
export async function sweepContractor(contractorId: string, now = new Date(), origin = '') {
	const today = isoDay(now);
	const out = await db.transaction(async (tx) => ({
		lapsed: await lapseExpired(tx, today, origin, contractorId),
		reminders: await sendReminders(tx, today, origin, contractorId),
		leadsExpired: await expireLeads(tx, today, origin, { contractorId })
	}));
	return out;
}

/** For the admin: credentials that expire within the window or have expired, soonest first. */
export async function expiringCredentials(now = new Date(), windowDays = EXPIRING_WINDOW_DAYS) {
	const today = isoDay(now);
	const horizon = isoDay(new Date(Date.parse(`${today}T00:00:00Z`) + windowDays * 86_400_000));
	const rows = await db
		.select({
			id: contractor.userId,
			businessName: contractor.businessName,
			name: user.name,
			email: user.email,
			status: contractor.status,
			licenceExpiresOn: contractor.licenceExpiresOn,
			insuranceExpiresOn: contractor.insuranceExpiresOn
		})
		.from(contractor)
		.innerJoin(user, eq(user.id, contractor.userId))
		.where(and(or(lte(contractor.licenceExpiresOn, horizon), lte(contractor.insuranceExpiresOn, horizon)), isNotNull(contractor.submittedAt)));
	const reminders = rows.length ? await db.select().from(credentialReminder).orderBy(asc(credentialReminder.sentAt)) : [];
	return rows
		.flatMap((r) =>
			credentialDates(r)
				.filter(([, d]) => d <= horizon)
				.map(([kind, expiresOn]) => ({
					contractorId: r.id,
					business: r.businessName ?? r.name,
					email: r.email,
					status: r.status,
					kind,
					expiresOn,
					daysLeft: daysUntil(expiresOn, today),
					remindersSent: reminders.filter((x) => x.contractorId === r.id && x.kind === kind && x.expiresOn === expiresOn).map((x) => x.daysBefore)
				}))
		)
		.sort((a, b) => (a.expiresOn < b.expiresOn ? -1 : a.expiresOn > b.expiresOn ? 1 : a.business.localeCompare(b.business)));
}
