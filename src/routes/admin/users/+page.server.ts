import { and, asc, count, eq, ilike, isNotNull, or, sql, type SQL } from 'drizzle-orm';
import { contractorStatuses, type ContractorStatus } from '$lib/contractor-status';
import { roles, type Role } from '$lib/roles';
import { accountColumns, accountContractor } from '$lib/server/admin-accounts';
import { db } from '$lib/server/db';
import { contractor, user } from '$lib/server/db/schema';
import { requireRole } from '$lib/server/guards';
import { pageFrom } from '$lib/paging';
import { searchSchema } from '$lib/schemas/search';
import { error } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

const likePattern = (s: string) => `%${s.replace(/[%_\\]/g, '\\$&')}%`;
const sqlBare = () => sql`regexp_replace(coalesce(${contractor.licenceNumber}, ''), '[\\s-]', '', 'g')`;
const oneOf = <T extends string>(list: readonly T[], v: string | null): T | null => ((list as readonly string[]).includes(v ?? '') ? (v as T) : null);

export const load = (async (event) => {
	requireRole(event, 'admin');
	const search = searchSchema.safeParse({ q: event.url.searchParams.get('q') ?? undefined });
	if (!search.success) error(400, search.error.issues[0].message);
	const q = search.data.q;
	const params = event.url.searchParams;
	const role = oneOf<Role>(roles, params.get('role'));
	const status = oneOf<ContractorStatus>(contractorStatuses, params.get('status'));
	const disabledOnly = params.get('disabled') === '1';
	const paging = pageFrom(event.url, 25);

	const filters: SQL[] = [];
	if (q) {
		const like = likePattern(q);
		// The licence number is matched without spaces or dashes too, as people type it either way.
		const bare = likePattern(q.replace(/[\s-]/g, ''));
		filters.push(
			or(ilike(user.name, like), ilike(user.email, like), ilike(contractor.businessName, like), ilike(contractor.licenceNumber, like), ilike(sqlBare(), bare))!
		);
	}
	if (role) filters.push(eq(user.role, role));
	if (status) filters.push(eq(contractor.status, status));
	if (disabledOnly) filters.push(isNotNull(user.disabledAt));
	const where = filters.length ? and(...filters) : undefined;

	const rows = await db
		.select({ ...accountColumns, licenceNumber: contractor.licenceNumber, status: contractor.status })
		.from(user)
		.leftJoin(contractor, accountContractor)
		.where(where)
		.orderBy(asc(user.name), asc(user.email))
		.limit(paging.size)
		.offset(paging.offset);
	const [{ n }] = await db.select({ n: count() }).from(user).leftJoin(contractor, accountContractor).where(where);
	return { rows, total: n, q, role: role ?? '', status: status ?? '', disabled: disabledOnly, ...paging };
}) satisfies PageServerLoad;
