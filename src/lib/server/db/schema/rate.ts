import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * rate-limiter-flexible's counters, in the shape its Drizzle store reads: one row per key, reset
 * when `expire` has passed. Every limiter shares the table, each under its own key prefix: sign-in
 * attempts and requested mail (throttle.ts), the public estimate API (rate-limit.ts).
 */
export const throttleCounter = pgTable('throttle_counter', {
	key: text('key').primaryKey(),
	points: integer('points').notNull().default(0),
	expire: timestamp('expire', { withTimezone: true })
});
