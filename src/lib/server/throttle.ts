import { and, eq, gte, inArray, lt, or } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { signInFailure } from '$lib/server/db/schema';

export const WINDOW_MS = 15 * 60 * 1000;
export const LIMITS = { email: 5, ip: 20 } as const;

/**
 * How long (ms) until fewer than `limit` failures lie inside the window; 0 when allowed now.
 * Pure, so the rule is tested without a database.
 */
export function waitFor(failures: Date[], now: number, limit: number, windowMs = WINDOW_MS): number {
	const recent = failures
		.map((d) => d.getTime())
		.filter((t) => t > now - windowMs)
		.sort((a, b) => a - b);
	if (recent.length < limit) return 0;
	return recent[recent.length - limit] + windowMs - now;
}

const keys = (email: string, ip: string) => ({ email: `email:${email.toLowerCase()}`, ip: `ip:${ip}` });

/** Milliseconds this sign-in must wait, by e-mail and by address, whichever is longer. */
export async function signInWait(email: string, ip: string, now = Date.now()): Promise<number> {
	const k = keys(email, ip);
	const rows = await db
		.select()
		.from(signInFailure)
		.where(and(inArray(signInFailure.key, [k.email, k.ip]), gte(signInFailure.at, new Date(now - WINDOW_MS))));
	const of = (key: string) => rows.filter((r) => r.key === key).map((r) => r.at);
	return Math.max(waitFor(of(k.email), now, LIMITS.email), waitFor(of(k.ip), now, LIMITS.ip));
}

export async function recordSignInFailure(email: string, ip: string) {
	const k = keys(email, ip);
	await db.insert(signInFailure).values([{ key: k.email }, { key: k.ip }]);
	// Keep the table small: what has left the window no longer counts.
	await db
		.delete(signInFailure)
		.where(and(or(eq(signInFailure.key, k.email), eq(signInFailure.key, k.ip)), lt(signInFailure.at, new Date(Date.now() - WINDOW_MS))));
}

/** A successful sign-in clears the count for that e-mail (not for the address). */
export async function clearSignInFailures(email: string) {
	await db.delete(signInFailure).where(eq(signInFailure.key, keys(email, '').email));
}

export function formatWait(ms: number): string {
	const minutes = Math.ceil(ms / 60000);
	return minutes <= 1 ? 'about a minute' : `${minutes} minutes`;
}
