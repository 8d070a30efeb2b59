// A wizard field names the number or choice it edits once, as a dotted path into the plan
// ("forms.stakeLength", "bags.offered.0.price", "mix.cement"); its value and its error (and a
// number's engine default) are all read at that path.
import type { ParsedPlan } from '$lib/plan';

/** Every dotted path in T that leads to a number (a list's items by index; a number-or-list field is none). */
export type NumberPath<T = ParsedPlan> = {
	[K in keyof T & string]-?: NonNullable<T[K]> extends number
		? K
		: NonNullable<T[K]> extends readonly (infer E)[]
			? E extends readonly unknown[]
				? never
				: E extends object
					? `${K}.${number}.${NumberPath<E>}`
					: never
			: NonNullable<T[K]> extends object
				? `${K}.${NumberPath<NonNullable<T[K]>>}`
				: never;
}[keyof T & string];

/** Every dotted path in T that leads to a string: a choice offered in a select (none runs through a list). */
export type ChoicePath<T = ParsedPlan> = {
	[K in keyof T & string]-?: NonNullable<T[K]> extends string
		? K
		: NonNullable<T[K]> extends readonly unknown[]
			? never
			: NonNullable<T[K]> extends object
				? `${K}.${ChoicePath<NonNullable<T[K]>>}`
				: never;
}[keyof T & string];

/** The strings a choice path may hold ('typeI' | 'typeIII' for "mix.cement"). */
export type ChoiceAt<P extends string, T = ParsedPlan> = P extends `${infer K}.${infer Rest}`
	? K extends keyof T
		? ChoiceAt<Rest, NonNullable<T[K]>>
		: never
	: P extends keyof T
		? NonNullable<T[P]> & string
		: never;

/** The value at a dotted path, or undefined where any step of it is missing. */
export function valueAt(from: unknown, path: string): unknown {
	let v = from;
	for (const k of path.split('.')) v = v && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined;
	return v;
}

/** The number at a path of the plan (null while the field is emptied, undefined when unset). */
export function numberAt(plan: ParsedPlan, path: NumberPath): number | null | undefined {
	return valueAt(plan, path) as number | null | undefined;
}

/** Writes a number at a path of the plan; the object holding it exists whenever its field is shown. */
export function setNumberAt(plan: ParsedPlan, path: NumberPath, value: number | null | undefined): void {
	setAt(plan, path, value);
}

/** The choice at a path of the plan. */
export function choiceAt<P extends ChoicePath>(plan: ParsedPlan, path: P): ChoiceAt<P> {
	return valueAt(plan, path) as ChoiceAt<P>;
}

/** Writes a choice at a path of the plan, as setNumberAt writes a number. */
export function setChoiceAt<P extends ChoicePath>(plan: ParsedPlan, path: P, value: ChoiceAt<P>): void {
	setAt(plan, path, value);
}

function setAt(plan: ParsedPlan, path: string, value: unknown): void {
	const keys = path.split('.');
	const last = keys.pop() as string;
	const holder = keys.length ? valueAt(plan, keys.join('.')) : plan;
	if (!holder || typeof holder !== 'object') throw new Error(`no ${keys.join('.')} in the plan to hold ${path}`);
	(holder as Record<string, unknown>)[last] = value;
}
