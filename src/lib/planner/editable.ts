/**
 * A deep copy of plain plan data that shares nothing and is frozen nowhere. The engine's parsed
 * defaults are frozen, shared objects; state the wizard edits must never be one of them, or the
 * first keystroke into such a field throws instead of changing the plan.
 */
export function editableCopy<T>(v: T): T {
	if (Array.isArray(v)) return v.map(editableCopy) as T;
	if (v !== null && typeof v === 'object') {
		const out: Record<string, unknown> = {};
		for (const [k, x] of Object.entries(v)) out[k] = editableCopy(x);
		return out as T;
	}
	return v;
}

/** Structural equality of plain data (keys whose value is undefined count as absent). */
export function sameData(a: unknown, b: unknown): boolean {
	if (a === b) return true;
	if (Array.isArray(a) || Array.isArray(b)) {
		if (!Array.isArray(a) || !Array.isArray(b) || a.length !== b.length) return false;
		return a.every((x, i) => sameData(x, b[i]));
	}
	if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return false;
	const keys = (o: object) =>
		Object.entries(o)
			.filter(([, x]) => x !== undefined)
			.map(([k]) => k);
	const ka = keys(a);
	if (ka.length !== keys(b).length) return false;
	return ka.every((k) => sameData((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
}
