// The engine's default for each field, as the wizard shows it beside the field ("Default: 18 in").
// Read from the schema itself (a minimal plan parsed once per unit system), never written twice.
// The engine loads after the wizard's first paint: until then no default is shown.
import type { ParsedPlan, Units } from '$lib/plan';
import { engine } from './engine.svelte';
import { valueAt } from './fieldPath';
import { figure } from '$lib/plan-view/text';

const cache: Partial<Record<Units, ParsedPlan>> = {};

function defaultsFor(units: Units): ParsedPlan | undefined {
	const found = cache[units];
	if (found) return found;
	const e = engine();
	if (!e) return undefined;
	const parsed = e.parsePlanInput({
		units,
		sections: [
			{
				outline: [
					[0, 0],
					[1, 0],
					[1, 1]
				]
			}
		]
	});
	if (!parsed.ok) throw new Error('the minimal plan is invalid');
	return (cache[units] = parsed.plan);
}

/** The default at a dotted path ("forms.stakeLength"), or undefined when the field has none. */
export function fieldDefault(units: Units, path: string): unknown {
	return valueAt(defaultsFor(units), path);
}

/** Units written as words, which take the singular after 1 ("1 day"); symbols (in, min, lb) never change. */
const SINGULAR: Record<string, string> = { days: 'day', hours: 'hour', weeks: 'week', minutes: 'minute', people: 'person', bags: 'bag' };

/** "18 in", "0.08", "1 day": a number with its unit as a sentence says it. */
export function withUnit(v: number, unit = ''): string {
	const shown = figure(v, 3);
	const word = shown === '1' ? (SINGULAR[unit] ?? unit) : unit;
	return word ? `${shown} ${word}` : shown;
}

/** "Default: 18 in." / "Default: 0.08." for a number field; '' when the field has no number default. */
export function defaultText(units: Units, path: string, unit = ''): string {
	const v = fieldDefault(units, path);
	if (typeof v !== 'number') return '';
	return `Default: ${withUnit(v, unit)}.`;
}
