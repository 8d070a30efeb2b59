import { date, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { bidStatuses, leadStatuses, lineItemKinds, timeframes, type ExistingSurface, type Finish, type LineItemKind } from '../../../leads';
import { user } from './auth';
import { contractor, serviceKindEnum } from './contractors';
import { plan } from './plans';

export const leadStatusEnum = pgEnum('lead_status', leadStatuses);
export const bidStatusEnum = pgEnum('bid_status', bidStatuses);
export const timeframeEnum = pgEnum('timeframe', timeframes);
export { lineItemKinds };

/**
 * What a contractor sees of a plan: a copy taken when it was sent, never the live row. Photos are
 * listed by id; their bytes stay in storage, and one the homeowner deletes later is simply gone.
 */
export type PlanSnapshot = { name: string; postcode: string | null; input: unknown; result: unknown; photoIds?: string[] };

/**
 * A plan sent to one contractor. The plan's revision and a snapshot of its input and result are
 * frozen here; a later re-send only records that a newer revision exists.
 */
export const lead = pgTable(
	'lead',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		planId: uuid('plan_id')
			.notNull()
			.references(() => plan.id, { onDelete: 'cascade' }),
		homeownerId: uuid('homeowner_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		contractorId: uuid('contractor_id')
			.notNull()
			.references(() => contractor.userId, { onDelete: 'cascade' }),
		scope: serviceKindEnum('scope').notNull(),
		timeframe: timeframeEnum('timeframe').notNull(),
		notes: text('notes').notNull().default(''),
		// Checked by getBidsSchema; text so a new choice needs no migration.
		finish: text('finish').$type<Finish>().notNull().default('broom'),
		existingSurface: text('existing_surface').$type<ExistingSurface>().notNull().default('grass_soil'),
		siteAccess: text('site_access').notNull().default(''),
		planRevision: integer('plan_revision').notNull(),
		snapshot: jsonb('snapshot').$type<PlanSnapshot>().notNull(),
		latestRevision: integer('latest_revision').notNull(),
		town: text('town'),
		distanceKm: doublePrecision('distance_km').notNull(),
		status: leadStatusEnum('status').notNull().default('new'),
		declineReason: text('decline_reason'),
		/** The day by which the contractor should bid or decline; after it an unanswered lead expires. Null on leads sent before there was one. */
		respondBy: date('respond_by'),
		homeownerReadAt: timestamp('homeowner_read_at', { withTimezone: true }).notNull().defaultNow(),
		contractorReadAt: timestamp('contractor_read_at', { withTimezone: true }),
		sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [
		unique('lead_plan_contractor_uq').on(t.planId, t.contractorId),
		index('lead_contractor_idx').on(t.contractorId, t.sentAt),
		// The homeowner's unread count on every signed-in page, and their threads.
		index('lead_homeowner_idx').on(t.homeownerId)
	]
);

/**
 * Where the job is and how to reach the homeowner: asked when the plan is sent or a bid accepted,
 * and shown only to the contractor whose bid was accepted, from then on.
 */
export const jobContact = pgTable('job_contact', {
	planId: uuid('plan_id')
		.primaryKey()
		.references(() => plan.id, { onDelete: 'cascade' }),
	siteAddress: text('site_address').notNull(),
	phone: text('phone').notNull(),
	updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
});

export type LineItem = { kind: LineItemKind; cents: number };

/** A contractor's price for one lead; at most one per lead, edited in place until accepted. */
export const bid = pgTable(
	'bid',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		leadId: uuid('lead_id')
			.notNull()
			.unique()
			.references(() => lead.id, { onDelete: 'cascade' }),
		planId: uuid('plan_id')
			.notNull()
			.references(() => plan.id, { onDelete: 'cascade' }),
		contractorId: uuid('contractor_id')
			.notNull()
			.references(() => contractor.userId, { onDelete: 'cascade' }),
		totalCents: integer('total_cents').notNull(),
		lineItems: jsonb('line_items').$type<LineItem[]>().notNull().default([]),
		earliestStart: date('earliest_start').notNull(),
		durationDays: integer('duration_days').notNull(),
		validUntil: date('valid_until').notNull(),
		inclusions: text('inclusions').notNull().default(''),
		exclusions: text('exclusions').notNull().default(''),
		notes: text('notes').notNull().default(''),
		status: bidStatusEnum('status').notNull().default('open'),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('bid_plan_idx').on(t.planId, t.status)]
);

/** One thread per lead, between its homeowner and its contractor; plain text. */
export const leadMessage = pgTable(
	'lead_message',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		leadId: uuid('lead_id')
			.notNull()
			.references(() => lead.id, { onDelete: 'cascade' }),
		senderId: uuid('sender_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		body: text('body').notNull(),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('lead_message_lead_idx').on(t.leadId, t.createdAt)]
);

export type Lead = typeof lead.$inferSelect;
export type Bid = typeof bid.$inferSelect;
export type JobContact = typeof jobContact.$inferSelect;
export type LeadMessage = typeof leadMessage.$inferSelect;
