import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { building } from '$app/environment';
import { env } from '$env/dynamic/private';
import * as schema from './schema';

// The build imports server modules to analyse routes, without a database; nothing connects then.
if (!env.DATABASE_URL && !building) throw new Error('DATABASE_URL is not set');

/**
 * When PostgreSQL is down or stuck, requests fail within seconds (answered as 503 by the hooks)
 * instead of hanging: a connect timeout, and a statement timeout no page query comes near.
 */
export const client = postgres(env.DATABASE_URL ?? '', {
	onnotice: () => {},
	connect_timeout: 3,
	// Retry a lost server every quarter second rather than the default growing pause (up to 20 s):
	// queries wait on that pause, so it decides how fast an outage answers and how fast we recover.
	backoff: () => 0.25,
	idle_timeout: 60,
	connection: { statement_timeout: 10_000, idle_in_transaction_session_timeout: 15_000 }
});
export const db = drizzle(client, { schema });
export type Db = typeof db;

/** Seconds a client should wait before retrying while the database is unavailable. */
export const RETRY_AFTER_S = 5;

const DOWN_CODES = new Set([
	'ECONNREFUSED',
	'ECONNRESET',
	'ETIMEDOUT',
	'EPIPE',
	'EHOSTUNREACH',
	'CONNECT_TIMEOUT',
	'CONNECTION_CLOSED',
	'CONNECTION_ENDED',
	'CONNECTION_DESTROYED',
	'57P01', // admin shutdown
	'57P02', // crash shutdown
	'57P03', // cannot connect now (starting up)
	'57014', // statement timeout
	'53300' // too many connections
]);

/** True when `err` (or what it wraps) says the database cannot be reached or is not answering. */
export function databaseUnavailable(err: unknown): boolean {
	for (let e = err, depth = 0; e && typeof e === 'object' && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
		const code = String((e as { code?: unknown }).code ?? '');
		if (DOWN_CODES.has(code) || code.startsWith('08')) return true;
		const errors = (e as { errors?: unknown[] }).errors; // AggregateError from a multi-address connect
		if (Array.isArray(errors) && errors.some(databaseUnavailable)) return true;
	}
	return false;
}
