import { error } from '@sveltejs/kit';
import { count, desc, eq } from 'drizzle-orm';
import { accountAccessSchema } from '$lib/schemas/account';
import { AccessRefused, setAccountDisabled } from '$lib/server/account-access';
import { accountColumns, accountContractor } from '$lib/server/admin-accounts';
import { db } from '$lib/server/db';
import { auditLog, contractor, lead, plan, session, user } from '$lib/server/db/schema';
import { formError, parseForm } from '$lib/server/forms';
import { requireRole } from '$lib/server/guards';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load = (async (event) => {
	const me = requireRole(event, 'admin');
	const id = event.params.id;
	const [account] = await db
		.select({ ...accountColumns, disabledReason: user.disabledReason })
		.from(user)
		.leftJoin(contractor, accountContractor)
		.where(eq(user.id, id));
	if (!account) error(404, 'No such account');
	const [[plans], [leads], [sessions]] = await Promise.all([
		db.select({ n: count() }).from(plan).where(eq(plan.ownerId, id)),
		db
			.select({ n: count() })
			.from(lead)
			.where(account.role === 'contractor' ? eq(lead.contractorId, id) : eq(lead.homeownerId, id)),
		db.select({ n: count() }).from(session).where(eq(session.userId, id))
	]);
	const history = await db.select().from(auditLog).where(eq(auditLog.subjectId, id)).orderBy(desc(auditLog.createdAt)).limit(20);
	return { account, counts: { plans: plans.n, leads: leads.n, sessions: sessions.n }, history, isSelf: me.id === id };
}) satisfies PageServerLoad;

const access = (disable: boolean) => async (event: RequestEvent) => {
	const admin = requireRole(event, 'admin');
	const { data, values, failure } = await parseForm(event.request, accountAccessSchema);
	if (failure) return failure;
	try {
		if (!(await setAccountDisabled(admin, event.params.id, disable, data.reason, event.url.origin))) error(404, 'No such account');
	} catch (err) {
		if (err instanceof AccessRefused) return formError(values, err.message, {}, 409);
		throw err;
	}
	return { decided: disable ? ('disabled' as const) : ('enabled' as const) };
};

export const actions = {
	disable: access(true),
	enable: access(false)
} satisfies Actions;
