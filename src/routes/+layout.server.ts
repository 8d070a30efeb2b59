import { unreadMessageCount } from '$lib/server/messages';
import type { LayoutServerLoad } from './$types';

export const load = (async ({ locals, depends }) => {
	depends('app:unread');
	const u = locals.user;
	return {
		user: u ? { name: u.name, email: u.email, role: u.role, emailVerified: u.emailVerifiedAt !== null } : null,
		// Read on every navigation; a thread page that marks messages read re-runs it (app:unread).
		unread: u ? await unreadMessageCount(u) : 0,
		reader: locals.reader
	};
}) satisfies LayoutServerLoad;
