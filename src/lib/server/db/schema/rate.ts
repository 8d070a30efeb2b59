import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * rate-limiter-flexible's counters, in the shape its Drizzle store reads: one row per key, reset
 * when `expire` has passed. Every limiter shares the table, each under its own key prefix: sign-in
 * attempts and requested mail (throttle.ts), the public estimate API (rate-limit.ts). UNLOGGED
 * (migration 0013; drizzle cannot declare it): no WAL flush per request, and a crash only restarts
 * each key's window.
 */
export const throttleCounter = pgTable('throttle_counter', {
	key: text('key').primaryKey(),
	points: integer('points').notNull().default(0),
	expire: timestamp('expire', { withTimezone: true })
});
