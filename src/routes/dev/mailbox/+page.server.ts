import { error } from '@sveltejs/kit';
import { desc, ilike } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { db } from '$lib/server/db';
import { devMail } from '$lib/server/db/schema';
import type { PageServerLoad } from './$types';

const LINK = /https?:\/\/[^\s<>"]+/g;

const LOOPBACK = /^(127\.|::1$|::ffff:127\.)/;

export const load = (async ({ url, getClientAddress }) => {
	// Only the local fake SMTP server fills this table; without it the page does not exist. It holds
	// sign-in links, so even then it answers only to this machine.
	if (env.MAIL_FAKE !== '1' || !LOOPBACK.test(getClientAddress())) error(404, 'Not found');
	const to = url.searchParams.get('to')?.trim().toLowerCase() ?? '';
	const rows = await db
		.select()
		.from(devMail)
		.where(to ? ilike(devMail.to, `%${to.replace(/[%_\\]/g, '\\$&')}%`) : undefined)
		.orderBy(desc(devMail.receivedAt))
		.limit(100);
	return { to, messages: rows.map((m) => ({ ...m, links: [...new Set(m.text.match(LINK) ?? [])] })) };
}) satisfies PageServerLoad;
