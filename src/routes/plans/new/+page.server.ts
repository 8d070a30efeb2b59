import { error } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

// Anyone may start a plan; only homeowners keep plans in an account.
export const load = (({ locals }) => {
	if (locals.user && locals.user.role !== 'homeowner') error(403, 'Plans belong to homeowner accounts.');
	return { signedIn: locals.user !== null };
}) satisfies PageServerLoad;
