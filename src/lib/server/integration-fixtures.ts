// Rows the lead, bid and billing integration specs start from.
import type { PlanResult } from '$lib/plan';
import { db } from './db';
import { plan } from './db/schema';
import { uniqueEmail } from './integration-setup';
import { createUser } from './users';

/** A stored result with only the figures a spec needs, as an old engine version left rows (engine_version 0). */
export const storedFigures = (figures: object) => figures as PlanResult;

/** A new homeowner and one plan of theirs, stored with the few figures given as its result. */
export async function homeownerWithPlan(name: string, p: { name: string; postcode: string; figures: object; input?: object }) {
	const owner = await createUser({ name, email: uniqueEmail('home'), password: 'homeowner-pass', role: 'homeowner' });
	const [stored] = await db
		.insert(plan)
		.values({ ownerId: owner.id, name: p.name, postcode: p.postcode, input: p.input ?? { units: 'imperial' }, result: storedFigures(p.figures) })
		.returning();
	return { owner, plan: stored };
}
