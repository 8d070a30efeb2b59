import { index, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';
import { auditActions, type AuditAction } from '../../../audit';

export { auditActions, type AuditAction };
export const auditActionEnum = pgEnum('audit_action', auditActions);

/**
 * Every admin action, written in the same transaction as the change it records. Names are copied
 * in, so the log still reads right after an account is renamed or deleted.
 */
export const auditLog = pgTable(
	'audit_log',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		actorId: uuid('actor_id').references(() => user.id, { onDelete: 'set null' }),
		actorName: text('actor_name').notNull(),
		action: auditActionEnum('action').notNull(),
		subjectId: uuid('subject_id').references(() => user.id, { onDelete: 'set null' }),
		subjectName: text('subject_name').notNull(),
		reason: text('reason'),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('audit_log_created_idx').on(t.createdAt), index('audit_log_subject_idx').on(t.subjectId)]
);

export type AuditEntry = typeof auditLog.$inferSelect;
