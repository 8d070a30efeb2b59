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

// Lists the engine hands from one step to the next are built by push, not Array.prototype.map.
// V8 gives map's answer a different elements kind in optimised code (holey, and doubles where the
// interpreter keeps small integers) than in the interpreter, so every function that reads such a
// list is deoptimised ("wrong map") each time the function that builds it is optimised: waves of
// deopts for seconds after start-up, which is what made the bench's median vary between runs. A
// list built by push from `[]` takes its kind from that literal's allocation site, the same in
// every tier.

/** a.map(f), built by push: one elements kind whatever the tier (objects, points, lists). */
export function mapList<T, U>(a: readonly T[], f: (x: T, i: number) => U): U[] {
	const out: U[] = [];
	for (let i = 0; i < a.length; i++) out.push(f(a[i], i));
	return out;
}

/**
 * a.map(f) for numbers, built by push from an allocation site of its own: once the first plan has
 * put a fraction through it, every list it makes holds unboxed doubles, whole numbers included.
 */
export function mapNumbers<T>(a: readonly T[], f: (x: T, i: number) => number): number[] {
	const out: number[] = [];
	for (let i = 0; i < a.length; i++) out.push(f(a[i], i));
	return out;
}
