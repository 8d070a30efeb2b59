// Random plans for the bound properties: inside LIMITS (any shape the schema accepts) and just
// outside one limit at a time. Shared by the engine's property spec and the estimate route's.

import fc from 'fast-check';
import type { PlanInput } from './schema';
import { LIMITS } from './schema';
import type { Units } from './units';

type P = [number, number];

/** A star-shaped outline around (cx, cy): corners sorted by angle never cross. */
const star = (n: number, cx: number, cy: number, r: number, radii: number[], turn: number): P[] =>
	Array.from({ length: n }, (_, i) => {
		const a = turn + (2 * Math.PI * i) / n;
		const k = r * radii[i % radii.length];
		return [Math.round((cx + k * Math.cos(a)) * 1000) / 1000, Math.round((cy + k * Math.sin(a)) * 1000) / 1000];
	});

const rect = (x: number, w: number, h: number): P[] => [
	[x, 0],
	[x + w, 0],
	[x + w, h],
	[x, h]
];

/** How big a section may be so that `count` of them stay inside the area, outline and stake limits. */
function sectionSize(units: Units, count: number, stakeSpacing: number) {
	const side = Math.sqrt(LIMITS.area[units] / count);
	const outline = Math.min(LIMITS.perimeter[units], LIMITS.stakes * stakeSpacing);
	return Math.min(side, outline / count / 4) * 0.95;
}

/** One plan inside every limit: 1–12 sections, each a rectangle or a star of up to the corner limit. */
export const planInside: fc.Arbitrary<PlanInput> = fc
	.record({
		units: fc.constantFrom<Units>('imperial', 'metric'),
		count: fc.integer({ min: 1, max: LIMITS.sections }),
		shape: fc.constantFrom('rect', 'star'),
		corners: fc.integer({ min: 3, max: LIMITS.verticesPerSection }),
		radii: fc.array(fc.double({ min: 0.6, max: 1, noNaN: true }), { minLength: 1, maxLength: 7 }),
		fill: fc.double({ min: 0.3, max: 1, noNaN: true }),
		thin: fc.double({ min: 0.05, max: 1, noNaN: true }),
		thickness: fc.double({ min: 0, max: 1, noNaN: true }),
		spacing: fc.double({ min: 0, max: 1, noNaN: true }),
		bag: fc.double({ min: 0, max: 1, noNaN: true }),
		method: fc.constantFrom<'hand' | 'drum'>('hand', 'drum'),
		people: fc.integer({ min: 1, max: 20 }),
		drum: fc.double({ min: 0, max: 1, noNaN: true }),
		working: fc.integer({ min: 10, max: 300 }),
		edges: fc.constantFrom<'none' | 'free'>('none', 'free'),
		days: fc.array(fc.integer({ min: -40, max: 54 }), { minLength: 1, maxLength: 60 }),
		house: fc.boolean()
	})
	.map((r): PlanInput => {
		const imp = r.units === 'imperial';
		const lerp = (lo: number, hi: number, t: number) => lo + (hi - lo) * t;
		const stakeSpacing = imp ? lerp(1, 8, r.spacing) : lerp(0.3, 2.5, r.spacing);
		// A star's outline is at most 2π r ≈ 3.2 × its width; a rectangle's 4 × its width.
		const size = sectionSize(r.units, r.count, stakeSpacing) * r.fill;
		// Thin sections keep the area down while the outline stays long.
		const [w, h] = [size, Math.max(size * r.thin, imp ? 1 : 0.3)];
		const corners = Math.min(r.corners, Math.floor(LIMITS.vertices / r.count));
		const drawn = Array.from({ length: r.count }, (_, k) =>
			r.shape === 'rect' || corners < 5 ? rect(k * w, w, h) : star(corners, k * w + w / 2, w / 2, w / 2, r.radii, k)
		);
		// A zigzag star's outline can be far longer than its width: shrink the plan to fit the outline limits.
		const outline = drawn.reduce((t, o) => t + o.reduce((u, p, i) => u + Math.hypot(o[(i + 1) % o.length][0] - p[0], o[(i + 1) % o.length][1] - p[1]), 0), 0);
		const fit = Math.min(1, (0.95 * Math.min(LIMITS.perimeter[r.units], LIMITS.stakes * stakeSpacing)) / outline);
		const sections = drawn.map((o) => ({ outline: o.map(([x, y]): P => [Math.round(x * fit * 1000) / 1000, Math.round(y * fit * 1000) / 1000]) }));
		return {
			units: r.units,
			sections,
			houseEdge: r.house ? { section: 0, edge: 0 } : null,
			thickness: imp ? lerp(2, 12, r.thickness) : lerp(50, 300, r.thickness),
			forms: { stakeSpacing },
			thickenedEdge: { edges: r.edges },
			bags: { offered: [{ size: imp ? lerp(10, 100, r.bag) : lerp(5, 50, r.bag) }] },
			crew: { method: r.method, people: r.people, workingMinutes: r.working, drumBatchMass: imp ? lerp(20, 500, r.drum) : lerp(10, 225, r.drum) },
			conditions: { airTemp: r.days.map((c) => (imp ? Math.round((c * 9) / 5 + 32) : c)) }
		} as PlanInput;
	});

