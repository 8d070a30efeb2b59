import { sql } from 'drizzle-orm';
import { boolean, date, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';
import { contractorStatuses, type ContractorStatus } from '../../../contractor-status';
import { serviceKinds, distanceUnits, documentKinds } from '../../../schemas/contractor';

export { contractorStatuses, type ContractorStatus };
export const contractorStatusEnum = pgEnum('contractor_status', contractorStatuses);
export const distanceUnitEnum = pgEnum('distance_unit', distanceUnits);
export const serviceKindEnum = pgEnum('service_kind', serviceKinds);
export const documentKindEnum = pgEnum('document_kind', documentKinds);

/** A contractor's business record; every contractor account has one from sign-up on. */
export const contractor = pgTable(
	'contractor',
	{
		userId: uuid('user_id')
			.primaryKey()
			.references(() => user.id, { onDelete: 'cascade' }),
		businessName: text('business_name'),
		contactName: text('contact_name'),
		phone: text('phone'),
		description: text('description'),
		yearsInTrade: integer('years_in_trade'),
		services: serviceKindEnum('services')
			.array()
			.notNull()
			.default(sql`'{}'`),
		licenceNumber: text('licence_number'),
		licenceAuthority: text('licence_authority'),
		servicePostcode: text('service_postcode'),
		serviceRadius: integer('service_radius'),
		serviceRadiusUnit: distanceUnitEnum('service_radius_unit').notNull().default('mi'),
		/** How the leads list shows distances; null: from the reader's locale (miles in the US, else km). */
		distanceUnit: distanceUnitEnum('distance_unit'),
		// The service postcode's centroid, stored so matching does not depend on where it came from.
		serviceLat: doublePrecision('service_lat'),
		serviceLon: doublePrecision('service_lon'),
		status: contractorStatusEnum('status').notNull().default('draft'),
		statusReason: text('status_reason'),
		/** While suspended: the status to return to on reinstatement, unless the credentials changed meanwhile. */
		suspendedFrom: contractorStatusEnum('suspended_from'),
		credentialsChangedWhileSuspended: boolean('credentials_changed_while_suspended').notNull().default(false),
		/** What the admin saw at the last decision, so the next review can show what changed since. */
		reviewedSnapshot: jsonb('reviewed_snapshot').$type<ReviewedSnapshot>(),
		licenceExpiresOn: date('licence_expires_on'),
		insuranceExpiresOn: date('insurance_expires_on'),
		/** When the profile was first sent for review; null while the contractor is still filling it in. */
		submittedAt: timestamp('submitted_at', { withTimezone: true }),
		/** When it (re-)entered the vetting queue: the queue is oldest first by this. */
		reviewRequestedAt: timestamp('review_requested_at', { withTimezone: true }).notNull().defaultNow(),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [
		index('contractor_status_idx').on(t.status, t.reviewRequestedAt),
		// Matching reads approved contractors within a band of latitude (matching.ts).
		index('contractor_approved_lat_idx')
			.on(t.serviceLat)
			.where(sql`${t.status} = 'approved'`)
	]
);

/**
 * The licence or insurance certificate a contractor uploaded. One current file of each kind; a
 * replaced file stays as history (superseded) so the reviewer can see what was there before.
 */
export const contractorDocument = pgTable(
	'contractor_document',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		contractorId: uuid('contractor_id')
			.notNull()
			.references(() => contractor.userId, { onDelete: 'cascade' }),
		kind: documentKindEnum('kind').notNull(),
		storageKey: text('storage_key').notNull(),
		contentType: text('content_type').notNull(),
		bytes: integer('bytes').notNull(),
		originalName: text('original_name').notNull(),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		supersededAt: timestamp('superseded_at', { withTimezone: true })
	},
	(t) => [
		uniqueIndex('contractor_document_current_uq')
			.on(t.contractorId, t.kind)
			.where(sql`${t.supersededAt} is null`)
	]
);

/**
 * One row per expiry reminder sent: (contractor, credential, the date it expires, days before).
 * The unique key makes each reminder go once, however many app servers sweep; a renewed date is a
 * new key, so its reminders go again.
 */
export const credentialReminder = pgTable(
	'credential_reminder',
	{
		contractorId: uuid('contractor_id')
			.notNull()
			.references(() => contractor.userId, { onDelete: 'cascade' }),
		kind: documentKindEnum('kind').notNull(),
		expiresOn: date('expires_on').notNull(),
		daysBefore: integer('days_before').notNull(),
		sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [primaryKey({ columns: [t.contractorId, t.kind, t.expiresOn, t.daysBefore] })]
);

/** The reviewed profile fields and current document ids, as of an admin's last decision. */
export type ReviewedSnapshot = { fields: Record<string, unknown>; documentIds: string[] };

export type Contractor = typeof contractor.$inferSelect;
export type CredentialReminder = typeof credentialReminder.$inferSelect;
export type ContractorDocument = typeof contractorDocument.$inferSelect;
