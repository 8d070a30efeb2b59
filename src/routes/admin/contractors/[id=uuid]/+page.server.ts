import { error } from '@sveltejs/kit';
import { desc, eq } from 'drizzle-orm';
import { decisionMeta, type VettingDecision } from '$lib/contractor-status';
import { optionalReasonSchema, vettingReasonSchema } from '$lib/schemas/contractor';
import { db } from '$lib/server/db';
import { auditLog, user } from '$lib/server/db/schema';
import { changesSinceReview, findContractor } from '$lib/server/contractors';
import { formError, parseForm } from '$lib/server/forms';
import { requireRole } from '$lib/server/guards';
import { decide, VettingRefused } from '$lib/server/vetting';
import { adminBillingView } from '$lib/server/billing/admin'; // billing
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	const profile = await findContractor(event.params.id);
	if (!profile) error(404, 'No such contractor');
	const [account] = await db
		.select({ name: user.name, email: user.email, createdAt: user.createdAt, emailVerifiedAt: user.emailVerifiedAt })
		.from(user)
		.where(eq(user.id, event.params.id));
	const history = await db.select().from(auditLog).where(eq(auditLog.subjectId, event.params.id)).orderBy(desc(auditLog.createdAt)).limit(20);
	return { profile, account, history, billing: await adminBillingView(event.params.id), changes: changesSinceReview(profile) };
}) satisfies PageServerLoad;

/** One action per decision; the reason is required where the decision says so. */
const decision = (d: VettingDecision) => async (event: RequestEvent) => {
	const admin = requireRole(event, 'admin');
	const { data, values, failure } = await parseForm(event.request, decisionMeta[d].reason ? vettingReasonSchema : optionalReasonSchema);
	if (failure) return failure;
	try {
		if (!(await decide(admin, event.params.id, d, data.reason || null, event.url.origin))) error(404, 'No such contractor');
	} catch (err) {
		if (err instanceof VettingRefused) return formError(values, err.message, {}, 409);
		throw err;
	}
	return { decided: d };
};

export const actions = {
	approve: decision('approve'),
	sendBack: decision('send_back'),
	suspend: decision('suspend'),
	reinstate: decision('reinstate')
} satisfies Actions;
