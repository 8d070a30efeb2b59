import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor, user, type Role, type User } from '$lib/server/db/schema';
import { hashPassword } from './password';
import { createEmailToken } from './email-tokens';
import { deliverSoon, queueMail } from './mail';
import { resetPasswordMail, signInLinkMail, signUpAttemptMail, verifyEmailMail } from './mail/templates';

export class EmailTakenError extends Error {
	constructor() {
		super('An account with this e-mail already exists.');
	}
}

const UNIQUE_VIOLATION = '23505';
const isUniqueViolation = (err: unknown) =>
	[err, (err as { cause?: unknown })?.cause].some((e) => (e as { code?: string })?.code === UNIQUE_VIOLATION);

export const normalizeEmail = (email: string) => email.trim().toLowerCase();

/** Creates the account (and, for a contractor, its business record awaiting review) in one transaction. */
export async function createUser(input: { name: string; email: string; password: string; role: Role; verified?: boolean }): Promise<User> {
	const passwordHash = await hashPassword(input.password);
	try {
		return await db.transaction(async (tx) => {
			const [created] = await tx
				.insert(user)
				.values({
					name: input.name.trim(),
					email: normalizeEmail(input.email),
					role: input.role,
					passwordHash,
					emailVerifiedAt: input.verified ? new Date() : null
				})
				.returning();
			if (created.role === 'contractor') await tx.insert(contractor).values({ userId: created.id });
			return created;
		});
	} catch (err) {
		if (isUniqueViolation(err)) throw new EmailTakenError();
		throw err;
	}
}

export async function findUserByEmail(email: string): Promise<User | undefined> {
	const [found] = await db.select().from(user).where(eq(user.email, normalizeEmail(email)));
	return found;
}

export async function findUserById(id: string): Promise<User | undefined> {
	const [found] = await db.select().from(user).where(eq(user.id, id));
	return found;
}

export async function setPassword(userId: string, password: string) {
	await db.update(user).set({ passwordHash: await hashPassword(password) }).where(eq(user.id, userId));
}

export async function markEmailVerified(userId: string) {
	await db.update(user).set({ emailVerifiedAt: new Date() }).where(eq(user.id, userId));
}

type MailUser = Pick<User, 'id' | 'name' | 'email' | 'emailVerifiedAt'>;
/** The name the sign-up form chose is used only once the address is confirmed as its owner's. */
const greeting = (u: MailUser) => (u.emailVerifiedAt ? u.name : '');

const verifyLink = (origin: string, token: string, next: string) => `${origin}/verify-email?token=${token}${next ? `&next=${encodeURIComponent(next)}` : ''}`;

/** `next`: where a new account lands once the link is followed (kept from the sign-up form). */
export async function sendVerificationMail(u: MailUser, origin: string, next = '') {
	const token = await createEmailToken(u.id, 'verify_email');
	await queueMail(u.email, verifyEmailMail('', verifyLink(origin, token, next)));
}

/**
 * Confirm-first sign-up, the same work whether or not the address is taken: the password is hashed,
 * then one transaction tries the insert and queues one mail, and commits. A new address gets its
 * account (unusable until confirmed) and a confirmation link; a confirmed taken one a note to its
 * owner that someone tried; one never confirmed a fresh link (the first may be lost). Mail goes out
 * after the commit, in the background.
 */
export async function signUpOrNotify(input: { name: string; email: string; password: string; role: Role }, origin: string, next: string) {
	const passwordHash = await hashPassword(input.password);
	const email = normalizeEmail(input.email);
	await db.transaction(async (tx) => {
		const [created] = await tx
			.insert(user)
			.values({ name: input.name.trim(), email, role: input.role, passwordHash, emailVerifiedAt: null })
			.onConflictDoNothing({ target: user.email })
			.returning();
		if (created?.role === 'contractor') await tx.insert(contractor).values({ userId: created.id });
		const owner = created ?? (await tx.select().from(user).where(eq(user.email, email)))[0];
		if (!owner) return; // deleted in between: nothing to say to anyone
		if (!owner.emailVerifiedAt) {
			const token = await createEmailToken(owner.id, 'verify_email', tx);
			await queueMail(owner.email, verifyEmailMail('', verifyLink(origin, token, next)), tx);
		} else await queueMail(owner.email, signUpAttemptMail(greeting(owner), `${origin}/signin`), tx);
	});
	deliverSoon();
}

export async function sendPasswordResetMail(u: MailUser, origin: string) {
	const token = await createEmailToken(u.id, 'reset_password');
	await queueMail(u.email, resetPasswordMail(greeting(u), `${origin}/reset-password?token=${token}`));
}

export async function sendSignInLinkMail(u: MailUser, origin: string) {
	const token = await createEmailToken(u.id, 'sign_in');
	await queueMail(u.email, signInLinkMail(greeting(u), `${origin}/signin/link?token=${token}`));
}

/** The first admin, from ADMIN_EMAIL / ADMIN_PASSWORD; nothing happens when it exists already. */
export async function ensureAdmin(email: string | undefined, password: string | undefined) {
	if (!email || !password) return;
	if (await findUserByEmail(email)) return;
	try {
		await createUser({ name: 'Administrator', email, password, role: 'admin', verified: true });
		console.log(`Created the first admin account ${normalizeEmail(email)}`);
	} catch (err) {
		if (!(err instanceof EmailTakenError)) throw err; // another app server got there first
	}
}

/**
 * Lets a mail send finish after the answer (so the answer's time does not depend on it). A failure
 * is logged by its first line only: Drizzle's second line lists the query's parameters.
 */
export function inBackground(what: string, sending: Promise<unknown>) {
	sending.catch((err) => console.error(`${what}:`, String((err as Error)?.message ?? err).split('\n')[0]));
}
