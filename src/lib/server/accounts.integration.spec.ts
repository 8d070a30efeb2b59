// Integration tests on the real PostgreSQL test database (npm test creates it fresh).
import nodemailer from 'nodemailer';
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { db } from './db';
import { contractor, devMail, emailToken, mailOutbox, session, user } from './db/schema';
import { createSession, generateSessionToken, invalidateUserSessions, validateSessionToken } from './auth';
import { consumeEmailToken, createEmailToken, peekEmailToken } from './email-tokens';
import { startWorker } from './jobs';
import { MAX_ATTEMPTS, mailIdle, queueMail } from './mail';
import { verifyPassword } from './password';
import { hashToken } from './tokens';
import { createUser, EmailTakenError, markEmailVerified, signUpOrNotify } from './users';
import { uniqueEmail as unique, useTestDatabase } from './integration-setup';

const DAY = 86_400_000;

useTestDatabase({ worker: true });

describe('confirm-first sign-up', () => {
	const origin = 'http://stakeline.test';
	const subjects = async (to: string) =>
		(await db.select({ subject: mailOutbox.subject }).from(mailOutbox).where(eq(mailOutbox.to, to)).orderBy(mailOutbox.createdAt)).map((m) => m.subject);
	const signUp = (email: string, name: string, role: 'homeowner' | 'contractor' = 'homeowner') =>
		signUpOrNotify({ name, email, password: `${name}-password-1`, role }, origin, '/plans/new');

	it('creates an unconfirmed account and queues its confirmation link, with where to land', async () => {
		const email = unique('new');
		await signUp(email, 'Fresh', 'contractor');
		const [u] = await db.select().from(user).where(eq(user.email, email));
		expect(u).toMatchObject({ name: 'Fresh', role: 'contractor', emailVerifiedAt: null });
		expect(await db.select().from(contractor).where(eq(contractor.userId, u.id))).toHaveLength(1);
		expect(await subjects(email)).toEqual(['Confirm your e-mail for Stakeline']);
		const [m] = await db.select().from(mailOutbox).where(eq(mailOutbox.to, email));
		expect(m.text).toMatch(/\/verify-email\?token=[\w=-]+&next=%2Fplans%2Fnew/);
	});

	it('tells the owner of a confirmed address that someone tried, and changes nothing of the account', async () => {
		const email = unique('owner');
		const owner = await createUser({ name: 'Owner', email, password: 'owner-password-1', role: 'homeowner', verified: true });
		await signUp(email.toUpperCase(), 'Intruder', 'contractor');
		const rows = await db.select().from(user).where(eq(user.email, email));
		expect(rows).toHaveLength(1);
		expect(rows[0]).toMatchObject({ id: owner.id, name: 'Owner', role: 'homeowner', passwordHash: owner.passwordHash });
		expect(await subjects(email)).toEqual(['Someone tried to create a Stakeline account with your e-mail']);
		const [m] = await db.select().from(mailOutbox).where(eq(mailOutbox.to, email));
		expect(m.text).not.toContain('Intruder');
	});

	it('sends a fresh confirmation link for an address signed up but never confirmed; the old link stops working', async () => {
		const email = unique('again');
		await signUp(email, 'First');
		const [first] = await db.select().from(mailOutbox).where(eq(mailOutbox.to, email));
		const oldToken = first.text.match(/token=([\w=-]+)/)![1];
		await signUp(email, 'Second');
		expect(await subjects(email)).toEqual(['Confirm your e-mail for Stakeline', 'Confirm your e-mail for Stakeline']);
		expect(await peekEmailToken(oldToken, 'verify_email')).toBeNull();
		const rows = await db.select().from(user).where(eq(user.email, email));
		expect(rows.map((r) => r.name)).toEqual(['First']);
		await markEmailVerified(rows[0].id);
		await signUp(email, 'Third');
		expect((await subjects(email)).at(-1)).toBe('Someone tried to create a Stakeline account with your e-mail');
	});
});

