// Small helpers for hot paths (Array.from on an array-like is slow in V8).

/** [f(0), f(1), … f(n − 1)]. */
export function times<T>(n: number, f: (i: number) => T): T[] {
	const out: T[] = [];
	for (let i = 0; i < n; i++) out.push(f(i));
	return out;
}
