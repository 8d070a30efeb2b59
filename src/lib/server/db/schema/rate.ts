import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Request counters of the public API's rate limit, in the shape rate-limiter-flexible's Drizzle
 * store reads: one row per client key, reset when `expire` has passed. UNLOGGED (migration 0010:
 * drizzle cannot declare it): no WAL flush per request, and a crash only restarts the minute.
 */
export const apiRateCounter = pgTable('api_rate_counter', {
	key: text('key').primaryKey(),
	points: integer('points').notNull().default(0),
	expire: timestamp('expire', { withTimezone: true })
});
