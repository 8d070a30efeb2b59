import { error } from '@sveltejs/kit';
import { desc, ilike } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { db } from '$lib/server/db';
import { devMail } from '$lib/server/db/schema';
import { searchSchema } from '$lib/schemas/search';
import { mailboxOpen } from '$lib/server/dev-mailbox';
import type { PageServerLoad } from './$types';

const LINK = /https?:\/\/[^\s<>"]+/g;

export const load = (async ({ url, getClientAddress }) => {
	if (!mailboxOpen(url, getClientAddress(), env, __DEV_MAILBOX__)) error(404, 'Not found');
	const search = searchSchema.safeParse({ q: url.searchParams.get('to') ?? undefined });
	if (!search.success) error(400, search.error.issues[0].message);
	const to = search.data.q.toLowerCase();
	const rows = await db
		.select()
		.from(devMail)
		.where(to ? ilike(devMail.to, `%${to.replace(/[%_\\]/g, '\\$&')}%`) : undefined)
		.orderBy(desc(devMail.receivedAt))
		.limit(100);
	return { to, messages: rows.map((m) => ({ ...m, links: [...new Set(m.text.match(LINK) ?? [])] })) };
}) satisfies PageServerLoad;
