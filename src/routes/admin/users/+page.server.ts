import { and, asc, count, eq, ilike, or, type SQL } from 'drizzle-orm';
import { roles, type Role } from '$lib/roles';
import { db } from '$lib/server/db';
import { contractor, user } from '$lib/server/db/schema';
import { requireRole } from '$lib/server/guards';
import { pageFrom } from '$lib/paging';
import { searchSchema } from '$lib/schemas/search';
import { error } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

const likePattern = (s: string) => `%${s.replace(/[%_\\]/g, '\\$&')}%`;

export const load = (async (event) => {
	requireRole(event, 'admin');
	const search = searchSchema.safeParse({ q: event.url.searchParams.get('q') ?? undefined });
	if (!search.success) error(400, search.error.issues[0].message);
	const q = search.data.q;
	const roleParam = event.url.searchParams.get('role') ?? '';
	const role = (roles as readonly string[]).includes(roleParam) ? (roleParam as Role) : null;
	const paging = pageFrom(event.url, 25);

	const filters: SQL[] = [];
	if (q) filters.push(or(ilike(user.name, likePattern(q)), ilike(user.email, likePattern(q)), ilike(contractor.businessName, likePattern(q)))!);
	if (role) filters.push(eq(user.role, role));
	const where = filters.length ? and(...filters) : undefined;

	const rows = await db
		.select({ id: user.id, name: user.name, email: user.email, role: user.role, createdAt: user.createdAt, businessName: contractor.businessName, status: contractor.status })
		.from(user)
		.leftJoin(contractor, eq(contractor.userId, user.id))
		.where(where)
		.orderBy(asc(user.name), asc(user.email))
		.limit(paging.size)
		.offset(paging.offset);
	const [{ n }] = await db.select({ n: count() }).from(user).leftJoin(contractor, eq(contractor.userId, user.id)).where(where);
	return { rows, total: n, q, role: role ?? '', ...paging };
}) satisfies PageServerLoad;
