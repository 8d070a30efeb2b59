import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor, user, type Role, type User } from '$lib/server/db/schema';
import { hashPassword } from './password';
import { consumeEmailChangeToken, createEmailToken, expireEmailTokens } from './email-tokens';
import { queueMail } from './mail';
import { confirmNewEmailMail, emailChangeNoticeMail, resetPasswordMail, signInLinkMail, signUpAttemptMail, verifyEmailMail } from './mail/templates';

export class EmailTakenError extends Error {
	constructor() {
		super('An account with this e-mail already exists.');
	}
}

const UNIQUE_VIOLATION = '23505';
const isUniqueViolation = (err: unknown) => [err, (err as { cause?: unknown })?.cause].some((e) => (e as { code?: string })?.code === UNIQUE_VIOLATION);

export const DISABLED_MESSAGE = 'This account is disabled. Write to Stakeline support if you think this is a mistake.';

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
	const [found] = await db
		.select()
		.from(user)
		.where(eq(user.email, normalizeEmail(email)));
	return found;
}

export async function findUserById(id: string): Promise<User | undefined> {
	const [found] = await db.select().from(user).where(eq(user.id, id));
	return found;
}

export async function setPassword(userId: string, password: string) {
	await db
		.update(user)
		.set({ passwordHash: await hashPassword(password) })
		.where(eq(user.id, userId));
	// Someone who changed the address from a stolen session loses it with the password.
	await expireEmailTokens(userId, 'change_email');
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
			const token = await createEmailToken(owner.id, 'verify_email', { tx });
			await queueMail(owner.email, verifyEmailMail('', verifyLink(origin, token, next)), tx);
		} else await queueMail(owner.email, signUpAttemptMail(greeting(owner), `${origin}/signin`), tx);
	});
}

export async function sendPasswordResetMail(u: MailUser, origin: string) {
	const token = await createEmailToken(u.id, 'reset_password');
	await queueMail(u.email, resetPasswordMail(greeting(u), `${origin}/reset-password?token=${token}`));
}

export async function sendSignInLinkMail(u: MailUser, origin: string) {
	const token = await createEmailToken(u.id, 'sign_in');
	await queueMail(u.email, signInLinkMail(greeting(u), `${origin}/signin/link?token=${token}`));
}

/**
 * Starts a change of address: the link goes to the new address, and the old one is told. The
 * account keeps its address until the link is opened.
 */
export async function requestEmailChange(u: MailUser, newEmail: string, origin: string) {
	const to = normalizeEmail(newEmail);
	if (to === u.email) throw new EmailChangeRefused('That is already your address.');
	if (await findUserByEmail(to)) throw new EmailTakenError();
	const token = await createEmailToken(u.id, 'change_email', { newEmail: to });
	await queueMail(to, confirmNewEmailMail(greeting(u), `${origin}/confirm-email?token=${token}`));
	await queueMail(u.email, emailChangeNoticeMail(greeting(u), to, false, `${origin}/account`));
}

export class EmailChangeRefused extends Error {}

/** Opens the link: the account moves to the new (now confirmed) address; the old one is told. */
export async function confirmEmailChange(token: string, origin: string): Promise<User> {
	const change = await consumeEmailChangeToken(token);
	if (!change) throw new EmailChangeRefused('This link has expired or was used already. Ask for a new one on your account page.');
	const before = await findUserById(change.userId);
	if (!before) throw new EmailChangeRefused('This account no longer exists.');
	let after: User;
	try {
		[after] = await db.update(user).set({ email: change.newEmail, emailVerifiedAt: new Date() }).where(eq(user.id, before.id)).returning();
	} catch (err) {
		if (isUniqueViolation(err)) throw new EmailChangeRefused('Another account took this address meanwhile. Choose another one.');
		throw err;
	}
	await queueMail(before.email, emailChangeNoticeMail(greeting(before), change.newEmail, true, `${origin}/forgot-password`));
	return after;
}

/** The kinds of e-mail this account turned off (see src/lib/mail-kinds.ts). */
export async function setMailOptOut(userId: string, off: string[]) {
	await db.update(user).set({ mailOptOut: off }).where(eq(user.id, userId));
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
