import nodemailer, { type Transporter } from 'nodemailer';
import { and, eq, sql } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { db } from '$lib/server/db';
import { mailOutbox, user } from '$lib/server/db/schema';
import type { MailKind } from '$lib/mail-kinds';
import type { Mail } from './templates';
import { stopLocalWorkers } from '../jobs/running';

/**
 * Tries per message before it is marked failed. The job queue (graphile-worker) waits
 * e^min(attempt, 10) seconds after each failure, so twelve tries span about 16 hours of SMTP outage.
 */
export const MAX_ATTEMPTS = 12;

/** The queue's wait after the `attempts`-th failure, in seconds (graphile-worker's own back-off). */
export function retryDelaySeconds(attempts: number): number {
	return Math.exp(Math.min(Math.max(attempts, 1), 10));
}

/** The job that sends one outbox row; its job key is the row's, so it exists once. */
export const SEND_MAIL = 'send_mail';

let transport: Transporter | undefined;
function getTransport(): Transporter {
	if (!env.SMTP_URL) throw new Error('SMTP_URL is not set');
	transport ??= nodemailer.createTransport(env.SMTP_URL);
	return transport;
}

/**
 * Stops the job workers this process started, once the mail they are sending has gone (tests call
 * it before closing the pool; an app server stops its worker on shutdown).
 */
export const mailIdle = () => stopLocalWorkers();

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Writes the message to the outbox and adds the job that sends it, in one transaction: given `tx`,
 * in the caller's, so the message exists exactly when the change it reports does. The job runs as
 * soon as that transaction commits (the queue is told by NOTIFY), in whichever app server takes it;
 * the action that sends mail never fails because SMTP does.
 */
export async function queueMail(to: string, mail: Mail, tx?: Tx): Promise<string | null> {
	const write = async (t: Tx) => {
		const { kind, subject, text, html, headers } = mail;
		if (kind && (await optedOut(to, kind, t))) return null;
		const [row] = await t
			.insert(mailOutbox)
			.values({ to, subject, text, html, headers: headers ?? null })
			.returning({ id: mailOutbox.id });
		await t.execute(sql`SELECT graphile_worker.add_job(${SEND_MAIL}, json_build_object('id', ${row.id}::text),
			max_attempts := ${MAX_ATTEMPTS}, job_key := ${`mail:${row.id}`})`);
		return row.id;
	};
	return tx ? write(tx) : db.transaction(write);
}

/** Whether the account at `to` turned this kind of mail off on its account page. */
async function optedOut(to: string, kind: MailKind, tx: Tx): Promise<boolean> {
	const [row] = await tx.select({ off: user.mailOptOut }).from(user).where(eq(user.email, to.trim().toLowerCase()));
	return !!row?.off.includes(kind);
}

/**
 * The send_mail job: sends one outbox row. Only a row still pending is sent, so a job that runs
 * again after its message went out sends nothing. A failure is written on the row (with when the
 * queue tries next) and thrown, so the queue retries it; after the last try the row is failed.
 */
export async function sendOutboxMail(id: string, attempt: number, maxAttempts = MAX_ATTEMPTS, via?: Transporter): Promise<'sent' | 'gone'> {
	const [mail] = await db
		.update(mailOutbox)
		.set({ attempts: attempt })
		.where(and(eq(mailOutbox.id, id), eq(mailOutbox.status, 'pending')))
		.returning();
	if (!mail) return 'gone';
	try {
		await (via ?? getTransport()).sendMail({
			from: env.MAIL_FROM || 'Stakeline <no-reply@localhost>',
			to: mail.to,
			subject: mail.subject,
			text: mail.text,
			html: mail.html,
			headers: mail.headers ?? undefined
		});
	} catch (err) {
		const giveUp = attempt >= maxAttempts;
		await db
			.update(mailOutbox)
			.set({
				status: giveUp ? 'failed' : 'pending',
				lastError: String((err as Error).message ?? err).slice(0, 500),
				nextAttemptAt: new Date(Date.now() + retryDelaySeconds(attempt) * 1000)
			})
			.where(eq(mailOutbox.id, id));
		throw err;
	}
	await db.update(mailOutbox).set({ status: 'sent', sentAt: new Date(), lastError: null }).where(eq(mailOutbox.id, id));
	return 'sent';
}
