import type { RequestEvent } from '@sveltejs/kit';
import { eq, sql } from 'drizzle-orm';
import { db } from '$lib/server/db';
import * as table from '$lib/server/db/schema';
import { generateToken, hashToken } from './tokens';

const DAY_IN_MS = 1000 * 60 * 60 * 24;
export const SESSION_LIFETIME_MS = 30 * DAY_IN_MS;
export const RENEW_WHEN_UNDER_MS = 15 * DAY_IN_MS;
/** However often it is used, a session ends this long after sign-in. */
export const ABSOLUTE_LIFETIME_MS = 90 * DAY_IN_MS;
export const sessionCookieName = 'stakeline_session';

export const generateSessionToken = generateToken;

/** 30 days from now, but never past the absolute lifetime counted from `createdAt`. */
export function sessionExpiry(now = Date.now(), createdAt = now): Date {
	return new Date(Math.min(now + SESSION_LIFETIME_MS, createdAt + ABSOLUTE_LIFETIME_MS));
}

/** Sliding expiry: a session used in its second half gets a fresh 30 days. */
export function needsRenewal(expiresAt: Date, now = Date.now()): boolean {
	return expiresAt.getTime() - now < RENEW_WHEN_UNDER_MS;
}

export async function createSession(token: string, userId: string) {
	const now = Date.now();
	const session: table.Session = { id: hashToken(token), userId, expiresAt: sessionExpiry(now), createdAt: new Date(now) };
	await db.insert(table.session).values(session);
	return session;
}

// Read on every signed-in request: prepared once, so each request sends only the session id
// (drizzle builds the SQL text once, PostgreSQL plans it once per connection).
const sessionWithUser = db
	.select({
		user: {
			id: table.user.id,
			name: table.user.name,
			email: table.user.email,
			role: table.user.role,
			emailVerifiedAt: table.user.emailVerifiedAt,
			disabledAt: table.user.disabledAt,
			// The account page's mail switches: read here rather than in a second query on that page.
			mailOptOut: table.user.mailOptOut
		},
		session: table.session
	})
	.from(table.session)
	.innerJoin(table.user, eq(table.session.userId, table.user.id))
	.where(eq(table.session.id, sql.placeholder('id')))
	.prepare('session_with_user');

export async function validateSessionToken(token: string) {
	const sessionId = hashToken(token);
	const [result] = await sessionWithUser.execute({ id: sessionId });

	if (!result) return { session: null, user: null };
	const { session, user: found } = result;
	const { disabledAt, ...user } = found;
	// Disabling deletes the sessions too; this also ends one created in a race with that.
	if (disabledAt) {
		await invalidateUserSessions(user.id);
		return { session: null, user: null };
	}

	const now = Date.now();
	if (now >= session.expiresAt.getTime() || now >= session.createdAt.getTime() + ABSOLUTE_LIFETIME_MS) {
		await db.delete(table.session).where(eq(table.session.id, session.id));
		return { session: null, user: null };
	}
	const renewed = sessionExpiry(now, session.createdAt.getTime());
	if (needsRenewal(session.expiresAt) && renewed > session.expiresAt) {
		session.expiresAt = renewed;
		await db.update(table.session).set({ expiresAt: session.expiresAt }).where(eq(table.session.id, session.id));
	}
	return { session, user };
}

export type SessionValidationResult = Awaited<ReturnType<typeof validateSessionToken>>;
export type SessionUser = NonNullable<SessionValidationResult['user']>;

export async function invalidateSession(sessionId: string) {
	await db.delete(table.session).where(eq(table.session.id, sessionId));
}

/** Every session of a user ends: on password change and reset. */
export async function invalidateUserSessions(userId: string) {
	await db.delete(table.session).where(eq(table.session.userId, userId));
}

export function setSessionTokenCookie(event: RequestEvent, token: string, expiresAt: Date) {
	event.cookies.set(sessionCookieName, token, {
		expires: expiresAt,
		path: '/',
		httpOnly: true,
		sameSite: 'lax',
		secure: event.url.protocol === 'https:'
	});
}

export function deleteSessionTokenCookie(event: RequestEvent) {
	event.cookies.delete(sessionCookieName, { path: '/' });
}

/** Signs the browser in as userId: a new session and its cookie. */
export async function startSession(event: RequestEvent, userId: string) {
	const token = generateSessionToken();
	const session = await createSession(token, userId);
	setSessionTokenCookie(event, token, session.expiresAt);
}
