import { sql } from 'drizzle-orm';
import { doublePrecision, index, integer, pgEnum, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
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
		services: serviceKindEnum('services').array().notNull().default(sql`'{}'`),
		licenceNumber: text('licence_number'),
		licenceAuthority: text('licence_authority'),
		servicePostcode: text('service_postcode'),
		serviceRadius: integer('service_radius'),
		serviceRadiusUnit: distanceUnitEnum('service_radius_unit').notNull().default('mi'),
		// The service postcode's centroid, stored so matching does not depend on where it came from.
		serviceLat: doublePrecision('service_lat'),
		serviceLon: doublePrecision('service_lon'),
		status: contractorStatusEnum('status').notNull().default('awaiting_review'),
		statusReason: text('status_reason'),
		/** When the profile was first sent for review; null while the contractor is still filling it in. */
		submittedAt: timestamp('submitted_at', { withTimezone: true }),
		/** When it (re-)entered the vetting queue: the queue is oldest first by this. */
		reviewRequestedAt: timestamp('review_requested_at', { withTimezone: true }).notNull().defaultNow(),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('contractor_status_idx').on(t.status, t.reviewRequestedAt)]
);

/** The licence or insurance certificate a contractor uploaded; one current file of each kind. */
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
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [unique('contractor_document_kind_uq').on(t.contractorId, t.kind)]
);

export type Contractor = typeof contractor.$inferSelect;
export type ContractorDocument = typeof contractorDocument.$inferSelect;
