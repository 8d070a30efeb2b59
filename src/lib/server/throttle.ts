import { RateLimiterDrizzle, RateLimiterRes } from 'rate-limiter-flexible';
import { db } from '$lib/server/db';
import { throttleCounter } from '$lib/server/db/schema';

const MINUTE = 60;
const HOUR = 60 * MINUTE;

/**
 * One counter kept in PostgreSQL by rate-limiter-flexible: each consume is a single
 * INSERT … ON CONFLICT DO UPDATE … RETURNING, so parallel requests cannot all read "under the limit".
 */
const limiter = (keyPrefix: string, points: number, duration: number) =>
	new RateLimiterDrizzle({ storeClient: db, schema: throttleCounter, keyPrefix, points, duration });

export const SIGN_IN = {
	/** Password attempts per account and address pair before a pause. */
	pair: limiter('signin-pair', 5, 15 * MINUTE),
	/** Attempts on one account from all addresses together; past it, the e-mailed link still works. */
	account: limiter('signin-account', 30, HOUR),
	/** Attempts from one address on all accounts together. */
	address: limiter('signin-address', 100, HOUR),
	/** How often the pair was paused in the last day: each pause doubles the next one. */
	strikes: limiter('signin-strikes', 1000, 24 * HOUR)
} as const;
export const FIRST_PAUSE_S = 15 * MINUTE;
export const LONGEST_PAUSE_S = 24 * HOUR;

/** Length of the nth pause (1-based): 15 min, 30 min, 1 h … up to a day. */
export const pauseSeconds = (strike: number) => Math.min(FIRST_PAUSE_S * 2 ** (strike - 1), LONGEST_PAUSE_S);

const refused = (err: unknown): err is RateLimiterRes => err instanceof RateLimiterRes;

export type Gate = { ok: true } | { ok: false; waitMs: number; scope: 'pair' | 'account' | 'address' };

const pairKey = (email: string, ip: string) => `${email.trim().toLowerCase()}|${ip}`;

/**
 * Counts a sign-in attempt before the password is checked. The pair counter pauses one address
 * guessing at one account, with growing pauses; the account and address counters bound
 * distributed and spraying attacks. None of them stops the owner: the e-mailed sign-in link
 * bypasses all three.
 */
export async function countSignInAttempt(email: string, ip: string): Promise<Gate> {
	const pair = pairKey(email, ip);
	try {
		await SIGN_IN.pair.consume(pair);
	} catch (err) {
		if (!refused(err)) throw err;
		// Exactly one request sees the count pass the limit; it sets the pause for all that follow.
		if (err.consumedPoints === SIGN_IN.pair.points + 1) {
			const strike = await SIGN_IN.strikes.consume(pair);
			const seconds = pauseSeconds(strike.consumedPoints);
			await SIGN_IN.pair.block(pair, seconds);
			return { ok: false, waitMs: seconds * 1000, scope: 'pair' };
		}
		return { ok: false, waitMs: err.msBeforeNext, scope: 'pair' };
	}
	for (const scope of ['account', 'address'] as const) {
		try {
			await SIGN_IN[scope].consume(scope === 'account' ? email.trim().toLowerCase() : ip);
		} catch (err) {
			if (!refused(err)) throw err;
			return { ok: false, waitMs: err.msBeforeNext, scope };
		}
	}
	return { ok: true };
}

/** The right password: the pair starts afresh and the attempt does not count against the others. */
export async function signInSucceeded(email: string, ip: string) {
	await Promise.all([
		SIGN_IN.pair.delete(pairKey(email, ip)),
		SIGN_IN.strikes.delete(pairKey(email, ip)),
		SIGN_IN.account.reward(email.trim().toLowerCase(), 1),
		SIGN_IN.address.reward(ip, 1)
	]);
}

/**
 * Mail a visitor can make the app send (password resets, confirmation resends, sign-in links):
 * few per address, so nobody's inbox is flooded, and a bound per client.
 */
export const MAIL = {
	address: limiter('mail-address', 3, HOUR),
	client: limiter('mail-client', 10, HOUR)
} as const;

/** Counts one requested e-mail to `to` from `ip`; refuses, with the wait, once either limit is reached. */
export async function countMailRequest(to: string, ip: string): Promise<{ ok: true } | { ok: false; waitMs: number }> {
	try {
		await MAIL.client.consume(ip);
		await MAIL.address.consume(to.trim().toLowerCase());
		return { ok: true };
	} catch (err) {
		if (!refused(err)) throw err;
		return { ok: false, waitMs: err.msBeforeNext };
	}
}

export function formatWait(ms: number): string {
	const minutes = Math.ceil(ms / 60000);
	if (minutes <= 1) return 'about a minute';
	if (minutes < 120) return `${minutes} minutes`;
	return `${Math.ceil(minutes / 60)} hours`;
}
