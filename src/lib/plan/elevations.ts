// The finished surface as a tilted plane: elevations of vertices and stakes relative to the
// reference, and the "below the level line" table marked on the stakes with a line level.

import type { Layout } from './geometry';
import type { StakePoint } from './lumber';
import type { Model } from './model';
import { dist, sub, toFrame } from './polygon';
import type { Frame, Pt } from './polygon';
import { M_PER_FT, small } from './units';
import { mapList, mapNumbers } from './util';
import type { Small } from './units';

/** IRC R401.3: impervious surfaces within 10 ft of the foundation fall ≥ 2 % away from it. */
export const IRC_R401_3 = { minFall: 0.02, within: 10 * M_PER_FT } as const;
/** ⅛ in/ft, the usual minimum for patios (common practice); ACI 302.1R asks ¼ in/ft. */
export const MIN_FALL = 0.125 / 12;
/** Steeper than 1:20 reads as a ramp underfoot; from memory (ADA 2010 §403.3 running slope). */
export const MAX_COMFORTABLE_FALL = 1 / 20;

export interface SlopeRate {
	percent: number;
	inchesPerFoot: number;
	millimetersPerMeter: number;
}
export const slopeRate = (ratio: number): SlopeRate => ({
	percent: ratio * 100,
	inchesPerFoot: ratio * 12,
	millimetersPerMeter: ratio * 1000
});

/** The surface plane in the high-edge frame: drop(p) = fall·w + cross·u, least at the high vertex. */
export interface Plane {
	frame: Frame;
	fall: number;
	cross: number;
	/** Smallest drop over the vertices: the high point. */
	minDrop: number;
	/** Height of the slab's high point relative to the reference (negative: below it). */
	high: number;
	/** Each section's outline in the frame, worked out here once and reused for the joint grid. */
	framed: Pt[][];
}

/** The frame of an edge: u along it, w into the section. */
export function edgeFrame(layout: Layout, section: number, edge: number): Frame {
	const sec = layout.sections[section];
	const e = sec.edges[edge];
	const d = sub(e.to, e.from);
	const len = dist(e.to, e.from);
	const t: Pt = [d[0] / len, d[1] / len];
	const n: Pt = sec.orientation > 0 ? [-t[1], t[0]] : [t[1], -t[0]];
	return { origin: e.from, t, n };
}

export function slopePlane(m: Model, layout: Layout): Plane {
	const frame = edgeFrame(layout, m.highEdge.section, m.highEdge.edge);
	const framed = mapList(layout.sections, (s) => mapList(s.outline, (p) => toFrame(frame, p)));
	let [uMin, uMax, wMin, wMax] = [Infinity, -Infinity, Infinity, -Infinity];
	for (const poly of framed)
		for (const p of poly) {
			uMin = Math.min(uMin, p[0]);
			uMax = Math.max(uMax, p[0]);
			wMin = Math.min(wMin, p[1]);
			wMax = Math.max(wMax, p[1]);
		}
	const fall = 'ratio' in m.fall ? m.fall.ratio : m.fall.drop / (wMax - wMin);
	const cross = 'ratio' in m.crossFall ? m.crossFall.ratio : m.crossFall.drop / (uMax - uMin);
	let minDrop = Infinity;
	for (const poly of framed) for (const p of poly) minDrop = Math.min(minDrop, fall * p[1] + cross * p[0]);
	return { frame, fall, cross, minDrop, high: -m.reference.below, framed };
}

/** Finished-surface height at a point relative to the reference. */
export function elevationAt(plane: Plane, p: Pt): number {
	const { origin, t, n } = plane.frame;
	const dx = p[0] - origin[0];
	const dy = p[1] - origin[1];
	const u = dx * t[0] + dy * t[1];
	const w = dx * n[0] + dy * n[1];
	return plane.high - (plane.fall * w + plane.cross * u - plane.minDrop);
}

/** Fall away from one house edge (negative: toward the wall). */
export function fallAwayFrom(plane: Plane, layout: Layout, section: number, edge: number): number {
	const { n } = edgeFrame(layout, section, edge);
	const { t, n: n0 } = plane.frame;
	return plane.fall * (n0[0] * n[0] + n0[1] * n[1]) + plane.cross * (t[0] * n[0] + t[1] * n[1]);
}

export interface ElevationResult {
	reference: { label: string; below: Small };
	fall: SlopeRate;
	crossFall: SlopeRate;
	steepest: SlopeRate;
	/** High point to low point of the finished surface. */
	totalDrop: Small;
	vertices: { section: number; vertex: number; x: number; y: number; elevation: Small }[];
	stakes: { id: string; run: string; x: number; y: number; elevation: Small; belowLevelLine: Small }[];
	highStake: string | null;
	houseEdges: { section: number; edge: number; fallAway: SlopeRate; withinTenFeet: boolean; meetsIrc: boolean }[];
}

export function computeElevations(m: Model, layout: Layout, plane: Plane, stakes: StakePoint[]): ElevationResult {
	const k = m.units === 'imperial' ? 1 / M_PER_FT : 1;
	let low = Infinity;
	const vertices: ElevationResult['vertices'] = [];
	for (const s of layout.sections)
		s.outline.forEach((p, i) => {
			const z = elevationAt(plane, p);
			low = Math.min(low, z);
			vertices.push({ section: s.index, vertex: i, x: p[0] * k, y: p[1] * k, elevation: small(z) });
		});
	const zs = mapNumbers(stakes, (s) => elevationAt(plane, s.at));
	const hi = zs.reduce((best, z, i) => (z > zs[best] + 1e-9 ? i : best), 0);
	const withinTenFeet = m.gapToHouse < IRC_R401_3.within;
	return {
		reference: { label: m.reference.label, below: small(m.reference.below) },
		fall: slopeRate(plane.fall),
		crossFall: slopeRate(plane.cross),
		steepest: slopeRate(Math.hypot(plane.fall, plane.cross)),
		totalDrop: small(plane.high - low),
		vertices,
		stakes: mapList(stakes, (s, i) => ({
			id: s.id,
			run: s.run,
			x: s.at[0] * k,
			y: s.at[1] * k,
			elevation: small(zs[i]),
			belowLevelLine: small(zs[hi] - zs[i])
		})),
		highStake: stakes.length ? stakes[hi].id : null,
		houseEdges: mapList(m.houseEdges, (h) => {
			const away = fallAwayFrom(plane, layout, h.section, h.edge);
			return {
				section: h.section,
				edge: h.edge,
				fallAway: slopeRate(away),
				withinTenFeet,
				meetsIrc: !withinTenFeet || away >= IRC_R401_3.minFall - 1e-12
			};
		})
	};
}
