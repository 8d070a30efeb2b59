// Small helpers for hot paths (Array.from on an array-like is slow in V8).

/**
 * Ascending order for Array.prototype.sort, answering −1, 0 or 1: V8 boxes a comparison's answer
 * as a new heap number on every call unless it is a small integer, and the difference of two
 * lengths seldom is. The order is the same as with a − b.
 */
export const ascending = (a: number, b: number) => (a < b ? -1 : a > b ? 1 : 0);

/** [f(0), f(1), … f(n − 1)]. */
export function times<T>(n: number, f: (i: number) => T): T[] {
	const out: T[] = [];
	for (let i = 0; i < n; i++) out.push(f(i));
	return out;
}

// Lists the engine hands from one step to the next are not built with Array.prototype.map. V8
// gives map's answer a different elements kind in optimised code (holey, and doubles where the
// interpreter keeps small integers) than in the interpreter, so every function that reads such a
// list is deoptimised ("wrong map") each time the function that builds it is optimised: waves of
// deopts for seconds after start-up, which is what made the bench's median vary between runs.
// These make the list with `new Array(n)`, whose allocation site learns the kind (holey objects,
// holey doubles) once and then creates every list with it, the same in every tier, at its exact
// length (a list grown by push copies itself as it grows).

/** a.map(f), one elements kind whatever the tier (lists of objects, points or lists). */
export function mapList<T, U>(a: readonly T[], f: (x: T, i: number) => U): U[] {
	const out = new Array<U>(a.length);
	for (let i = 0; i < a.length; i++) out[i] = f(a[i], i);
	return out;
}

/**
 * a.map(f) for numbers, from an allocation site of its own: once the first plan has put a fraction
 * through it, every list it makes holds unboxed doubles, whole numbers included.
 */
export function mapNumbers<T>(a: readonly T[], f: (x: T, i: number) => number): number[] {
	const out = new Array<number>(a.length);
	for (let i = 0; i < a.length; i++) out[i] = f(a[i], i);
	return out;
}

/** a.filter(ok), built by push from a literal of its own, for the same reason as mapList. */
export function filterList<T, S extends T>(a: readonly T[], ok: (x: T) => x is S): S[];
export function filterList<T>(a: readonly T[], ok: (x: T) => boolean): T[];
export function filterList<T>(a: readonly T[], ok: (x: T) => boolean): T[] {
	const out: T[] = [];
	for (let i = 0; i < a.length; i++) if (ok(a[i])) out.push(a[i]);
	return out;
}
