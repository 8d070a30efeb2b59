import type { PlanResult } from '$lib/plan';

/** A saved plan as the API and pages hand it to the browser. */
export interface PlanRecord {
	id: string;
	name: string;
	postcode: string;
	revision: number;
	input: unknown;
	result: PlanResult;
	createdAt: Date | string;
	updatedAt: Date | string;
}
