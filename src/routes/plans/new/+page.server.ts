import { error } from '@sveltejs/kit';
import { parsePlanInput } from '$lib/plan';
import { starterInput } from '$lib/planner/draft.svelte';
import type { PageServerLoad } from './$types';

// Anyone may start a plan; only homeowners keep plans in an account.
export const load = (({ locals }) => {
	if (locals.user && locals.user.role !== 'homeowner') error(403, 'Plans belong to homeowner accounts.');
	// The starter plan comes with the page, so the first step shows before the engine has loaded.
	return { signedIn: locals.user !== null, starter: starterInput('imperial', undefined, parsePlanInput) };
}) satisfies PageServerLoad;
