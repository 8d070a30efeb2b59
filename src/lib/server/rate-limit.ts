import { json } from '@sveltejs/kit';
import { RateLimiterDrizzle, RateLimiterRes } from 'rate-limiter-flexible';
import { db } from './db';
import { throttleCounter } from './db/schema';

/** The public estimate API: requests per client address per minute. */
export const ESTIMATE_LIMIT = { points: 60, duration: 60 };

// Counted in PostgreSQL with one atomic upsert, so parallel requests and several app processes share it.
const estimateLimiter = new RateLimiterDrizzle({ storeClient: db, schema: throttleCounter, keyPrefix: 'estimate', ...ESTIMATE_LIMIT });

/** Counts one request from `client`; the 429 to send when over the limit, else null. */
export async function limitEstimate(client: string): Promise<Response | null> {
	try {
		await estimateLimiter.consume(client);
		return null;
	} catch (err) {
		if (!(err instanceof RateLimiterRes)) throw err;
		const wait = Math.max(1, Math.ceil(err.msBeforeNext / 1000));
		const message = `Over ${ESTIMATE_LIMIT.points} estimates a minute from this address; try again in ${wait} s.`;
		return json({ message, errors: [{ path: '', message }] }, { status: 429, headers: { 'retry-after': String(wait) } });
	}
}
