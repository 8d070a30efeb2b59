// The finished surface as a tilted plane: elevations of vertices and stakes relative to the
// reference, and the "below the level line" table marked on the stakes with a line level.

import type { Layout } from './geometry';
import type { StakePoint } from './lumber';
import type { Model } from './model';
import { dist, sub, toFrame, type Frame, type Pt } from './polygon';
import { M_PER_FT, mToPlan, small, type Small } from './units';

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
	const pts = layout.sections.flatMap((s) => s.outline.map((p) => toFrame(frame, p)));
	const us = pts.map((p) => p[0]);
	const ws = pts.map((p) => p[1]);
	const spread = (v: number[]) => Math.max(...v) - Math.min(...v);
	const fall = 'ratio' in m.fall ? m.fall.ratio : m.fall.drop / spread(ws);
	const cross = 'ratio' in m.crossFall ? m.crossFall.ratio : m.crossFall.drop / spread(us);
	const minDrop = Math.min(...pts.map(([u, w]) => fall * w + cross * u));
	return { frame, fall, cross, minDrop, high: -m.reference.below };
}

/** Finished-surface height at a point relative to the reference. */
export function elevationAt(plane: Plane, p: Pt): number {
	const [u, w] = toFrame(plane.frame, p);
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
	const u = m.units;
	const xy = (p: Pt) => ({ x: mToPlan(p[0], u), y: mToPlan(p[1], u) });
	const vertices = layout.sections.flatMap((s) =>
		s.outline.map((p, i) => ({ section: s.index, vertex: i, ...xy(p), elevation: small(elevationAt(plane, p)) }))
	);
	const zs = stakes.map((s) => elevationAt(plane, s.at));
	const hi = zs.reduce((best, z, i) => (z > zs[best] + 1e-9 ? i : best), 0);
	const low = Math.min(...layout.sections.flatMap((s) => s.outline.map((p) => elevationAt(plane, p))));
	const withinTenFeet = m.gapToHouse < IRC_R401_3.within;
	return {
		reference: { label: m.reference.label, below: small(m.reference.below) },
		fall: slopeRate(plane.fall),
		crossFall: slopeRate(plane.cross),
		steepest: slopeRate(Math.hypot(plane.fall, plane.cross)),
		totalDrop: small(plane.high - low),
		vertices,
		stakes: stakes.map((s, i) => ({
			id: s.id,
			run: s.run,
			...xy(s.at),
			elevation: small(zs[i]),
			belowLevelLine: small(zs[hi] - zs[i])
		})),
		highStake: stakes.length ? stakes[hi].id : null,
		houseEdges: m.houseEdges.map((h) => {
			const away = fallAwayFrom(plane, layout, h.section, h.edge);
			return {
				...h,
				fallAway: slopeRate(away),
				withinTenFeet,
				meetsIrc: !withinTenFeet || away >= IRC_R401_3.minFall - 1e-12
			};
		})
	};
}