describe('users', () => {
	it('are stored with a lower-cased e-mail and an argon2id hash, never the password', async () => {
		const email = unique('Case');
		const u = await createUser({ name: '  Wren  ', email: email.toUpperCase(), password: 'stake-every-4-ft', role: 'homeowner' });
		expect(u.email).toBe(email.toLowerCase());
		expect(u.name).toBe('Wren');
		expect(u.passwordHash.startsWith('$argon2id$')).toBe(true);
		expect(await verifyPassword(u.passwordHash, 'stake-every-4-ft')).toBe(true);
		expect(u.emailVerifiedAt).toBeNull();
	});

	it('refuse a second account with the same e-mail in any case, storing nothing', async () => {
		const email = unique('dup');
		await createUser({ name: 'First', email, password: 'first-password', role: 'homeowner' });
		await expect(createUser({ name: 'Second', email: email.toUpperCase(), password: 'second-password', role: 'contractor' })).rejects.toBeInstanceOf(
			EmailTakenError
		);
		const rows = await db.select().from(user).where(eq(user.email, email));
		expect(rows.map((r) => r.name)).toEqual(['First']);
	});

	it('start contractors as not yet submitted: the first profile save puts them in the review queue', async () => {
		const u = await createUser({ name: 'Formwright', email: unique('pro'), password: 'contractor-pass', role: 'contractor' });
		const [c] = await db.select().from(contractor).where(eq(contractor.userId, u.id));
		expect(c.status).toBe('draft');
	});
});

describe('sessions', () => {
	async function newSession() {
		const u = await createUser({ name: 'Sess', email: unique('s'), password: 'session-pass-1', role: 'homeowner' });
		const token = generateSessionToken();
		const s = await createSession(token, u.id);
		return { u, token, s };
	}

	it('store only the SHA-256 of the token and validate it', async () => {
		const { u, token, s } = await newSession();
		expect(s.id).toBe(hashToken(token));
		expect(await db.select().from(session).where(eq(session.id, token))).toHaveLength(0);
		const r = await validateSessionToken(token);
		expect(r.user?.id).toBe(u.id);
		expect(r.user).not.toHaveProperty('passwordHash');
		expect(Math.abs(r.session!.expiresAt.getTime() - (Date.now() + 30 * DAY))).toBeLessThan(60_000);
	});

	it('expire: an expired session is refused and deleted', async () => {
		const { token, s } = await newSession();
		await db
			.update(session)
			.set({ expiresAt: new Date(Date.now() - 1000) })
			.where(eq(session.id, s.id));
		expect(await validateSessionToken(token)).toEqual({ session: null, user: null });
		expect(await db.select().from(session).where(eq(session.id, s.id))).toHaveLength(0);
	});

	it('renew when under 15 days are left', async () => {
		const { token, s } = await newSession();
		await db
			.update(session)
			.set({ expiresAt: new Date(Date.now() + 10 * DAY) })
			.where(eq(session.id, s.id));
		await validateSessionToken(token);
		const [row] = await db.select().from(session).where(eq(session.id, s.id));
		expect(row.expiresAt.getTime()).toBeGreaterThan(Date.now() + 29 * DAY);
	});

	it('refuse an unknown token and end with invalidateUserSessions', async () => {
		expect((await validateSessionToken(generateSessionToken())).user).toBeNull();
		const { u, token } = await newSession();
		await invalidateUserSessions(u.id);
		expect((await validateSessionToken(token)).user).toBeNull();
	});
});

describe('one-time e-mail tokens', () => {
	it('work once, and a newer token replaces an older one', async () => {
		const u = await createUser({ name: 'Tok', email: unique('t'), password: 'token-pass-12', role: 'homeowner' });
		const older = await createEmailToken(u.id, 'reset_password');
		const newer = await createEmailToken(u.id, 'reset_password');
		expect(await peekEmailToken(older, 'reset_password')).toBeNull();
		expect(await consumeEmailToken(newer, 'verify_email')).toBeNull(); // wrong purpose
		expect(await peekEmailToken(newer, 'reset_password')).toBe(u.id);
		expect(await consumeEmailToken(newer, 'reset_password')).toBe(u.id);
		expect(await consumeEmailToken(newer, 'reset_password')).toBeNull();
	});

	it('stop working when expired', async () => {
		const u = await createUser({ name: 'Old', email: unique('o'), password: 'token-pass-34', role: 'homeowner' });
		const t = await createEmailToken(u.id, 'verify_email');
		await db
			.update(emailToken)
			.set({ expiresAt: new Date(Date.now() - 1) })
			.where(eq(emailToken.id, hashToken(t)));
		expect(await consumeEmailToken(t, 'verify_email')).toBeNull();
	});
});

