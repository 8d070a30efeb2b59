// Concrete and base volumes: slab, thickened-edge trenches, chunk fill, waste.

import { PlanInputError, type Layout, type SectionShape } from './geometry';
import type { Model } from './model';
import { cross } from './polygon';
import { KG_PER_LB, area, countUp, small, volume } from './units';
import { mapList, mapNumbers } from './util';
import type { Area, Small, Volume } from './units';

/** Which edges of each section get a thickened edge. */
export function thickenedEdges(m: Model, layout: Layout): boolean[][] {
	const spec = m.thickened.edges;
	const house = (s: number, e: number) => m.houseEdges.some((h) => h.section === s && h.edge === e);
	return mapList(layout.sections, (sec) =>
		mapList(sec.edges, (e) => {
			if (spec === 'none') return false;
			if (spec === 'free') return e.shared.length === 0 && !house(sec.index, e.index);
			return spec.some((r) => r.section === sec.index && r.edge === e.index);
		})
	);
}

/** Interior angle at vertex i, radians (π for a straight run). */
export function interiorAngle(sec: SectionShape, i: number): number {
	const o = sec.outline;
	const n = o.length;
	const a = o[(i + n - 1) % n];
	const b = o[i];
	const c = o[(i + 1) % n];
	// dot(sub(b, a), sub(c, b)) written out: no temporary arrays, same arithmetic.
	const turn = Math.atan2(cross(a, b, c), (b[0] - a[0]) * (c[0] - b[0]) + (b[1] - a[1]) * (c[1] - b[1]));
	return Math.PI - sec.orientation * turn;
}

/**
 * Plan area of the trenches: each thickened edge is a strip of the given width, mitred where it
 * meets another thickened edge (so corners count once) and square-ended elsewhere.
 */
export function trenchArea(sec: SectionShape, thick: readonly boolean[], width: number): number {
	const n = sec.edges.length;
	const miter = (v: number) => width ** 2 / 2 / Math.tan(interiorAngle(sec, v) / 2);
	let total = 0;
	for (let i = 0; i < n; i++) {
		if (!thick[i]) continue;
		const start = thick[(i + n - 1) % n] ? miter(i) : 0;
		const end = thick[(i + 1) % n] ? miter((i + 1) % n) : 0;
		total += Math.max(0, sec.edges[i].length * width - start - end);
	}
	return total;
}

/**
 * Trench concrete below the slab. Rectangular: plan area × depth. Tapered (full depth at the form,
 * a straight slope up to the slab underside at the trench width): the profile's area w·d/2 along each
 * edge, less at each mitred corner the profile's first moment about the outer face, d·w²/6, over
 * tan(θ/2) — as the rectangle's d·w²/2 over tan(θ/2) gives the mitred ring area (geometry).
 */
export function trenchVolume(sec: SectionShape, thick: readonly boolean[], width: number, depth: number, profile: 'rectangular' | 'tapered'): number {
	if (profile === 'rectangular') return trenchArea(sec, thick, width) * depth;
	const n = sec.edges.length;
	const miter = (v: number) => (depth * width ** 2) / 6 / Math.tan(interiorAngle(sec, v) / 2);
	let total = 0;
	for (let i = 0; i < n; i++) {
		if (!thick[i]) continue;
		const start = thick[(i + n - 1) % n] ? miter(i) : 0;
		const end = thick[(i + 1) % n] ? miter((i + 1) % n) : 0;
		total += Math.max(0, (sec.edges[i].length * width * depth) / 2 - start - end);
	}
	return total;
}

export interface SectionVolume {
	index: number;
	slab: Volume;
	thickenedEdges: Volume;
	fill: Volume;
	net: Volume;
	order: Volume;
}

export interface VolumeResult {
	slab: Volume;
	thickenedEdges: Volume;
	fill: Volume;
	net: Volume;
	waste: Volume;
	order: Volume;
	wastePercent: number;
	trenchArea: Area;
	sections: SectionVolume[];
	base: {
		depth: Small;
		bulking: number;
		/** Plan area under base: the slab less its thickened-edge trenches, plus the strip past the forms. */
		area: Area;
		overhang: Small;
		compacted: Volume;
		loose: Volume;
		/** Compacted volume × the stone density, short tons and tonnes. */
		weight: { shortTons: number; tonnes: number };
		note: string;
	};
	/** Soil dug out, taking the finished surface at today's grade. */
	dig: { volume: Volume; weight: { shortTons: number; tonnes: number }; loads: number; note: string };
}

