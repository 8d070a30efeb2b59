import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor } from '$lib/server/db/schema';
import { sweepContractor } from '$lib/server/credentials';
import { requireRole } from '$lib/server/guards';
import { billingAccountOf, entitlement } from '$lib/server/billing/accounts'; // billing
import type { LayoutServerLoad } from './$types';

export const load = (async (event) => {
	const user = requireRole(event, 'contractor');
	// Expiry dates, reminders and respond-by dates are evaluated on each visit too, not only by the hourly sweep.
	await sweepContractor(user.id, new Date(), event.url.origin);
	const [profile] = await db.select().from(contractor).where(eq(contractor.userId, user.id));
	return {
		contractor: {
			status: profile?.status ?? 'draft',
			reason: profile?.statusReason ?? null,
			businessName: profile?.businessName ?? null,
			submitted: !!profile?.submittedAt,
			licenceExpiresOn: profile?.licenceExpiresOn ?? null,
			insuranceExpiresOn: profile?.insuranceExpiresOn ?? null
		},
		// billing: what the contractor's plan allows now (shown on the pro desk).
		billing: entitlement(await billingAccountOf(user.id))
	};
}) satisfies LayoutServerLoad;
