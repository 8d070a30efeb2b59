import { estimate, parsePlanInput, type ParsedPlan, type PlanInput, type Units } from '$lib/plan';
import { lShape, rectangle } from './shapes';

/** A new plan: a rectangle along the house with every engine default filled in, so every field binds. */
export function starterInput(units: Units = 'imperial', name = 'My slab'): ParsedPlan {
	const outline = units === 'imperial' ? rectangle(12, 10) : rectangle(3.6, 3);
	const parsed = parsePlanInput({ units, name, sections: [{ outline }], reference: { label: 'door sill', below: units === 'imperial' ? 1 : 25 } });
	if (!parsed.ok) throw new Error(`starter plan is invalid: ${parsed.errors[0].message}`);
	return parsed.plan;
}

/** Fills in defaults for an input saved earlier (older inputs may lack newer fields). */
export function completeInput(input: unknown): ParsedPlan | null {
	const parsed = parsePlanInput(input);
	return parsed.ok ? parsed.plan : null;
}

export { lShape, rectangle };

export type DraftData = { name: string; postcode: string; input: PlanInput };

/**
 * The plan being edited in the browser. Results are derived by the same engine the server runs,
 * so the panel updates on every keystroke; the server recomputes on save.
 */
export class PlanDraft {
	name = $state('');
	postcode = $state('');
	input = $state() as ParsedPlan;

	constructor(data: { name: string; postcode?: string; input: ParsedPlan }) {
		this.name = data.name;
		this.postcode = data.postcode ?? '';
		this.input = data.input;
	}

	outcome = $derived(estimate(this.input));
	result = $derived(this.outcome.ok ? this.outcome.plan : null);
	/** Engine messages by dotted path ("sections.0.outline"), for the field that caused them. */
	errors = $derived(this.outcome.ok ? {} : (Object.fromEntries(this.outcome.errors.map((e) => [e.path, e.message])) as Record<string, string>));

	/** Messages whose path starts with one of the prefixes: what a wizard step shows. */
	errorsUnder(...prefixes: string[]): [string, string][] {
		return Object.entries(this.errors).filter(([p]) => prefixes.some((x) => p === x || p.startsWith(`${x}.`)));
	}

	snapshot(): DraftData {
		return { name: this.name, postcode: this.postcode, input: $state.snapshot(this.input) as PlanInput };
	}
}