/** Chunk fill per section, spread in proportion to each section's trench volume. */
function fillPerSection(m: Model, trench: number[]): number[] {
	const total = trench.reduce((a, b) => a + b, 0);
	if (!m.fill) return mapNumbers(trench, () => 0);
	if (total <= 0) throw new PlanInputError([{ path: 'fill', message: 'Chunk fill goes in a thickened-edge trench, and this plan has none.' }]);
	const share = m.fill.share ?? (m.fill.volume ?? 0) / total;
	if (share > 0.9) throw new PlanInputError([{ path: 'fill.volume', message: 'More fill than 90 % of the trench volume leaves no concrete around it.' }]);
	return mapNumbers(trench, (t) => t * share);
}

const tons = (kg: number) => ({ shortTons: kg / KG_PER_LB / 2000, tonnes: kg / 1000 });

export function computeVolume(m: Model, layout: Layout, thick: boolean[][]): VolumeResult {
	const trenchA = mapNumbers(layout.sections, (s, i) => trenchArea(s, thick[i], m.thickened.width));
	const trenchV = mapNumbers(layout.sections, (s, i) => trenchVolume(s, thick[i], m.thickened.width, m.thickened.extraDepth, m.thickened.profile));
	const fill = fillPerSection(m, trenchV);
	const k = 1 + m.wastePercent / 100;
	const sections = mapList(layout.sections, (s, i): SectionVolume => {
		const net = s.area * m.thickness + trenchV[i] - fill[i];
		return {
			index: i,
			slab: volume(s.area * m.thickness),
			thickenedEdges: volume(trenchV[i]),
			fill: volume(fill[i]),
			net: volume(net),
			order: volume(net * k)
		};
	});
	const sum = (f: (s: SectionVolume) => Volume) => sections.reduce((a, s) => a + f(s).cubicMeters, 0);
	const net = sum((s) => s.net);
	const slabArea = layout.sections.reduce((a, s) => a + s.area, 0);
	const trenchTotal = trenchA.reduce((a, b) => a + b, 0);
	// The base runs past the forms on outer edges that are neither thickened nor along the house.
	const house = (s: number, e: number) => m.houseEdges.some((h) => h.section === s && h.edge === e);
	let outerRun = 0;
	for (const sec of layout.sections)
		for (const e of sec.edges) if (!thick[sec.index][e.index] && !house(sec.index, e.index)) for (const [t0, t1] of e.free) outerRun += (t1 - t0) * e.length;
	const overhangArea = m.base.depth > 0 ? outerRun * m.base.overhang : 0;
	const baseArea = m.base.depth > 0 ? slabArea - trenchTotal + overhangArea : 0;
	const compacted = baseArea * m.base.depth;
	const trenchConcrete = trenchV.reduce((a, b) => a + b, 0);
	// Down to the base bottom under the slab and the strip past the forms, and the trench below the slab.
	const digM3 = (slabArea + overhangArea) * m.thickness + compacted + trenchConcrete;
	const digKg = digM3 * m.base.soilDensity;
	return {
		slab: volume(sum((s) => s.slab)),
		thickenedEdges: volume(sum((s) => s.thickenedEdges)),
		fill: volume(sum((s) => s.fill)),
		net: volume(net),
		waste: volume(net * (k - 1)),
		order: volume(net * k),
		wastePercent: m.wastePercent,
		trenchArea: area(trenchA.reduce((a, b) => a + b, 0)),
		sections,
		base: {
			depth: small(m.base.depth),
			bulking: m.base.bulking,
			area: area(baseArea),
			overhang: small(m.base.overhang),
			compacted: volume(compacted),
			loose: volume(compacted * m.base.bulking),
			weight: tons(compacted * m.base.stoneDensity),
			note:
				trenchTotal > 0
					? 'No base under the thickened edges: they bear on firm undisturbed soil at the trench bottom (common practice, no published source); the base runs past the other forms.'
					: 'The base runs past the forms so their stakes and the slab edge sit on it (common practice, no published source).'
		},
		dig: {
			volume: volume(digM3),
			weight: tons(digKg),
			loads: countUp(digKg / m.crew.payloadKg),
			note: "Taking the finished surface at today's grade; soil swells when dug, so the heap is larger than the hole (common practice)." // from memory
		}
	};
}
