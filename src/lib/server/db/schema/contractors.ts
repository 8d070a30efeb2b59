import { pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';

export const contractorStatuses = ['awaiting_review', 'approved', 'changes_requested', 'suspended'] as const;
export type ContractorStatus = (typeof contractorStatuses)[number];
export const contractorStatusEnum = pgEnum('contractor_status', contractorStatuses);

/** A contractor's business record; every contractor account has one from sign-up on. */
export const contractor = pgTable('contractor', {
	userId: uuid('user_id')
		.primaryKey()
		.references(() => user.id, { onDelete: 'cascade' }),
	businessName: text('business_name'),
	status: contractorStatusEnum('status').notNull().default('awaiting_review'),
	statusReason: text('status_reason'),
	createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
	updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
});

export type Contractor = typeof contractor.$inferSelect;
