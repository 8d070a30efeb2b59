import { error } from '@sveltejs/kit';
import { desc, ilike } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { db } from '$lib/server/db';
import { devMail } from '$lib/server/db/schema';
import { searchSchema } from '$lib/schemas/search';
import type { PageServerLoad } from './$types';

const LINK = /https?:\/\/[^\s<>"]+/g;

const LOOPBACK = /^(127\.|::1$|::ffff:127\.)/;
const LOOPBACK_HOST = /^(127\.\d+\.\d+\.\d+|localhost|\[::1\])$/;

/**
 * The page holds working sign-in links, so it exists only where nothing but this machine can reach
 * it: compiled in only for the dev server and the builds npm start / npm test make with the fake
 * mail server; then only while that server runs (MAIL_FAKE=1), outside NODE_ENV=production, for
 * an app whose public address (ORIGIN) is loopback — a proxy in front means a public ORIGIN — and a
 * loopback client.
 */
function mailboxOpen(url: URL, client: string): boolean {
	return __DEV_MAILBOX__ && env.MAIL_FAKE === '1' && env.NODE_ENV !== 'production' && LOOPBACK_HOST.test(url.hostname) && LOOPBACK.test(client);
}

export const load = (async ({ url, getClientAddress }) => {
	if (!mailboxOpen(url, getClientAddress())) error(404, 'Not found');
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
