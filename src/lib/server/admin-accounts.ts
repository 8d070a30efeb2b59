import { eq } from 'drizzle-orm';
import { contractor, user } from '$lib/server/db/schema';

/**
 * What the admin's account list and account page both show of an account: select these from
 * `user` left-joined to `contractor` on `accountContractor` (the business name is null for a
 * homeowner or admin).
 */
export const accountColumns = {
	id: user.id,
	name: user.name,
	email: user.email,
	role: user.role,
	createdAt: user.createdAt,
	emailVerifiedAt: user.emailVerifiedAt,
	disabledAt: user.disabledAt,
	businessName: contractor.businessName
};

/** The join condition of an account to its contractor profile, if any. */
export const accountContractor = eq(contractor.userId, user.id);
