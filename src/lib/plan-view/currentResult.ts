import { estimate, type PlanResult } from '$lib/plan';

/** A result saved before the engine carried its slab block and currency is worked out again from its input. */
export function currentResult(input: unknown, stored: PlanResult): PlanResult {
	if (stored.slab && stored.currency) return stored;
	const again = estimate(input);
	return again.ok ? again.plan : stored;
}
