// Shared set-up for the engine's specs: parse an input and build the pieces a module needs.

import { layoutSections } from './geometry';
import { toModel } from './model';
import type { Pt } from './polygon';
import { parsePlanInput, type PlanInput } from './schema';

export const rect = (x0: number, y0: number, w: number, h: number): [number, number][] => [
	[x0, y0],
	[x0 + w, y0],
	[x0 + w, y0 + h],
	[x0, y0 + h]
];

/** L-shape: a 24 × 18 rectangle less an 8 × 6 notch at the origin (a house corner). */
export const ELL: [number, number][] = [[8, 0], [24, 0], [24, 18], [0, 18], [0, 6], [8, 6]];

export function modelOf(input: PlanInput) {
	const r = parsePlanInput(input);
	if (!r.ok) throw new Error(JSON.stringify(r.errors));
	const m = toModel(r.plan);
	return { m, layout: layoutSections(m.sections.map((s) => s.outline as Pt[])) };
}
