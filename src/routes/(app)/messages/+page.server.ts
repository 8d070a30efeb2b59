import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import { threadsOf } from '$lib/server/messages';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const user = requireUser(event);
	if (user.role === 'admin') error(403, 'Message threads are between homeowners and contractors.');
	return { threads: await threadsOf(user), role: user.role };
}) satisfies PageServerLoad;
