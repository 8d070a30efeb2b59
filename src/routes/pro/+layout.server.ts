import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { contractor } from '$lib/server/db/schema';
import { requireRole } from '$lib/server/guards';
import type { LayoutServerLoad } from './$types';

export const load = (async (event) => {
	const user = requireRole(event, 'contractor');
	const [profile] = await db.select().from(contractor).where(eq(contractor.userId, user.id));
	return {
		contractor: {
			status: profile?.status ?? 'draft',
			reason: profile?.statusReason ?? null,
			businessName: profile?.businessName ?? null,
			submitted: !!profile?.submittedAt
		}
	};
}) satisfies LayoutServerLoad;
