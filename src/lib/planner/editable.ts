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

/**
 * What was typed, in the shape of `template`: every key the template has is present, taking the
 * typed value where it is of the same kind (an emptied number field counts as a number), and keys
 * only the typed data has are kept. Arrays take the typed items, each shaped by the template's
 * item at that place (or its last). So a kept draft the engine refuses (a value out of range)
 * opens as it was typed, while a stale or damaged one cannot leave a field without its value.
 */
export function overlay<T>(template: T, typed: unknown): T {
	if (template === undefined) return editableCopy(typed) as T;
	if (Array.isArray(template)) {
		if (!Array.isArray(typed)) return editableCopy(template);
		if (!template.length) return editableCopy(typed) as T;
		return typed.map((x, i) => overlay(template[Math.min(i, template.length - 1)], x)) as T;
	}
	if (template !== null && typeof template === 'object') {
		if (typed === null || typeof typed !== 'object' || Array.isArray(typed)) return editableCopy(template);
		const out: Record<string, unknown> = editableCopy(typed as Record<string, unknown>);
		for (const [k, t] of Object.entries(template)) out[k] = overlay(t, (typed as Record<string, unknown>)[k]);
		return out as T;
	}
	if (typeof typed === typeof template || (typed === null && typeof template === 'number')) return typed as T;
	return template;
}