/** A limit and a plan that breaks only it (by a random margin). */
export type Breach = { limit: string; needle: string; plan: unknown };

const over = fc.double({ min: 1.01, max: 20, noNaN: true });
const base = (units: Units) => ({ units, sections: [{ outline: rect(0, 10, 10) }] });

export const planOutside: fc.Arbitrary<Breach> = fc.oneof(
	fc.tuple(fc.constantFrom<Units>('imperial', 'metric'), over).map(([u, k]): Breach => {
		// A square over the area limit whose outline stays under the perimeter limit.
		const side = Math.min(Math.sqrt(LIMITS.area[u] * Math.min(k, 1.3)), (LIMITS.perimeter[u] / 4) * 0.99);
		return {
			limit: 'area',
			needle: `the limit is ${LIMITS.area[u].toLocaleString('en-US')}`,
			plan: { ...base(u), sections: [{ outline: rect(0, side, side) }] }
		};
	}),
	fc.tuple(fc.constantFrom<Units>('imperial', 'metric'), over).map(([u, k]): Breach => {
		// A strip 1 unit wide, longer than the outline limit allows.
		const len = Math.min((LIMITS.perimeter[u] / 2) * k, u === 'imperial' ? 1999 : 599);
		const width = u === 'imperial' ? 1 : 0.3;
		return {
			limit: 'perimeter',
			needle: `the limit is ${LIMITS.perimeter[u].toLocaleString('en-US')}`,
			plan: { ...base(u), sections: [{ outline: rect(-len / 2, len, width) }] }
		};
	}),
	fc.integer({ min: LIMITS.vertices / 4 + 1, max: LIMITS.verticesPerSection }).map((n): Breach => ({
		// Four stars, each under the per-section limit, together over the total.
		limit: 'vertices',
		needle: `the limit is ${LIMITS.vertices}`,
		plan: { units: 'imperial', sections: [0, 1, 2, 3].map((k) => ({ outline: star(n, k * 7, 0, 3, [1], 0) })) }
	})),
	fc.integer({ min: LIMITS.verticesPerSection + 1, max: 1000 }).map((n): Breach => ({
		limit: 'verticesPerSection',
		needle: `at most ${LIMITS.verticesPerSection} corners`,
		plan: { units: 'imperial', sections: [{ outline: star(n, 0, 0, 20, [1], 0) }] }
	})),
	fc.integer({ min: LIMITS.sections + 1, max: 60 }).map((n): Breach => ({
		limit: 'sections',
		needle: `at most ${LIMITS.sections} sections`,
		plan: { units: 'imperial', sections: Array.from({ length: n }, (_, k) => ({ outline: rect(k * 3, 3, 3) })) }
	})),
	fc.double({ min: 1, max: 1.5, noNaN: true }).map((spacing): Breach => {
		// Close stakes along a long thin strip: more than the limit, inside the outline limit.
		const len = (LIMITS.stakes * spacing * 1.05) / 2;
		return {
			limit: 'stakes',
			needle: `the limit is ${LIMITS.stakes}`,
			plan: { ...base('imperial'), sections: [{ outline: rect(0, len, 2) }], forms: { stakeSpacing: spacing } }
		};
	}),
	fc.tuple(fc.integer({ min: 10, max: 20 }), fc.double({ min: 6, max: 12, noNaN: true })).map(([size, t]): Breach => ({
		// Small bags on a slab near the area limit.
		limit: 'bags',
		needle: `the limit is ${LIMITS.bags.toLocaleString('en-US')}`,
		plan: { ...base('imperial'), sections: [{ outline: rect(0, 54, 54) }], thickness: t, bags: { offered: [{ size }] } }
	}))
);
