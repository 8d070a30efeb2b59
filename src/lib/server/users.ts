import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor, user, type Role, type User } from '$lib/server/db/schema';
import { hashPassword } from './password';
import { createEmailToken } from './email-tokens';
import { queueMail } from './mail';
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

/** `next`: where a new account lands once the link is followed (kept from the sign-up form). */
export async function sendVerificationMail(u: MailUser, origin: string, next = '') {
	const token = await createEmailToken(u.id, 'verify_email');
	await queueMail(u.email, verifyEmailMail('', `${origin}/verify-email?token=${token}${next ? `&next=${encodeURIComponent(next)}` : ''}`));
}

/**
 * Someone signed up with an address that has an account: the form says nothing, its owner hears of
 * it. An account never confirmed gets a fresh confirmation link instead (the first one may be lost).
 */
export async function sendSignUpAttemptMail(email: string, origin: string, next = '') {
	const u = await findUserByEmail(email);
	if (!u) return;
	if (!u.emailVerifiedAt) return sendVerificationMail(u, origin, next);
	await queueMail(u.email, signUpAttemptMail(greeting(u), `${origin}/signin`));
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