describe('mail outbox', () => {
	it('delivers over SMTP to the local fake, which stores the message', { timeout: 90_000 }, async () => {
		const to = unique('mail');
		const id = await queueMail(to, { subject: 'Pour day is Saturday', text: 'Bring gloves.', html: '<p>Bring gloves.</p>' });
		// The worker sends in queue order: in the full run, mail that earlier spec files queued without a
		// worker of their own goes first, so this one may wait behind a hundred others.
		const queue = { timeout: 60_000 };
		await expect.poll(async () => (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id!)))[0].status, queue).toBe('sent');
		await expect.poll(async () => (await db.select().from(devMail).where(eq(devMail.to, to))).map((m) => m.subject), queue).toEqual(['Pour day is Saturday']);
	});

	it('keeps a message that cannot be sent and schedules a retry', async () => {
		// A second worker whose SMTP server is down takes the next message: the main worker stops first.
		await mailIdle();
		const down = nodemailer.createTransport({ host: '127.0.0.1', port: 9, connectionTimeout: 2000 }); // discard port, nothing listens
		const failing = await startWorker({ origin: 'http://stakeline.test', transport: down, cron: false });
		const to = unique('down');
		const id = (await queueMail(to, { subject: 'Later', text: 't', html: 'h' }))!;
		await expect.poll(async () => (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id)))[0].lastError).toBeTruthy();
		await failing.stop();
		const [after] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, id));
		expect(after.status).toBe('pending');
		expect(after.attempts).toBe(1);
		expect(after.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
		// The queue holds the job for its retry, at the time the outbox row says.
		const [job] = await db.execute<{ attempts: number; max_attempts: number; run_at: string; last_error: string }>(
			sql`SELECT attempts, max_attempts, run_at, last_error FROM graphile_worker.jobs WHERE key = ${`mail:${id}`}`
		);
		expect(job).toMatchObject({ attempts: 1, max_attempts: MAX_ATTEMPTS });
		expect(job.last_error).toBeTruthy();
		expect(Math.abs(new Date(job.run_at).getTime() - after.nextAttemptAt.getTime())).toBeLessThan(3000);
		// Once SMTP answers again, the retry goes through and the job is done.
		await db.execute(sql`UPDATE graphile_worker._private_jobs SET run_at = now() WHERE key = ${`mail:${id}`}`);
		await startWorker({ origin: 'http://stakeline.test', cron: false });
		await expect.poll(async () => (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id)))[0].status).toBe('sent');
		await expect.poll(async () => (await db.select().from(devMail).where(eq(devMail.to, to))).length).toBe(1);
		await expect.poll(async () => (await db.execute(sql`SELECT 1 FROM graphile_worker.jobs WHERE key = ${`mail:${id}`}`)).length).toBe(0);
		const [sent] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, id));
		expect(sent).toMatchObject({ attempts: 2, lastError: null });
	});

	it('adds the message and its job with the change it reports: a rolled-back change leaves neither', async () => {
		const to = unique('rolled');
		await expect(
			db.transaction(async (tx) => {
				await queueMail(to, { subject: 'Never', text: 't', html: 'h' }, tx);
				throw new Error('the change failed');
			})
		).rejects.toThrow('the change failed');
		expect(await db.select().from(mailOutbox).where(eq(mailOutbox.to, to))).toEqual([]);
		const jobs = await db.execute(sql`SELECT 1 FROM graphile_worker.jobs j JOIN mail_outbox m ON j.key = 'mail:' || m.id WHERE m.to = ${to}`);
		expect(jobs.length).toBe(0);
	});
});
