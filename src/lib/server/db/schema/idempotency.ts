import { primaryKey, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';
import { plan } from './plans';

/**
 * The Idempotency-Key a client sent with a plan create, and the plan it made: a retried POST
 * (its answer lost to a timeout or an outage) gets that plan back instead of a second one.
 */
export const planCreateKey = pgTable(
	'plan_create_key',
	{
		ownerId: uuid('owner_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		key: text('key').notNull(),
		planId: uuid('plan_id')
			.notNull()
			.references(() => plan.id, { onDelete: 'cascade' }),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [primaryKey({ columns: [t.ownerId, t.key] })]
);
