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

/** A 12 × 10 ft patio: a valid plan the engine computes quickly, for specs and journeys about something else. */
export const smallPatio = (): PlanInput => ({ units: 'imperial', sections: [{ outline: rect(0, 0, 12, 10) }] });

/** L-shape: a 24 × 18 rectangle less an 8 × 6 notch at the origin (a house corner). */
export const ELL: [number, number][] = [
	[8, 0],
	[24, 0],
	[24, 18],
	[0, 18],
	[0, 6],
	[8, 6]
];

/** ELL wrapped around a house corner: both inner edges are walls, 2 % fall and 2 % cross fall. */
export const cornerEll: PlanInput = {
	units: 'imperial',
	sections: [{ outline: ELL }],
	houseEdge: { section: 0, edge: 4 },
	otherHouseEdges: [{ section: 0, edge: 5 }],
	slope: { fall: { value: 2, unit: 'percent' }, crossFall: { value: 2, unit: 'percent' } }
};

/**
 * A 6 × 6 ft pad at 70 °F: more bags than the default crew places before the mix stiffens, so the
 * engine splits the section with bulkheads that lie on no edge of the outline (edge −1).
 */
export const splitSquare: PlanInput = { units: 'imperial', sections: [{ outline: rect(0, 0, 6, 6) }], conditions: { airTemp: 70 } };

export function modelOf(input: PlanInput) {
	const r = parsePlanInput(input);
	if (!r.ok) throw new Error(JSON.stringify(r.errors));
	const m = toModel(r.plan);
	return { m, layout: layoutSections(m.sections.map((s) => s.outline as Pt[])) };
}

/** The benchmark's plan: a 40 × 20 ft pad with a wavy back edge, 5 points along the front, 45 along the back. */
export function wavyPad(): PlanInput {
	const top = (x: number): Pt => [x, 20 + Math.sin((x / 40) * Math.PI * 3) * 1.5];
	const sections = [0, 1, 2, 3].map((k) => {
		const x0 = k * 10;
		const back = Array.from({ length: 12 }, (_, i) => top(x0 + 10 - (i * 10) / 11));
		return { outline: [[x0, 0] as Pt, [x0 + 10, 0] as Pt, ...back].map(([x, y]) => [x, y] as [number, number]) };
	});
	return {
		units: 'imperial',
		sections,
		houseEdge: null,
		slope: { fall: { value: 1.5, unit: 'percent' }, crossFall: { value: 0.5, unit: 'percent' } },
		thickenedEdge: { edges: 'free' },
		fill: { shareOfTrench: 0.2, largestPiece: 3 },
		bags: {
			offered: [
				{ size: 80, price: 6.4 },
				{ size: 60, price: 5.1 }
			]
		},
		readyMix: { price: 185 },
		crew: { people: 3, method: 'drum' },
		conditions: { airTemp: [60, 55, 50, 58, 62, 65], humidity: 40, wind: 8, pourDate: '2027-06-01' }
	};
}

/**
 * The costliest plan inside the schema's limits (the bench times it): three 100-corner stars with
 * stakes every foot along 560 ft of zigzag outline, 2 in thick, the smallest bag, one person by hand.
 */
export function largestPlan(): PlanInput {
	const star = (cx: number): [number, number][] =>
		Array.from({ length: 100 }, (_, i) => {
			const a = (2 * Math.PI * i) / 100;
			const r = i % 2 ? 7.2 : 9;
			return [Math.round((cx + r * Math.cos(a)) * 1000) / 1000, Math.round(r * Math.sin(a) * 1000) / 1000];
		});
	return {
		units: 'imperial',
		name: 'Largest plan in scope',
		sections: [star(0), star(25), star(50)].map((outline) => ({ outline })),
		houseEdge: null,
		thickness: 2,
		forms: { stakeSpacing: 1 },
		thickenedEdge: { edges: 'free' },
		bags: { offered: [{ size: 10 }, { size: 20 }, { size: 40 }, { size: 60 }, { size: 80 }, { size: 100 }] },
		crew: { people: 1, method: 'hand', handMixMinutes: 30 },
		conditions: { airTemp: Array.from({ length: 60 }, (_, i) => 20 + i) }
	};
}
