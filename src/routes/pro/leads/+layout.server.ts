import { error } from '@sveltejs/kit';
import type { LayoutServerLoad } from './$types';

/** Pending, changes-requested and suspended contractors see no homeowner's data. */
export const load = (async ({ parent }) => {
	const { contractor } = await parent();
	if (contractor.status !== 'approved') error(403, 'Leads are open to approved contractors only.');
}) satisfies LayoutServerLoad;
