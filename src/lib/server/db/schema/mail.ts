import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

export const mailStatuses = ['pending', 'sent', 'failed'] as const;
export const mailStatusEnum = pgEnum('mail_status', mailStatuses);

/** Outgoing mail: written first, sent after, retried with back-off, so no notice is lost. */
export const mailOutbox = pgTable(
	'mail_outbox',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		to: text('to').notNull(),
		subject: text('subject').notNull(),
		text: text('text').notNull(),
		html: text('html').notNull(),
		/** Extra message headers (a reminder's List-Unsubscribe and List-Unsubscribe-Post). */
		headers: jsonb('headers').$type<Record<string, string>>(),
		status: mailStatusEnum('status').notNull().default('pending'),
		attempts: integer('attempts').notNull().default(0),
		nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
		lastError: text('last_error'),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		sentAt: timestamp('sent_at', { withTimezone: true })
	},
	(t) => [index('mail_outbox_due_idx').on(t.status, t.nextAttemptAt)]
);

/** What the local fake SMTP server received (development and tests only). */
export const devMail = pgTable('dev_mail', {
	id: uuid('id').primaryKey().defaultRandom(),
	receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
	from: text('from').notNull(),
	to: text('to').notNull(),
	subject: text('subject').notNull(),
	text: text('text').notNull(),
	html: text('html'),
	/** The message's List-* headers as received, lower-case names (List-Unsubscribe and its one-click partner). */
	headers: jsonb('headers').$type<Record<string, string>>()
});

export type OutboxMail = typeof mailOutbox.$inferSelect;
export type DevMail = typeof devMail.$inferSelect;
