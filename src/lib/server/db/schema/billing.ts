import { boolean, index, integer, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { billingStatuses } from '../../../billing-status';
import { contractor } from './contractors';
import { lead } from './leads';

export const billingStatusEnum = pgEnum('billing_status', billingStatuses);

/** A contractor's account with the payment provider and what it entitles them to (one row each, made on first use). */
export const billingAccount = pgTable('billing_account', {
	contractorId: uuid('contractor_id')
		.primaryKey()
		.references(() => contractor.userId, { onDelete: 'cascade' }),
	/** The provider's customer and subscription ids (null until the first checkout). */
	customerId: text('customer_id').unique(),
	subscriptionId: text('subscription_id'),
	status: billingStatusEnum('status').notNull().default('none'),
	cancelAtPeriodEnd: boolean('cancel_at_period_end').notNull().default(false),
	periodStart: timestamp('period_start', { withTimezone: true }),
	periodEnd: timestamp('period_end', { withTimezone: true }),
	/** Leads opened in the current period against the plan's included leads. */
	leadsUsed: integer('leads_used').notNull().default(0),
	/** Prepaid extra leads (from lead packs, and leads given back after the period they were charged in). */
	credits: integer('credits').notNull().default(0),
	updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
});

/** Each provider event id once: a replayed delivery finds its id here and changes nothing. */
export const billingEvent = pgTable('billing_event', {
	id: text('id').primaryKey(),
	type: text('type').notNull(),
	contractorId: uuid('contractor_id').references(() => contractor.userId, { onDelete: 'set null' }),
	receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow()
});

/**
 * Which lead used which allowance: an included lead of the period that started at `periodStart`,
 * a credit, or an extra lead billed on the period's next invoice. One charge per lead; a refunded one (the lead expired unanswered or was closed
 * before any bid) gives its lead or credit back once.
 */
export const leadCharge = pgTable(
	'lead_charge',
	{
		leadId: uuid('lead_id')
			.primaryKey()
			.references(() => lead.id, { onDelete: 'cascade' }),
		contractorId: uuid('contractor_id')
			.notNull()
			.references(() => contractor.userId, { onDelete: 'cascade' }),
		kind: text('kind').$type<'included' | 'credit' | 'extra'>().notNull(),
		periodStart: timestamp('period_start', { withTimezone: true }),
		chargedAt: timestamp('charged_at', { withTimezone: true }).notNull().defaultNow(),
		refundedAt: timestamp('refunded_at', { withTimezone: true }),
		refundReason: text('refund_reason'),
		/**
		 * An extra lead's invoice item at the provider, and where it stands: 'pending' until the
		 * item is made, 'billed' once it waits for (or is on) an invoice, 'removed' when taken off
		 * before invoicing, 'credited' when given back as a credit after it was invoiced.
		 */
		invoiceItemId: text('invoice_item_id'),
		extraState: text('extra_state').$type<'pending' | 'billed' | 'removed' | 'credited'>()
	},
	(t) => [index('lead_charge_contractor_idx').on(t.contractorId, t.chargedAt)]
);
