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
