import { boolean, date, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { PlanResult } from '../../../plan';
import { user } from './auth';

/**
 * A homeowner's slab plan. `input` is what they described (the engine's input schema); `result`
 * is what the server's engine computed from it — never numbers sent by the browser — and
 * `engineVersion` the engine's ENGINE_VERSION then (0: saved before versions were recorded), so
 * results of an older engine can be recomputed (recomputeOutdatedPlans). `revision` increases on
 * every save, so a stale tab's write is refused rather than lost.
 */
export const plan = pgTable(
	'plan',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		ownerId: uuid('owner_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		name: text('name').notNull(),
		postcode: text('postcode'),
		input: jsonb('input').notNull(),
		result: jsonb('result').$type<PlanResult>().notNull(),
		engineVersion: integer('engine_version').notNull().default(0),
		revision: integer('revision').notNull().default(1),
		/** E-mail curing reminders on (the plan page's switch; a stop link in each e-mail turns it off). */
		curingReminders: boolean('curing_reminders').notNull().default(false),
		/** The homeowner's IANA zone when they turned reminders on: they go out at 07:00 there. */
		reminderTimeZone: text('reminder_time_zone').notNull().default('UTC'),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('plan_owner_idx').on(t.ownerId, t.updatedAt)]
);

/**
 * A site photo; the bytes live in the storage module under `storageKey` / `thumbKey`. `clientKey` is
 * the Idempotency-Key the device sent with it (the pour page's offline queue): a photo sent again
 * after a lost answer is stored once per plan. Null for uploads that sent none.
 */
export const planPhoto = pgTable(
	'plan_photo',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		planId: uuid('plan_id')
			.notNull()
			.references(() => plan.id, { onDelete: 'cascade' }),
		storageKey: text('storage_key').notNull(),
		thumbKey: text('thumb_key').notNull(),
		contentType: text('content_type').notNull(),
		bytes: integer('bytes').notNull(),
		width: integer('width'),
		height: integer('height'),
		originalName: text('original_name').notNull(),
		clientKey: text('client_key'),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('plan_photo_plan_idx').on(t.planId), uniqueIndex('plan_photo_client_key_idx').on(t.planId, t.clientKey)]
);

export type Plan = typeof plan.$inferSelect;
export type PlanPhoto = typeof planPhoto.$inferSelect;

/** A curing reminder e-mail written to the outbox: at most one per plan, pour date and day. */
export const curingReminderSent = pgTable(
	'curing_reminder_sent',
	{
		planId: uuid('plan_id')
			.notNull()
			.references(() => plan.id, { onDelete: 'cascade' }),
		pourDate: date('pour_date').notNull(),
		day: date('day').notNull(),
		sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [primaryKey({ columns: [t.planId, t.pourDate, t.day] })]
);

/** Keys the app makes once and every server shares (the signing key of reminder stop links). */
export const appSecret = pgTable('app_secret', {
	name: text('name').primaryKey(),
	value: text('value').notNull(),
	createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
});
