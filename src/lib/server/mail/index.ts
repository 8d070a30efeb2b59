import nodemailer, { type Transporter } from 'nodemailer';
import { eq, sql } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { db } from '$lib/server/db';
import { mailOutbox, user, type OutboxMail } from '$lib/server/db/schema';
import type { MailKind } from '$lib/mail-kinds';
import type { Mail } from './templates';
import { log } from '../log';

export const MAX_ATTEMPTS = 8;

let transport: Transporter | undefined;
function getTransport(): Transporter {
	if (!env.SMTP_URL) throw new Error('SMTP_URL is not set');
	transport ??= nodemailer.createTransport(env.SMTP_URL);
	return transport;
}

/** Minutes to wait before the next try after `attempts` failures: 1, 2, 4 … capped at an hour. */
export function retryDelayMinutes(attempts: number): number {
	return Math.min(60, 2 ** Math.max(0, attempts - 1));
}

const inFlight = new Set<Promise<unknown>>();
/** Resolves once background sends started by queueMail have finished (tests close the pool after). */
export const mailIdle = () => Promise.allSettled([...inFlight]);

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Writes the message to the outbox and tries to send it at once. The action that sends mail
 * never fails because SMTP does: what cannot go now is retried by the worker. Given `tx`, the
 * message is written in that transaction (it exists exactly when the change it reports does);
 * the caller then calls deliverSoon() after the commit.
 */
export async function queueMail(to: string, mail: Mail, tx?: Tx): Promise<string | null> {
	const { kind, subject, text, html } = mail;
	if (kind && (await optedOut(to, kind, tx))) return null;
	const [row] = await (tx ?? db).insert(mailOutbox).values({ to, subject, text, html }).returning({ id: mailOutbox.id });
	if (!tx) deliverSoon();
	return row.id;
}

/** Whether the account at `to` turned this kind of mail off on its account page. */
async function optedOut(to: string, kind: MailKind, tx?: Tx): Promise<boolean> {
	const [row] = await (tx ?? db)
		.select({ off: user.mailOptOut })
		.from(user)
		.where(eq(user.email, to.trim().toLowerCase()));
	return !!row?.off.includes(kind);
}

/** Starts sending what is due in the background: the request does not wait on the SMTP server. */
export function deliverSoon() {
	const sending = deliverDue().catch((err) => log.warn({ err }, 'mail delivery failed'));
	inFlight.add(sending);
	void sending.finally(() => inFlight.delete(sending));
}

/**
 * Sends what is due. Rows are claimed with SKIP LOCKED and pushed forward before sending, so
 * several app servers can run this at once without sending a message twice.
 */
export async function deliverDue(limit = 20, transport?: Transporter): Promise<number> {
	const claimed = await db.execute<{ id: string }>(sql`
		UPDATE mail_outbox SET attempts = attempts + 1, next_attempt_at = now() + interval '5 minutes'
		WHERE id IN (
			SELECT id FROM mail_outbox WHERE status = 'pending' AND next_attempt_at <= now()
			ORDER BY created_at LIMIT ${limit} FOR UPDATE SKIP LOCKED)
		RETURNING id`);
	let sent = 0;
	for (const { id } of claimed) {
		const [mail] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, id));
		if (await send(mail, transport)) sent++;
	}
	return sent;
}

async function send(mail: OutboxMail, transport?: Transporter): Promise<boolean> {
	try {
		await (transport ?? getTransport()).sendMail({
			from: env.MAIL_FROM || 'Stakeline <no-reply@localhost>',
			to: mail.to,
			subject: mail.subject,
			text: mail.text,
			html: mail.html
		});
		await db.update(mailOutbox).set({ status: 'sent', sentAt: new Date(), lastError: null }).where(eq(mailOutbox.id, mail.id));
		return true;
	} catch (err) {
		const giveUp = mail.attempts >= MAX_ATTEMPTS;
		await db
			.update(mailOutbox)
			.set({
				status: giveUp ? 'failed' : 'pending',
				lastError: String((err as Error).message ?? err).slice(0, 500),
				nextAttemptAt: new Date(Date.now() + retryDelayMinutes(mail.attempts) * 60_000)
			})
			.where(eq(mailOutbox.id, mail.id));
		return false;
	}
}

/** Retries on a timer in every app server; the claim above keeps them from colliding. */
export function startMailWorker(everyMs = 15_000) {
	const timer = setInterval(() => deliverDue().catch((err) => log.warn({ err }, 'mail worker failed')), everyMs);
	timer.unref();
	return () => clearInterval(timer);
}
