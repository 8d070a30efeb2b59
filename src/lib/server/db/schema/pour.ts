import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { plan } from './plans';

/**
 * One thing recorded on a pour day (start, a batch, an undo, the end, bags used, an air temperature,
 * a note), as the device sent it. `key` is the device's idempotency key: a record sent again after a
 * lost answer or from an offline queue is stored once. `record` is the validated record itself.
 */
export const pourRecord = pgTable(
	'pour_record',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		planId: uuid('plan_id')
			.notNull()
			.references(() => plan.id, { onDelete: 'cascade' }),
		key: text('key').notNull(),
		kind: text('kind').notNull(),
		pour: integer('pour'),
		at: timestamp('at', { withTimezone: true }).notNull(),
		record: jsonb('record').notNull(),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [uniqueIndex('pour_record_plan_key_idx').on(t.planId, t.key), index('pour_record_plan_at_idx').on(t.planId, t.at)]
);

export type PourRecordRow = typeof pourRecord.$inferSelect;
