// Control (contraction) joints per ACI 302.1R, laid out on a grid in the high-edge frame so the
// layout turns with the slab, and through re-entrant corners where cracks start.

import type { Layout } from './geometry';
import type { Model } from './model';
import { clipVertical, isReflex, pointInPolygonXY, signedArea, sortNumbers, toFrame } from './polygon';
import type { Frame, Pt } from './polygon';
import { M_PER_FT, M_PER_IN, countUp, length, mToPlan, small } from './units';
import { mapList, mapNumbers } from './util';
import type { Length, Small } from './units';

/** ACI 302.1R, unreinforced slabs on ground. */
export const ACI_302 = {
	minFactor: 24,
	maxFactor: 36,
	maxSpacing: 18 * M_PER_FT,
	maxAspect: 1.5,
	depthFraction: 0.25,
	minDepth: 1 * M_PER_IN
} as const;

export function jointSpacing(thickness: number): { min: number; max: number } {
	return {
		min: ACI_302.minFactor * thickness,
		max: Math.min(ACI_302.maxFactor * thickness, ACI_302.maxSpacing)
	};
}

export const jointDepth = (thickness: number) => Math.max(ACI_302.depthFraction * thickness, ACI_302.minDepth);

/** Interval ends from lo to hi through the given cut values, dropping cuts that would leave slivers. */
export function breakpoints(cuts: number[], lo: number, hi: number, minGap: number): number[] {
	const out: number[] = [];
	out.push(lo);
	for (const c of sortNumbers([...cuts])) if (c - out[out.length - 1] >= minGap && hi - c >= minGap) out.push(c);
	out.push(hi);
	return out;
}

/** Grid coordinates: each interval between breakpoints split into its count of equal parts. */
export function gridLines(bps: number[], counts: number[]): number[] {
	const out: number[] = [];
	out.push(bps[0]);
	for (let i = 0; i + 1 < bps.length; i++) for (let k = 1; k <= counts[i]; k++) out.push(bps[i] + ((bps[i + 1] - bps[i]) * k) / counts[i]);
	return out;
}

interface Grid {
	us: number[];
	ws: number[];
	panels: number;
	maxAspect: number;
}

/** Which breakpoint interval a grid cell [a, b] falls in. */
const parentOf = (bps: number[], mid: number) => {
	let i = 0;
	while (i + 2 < bps.length && mid > bps[i + 1]) i++;
	return i;
};

/**
 * A re-entrant corner worth a joint: the outline turns back by more than 30°. Gentle bends of a
 * curved edge are left alone (an engine choice, not a trade rule).
 */
function isReentrant(poly: readonly Pt[], i: number, orient: number): boolean {
	const n = poly.length;
	if (!isReflex(poly, i, orient)) return false;
	const a = poly[(i + n - 1) % n];
	const b = poly[i];
	const c = poly[(i + 1) % n];
	const ux = b[0] - a[0],
		uy = b[1] - a[1],
		vx = c[0] - b[0],
		vy = c[1] - b[1];
	const cos = (ux * vx + uy * vy) / Math.sqrt((ux * ux + uy * uy) * (vx * vx + vy * vy));
	return cos < Math.cos(Math.PI / 6);
}

/** How many panels no longer than max each gap between breakpoints takes (at least one). */
function panelCounts(b: readonly number[], max: number): number[] {
	const out: number[] = [];
	for (let i = 1; i < b.length; i++) out.push(Math.max(1, countUp((b[i] - b[i - 1]) / max)));
	return out;
}

/** Panels no longer than max and no more elongated than ACI's 1.5, refining the longer side. */
export function panelGrid(poly: readonly Pt[], max: number, min: number, eps: number): Grid {
	let [uMin, uMax, wMin, wMax] = [Infinity, -Infinity, Infinity, -Infinity];
	for (const p of poly) {
		uMin = Math.min(uMin, p[0]);
		uMax = Math.max(uMax, p[0]);
		wMin = Math.min(wMin, p[1]);
		wMax = Math.max(wMax, p[1]);
	}
	const orient = Math.sign(signedArea(poly));
	const reflex: Pt[] = [];
	for (let i = 0; i < poly.length; i++) if (isReentrant(poly, i, orient)) reflex.push(poly[i]);
	const bu = breakpoints(
		mapNumbers(reflex, (p) => p[0]),
		uMin,
		uMax,
		min / 3
	);
	const bw = breakpoints(
		mapNumbers(reflex, (p) => p[1]),
		wMin,
		wMax,
		min / 3
	);
	const cu = panelCounts(bu, max);
	const cw = panelCounts(bw, max);
	let grid: Grid = { us: [], ws: [], panels: 0, maxAspect: 1 };
	for (let pass = 0; pass < 30; pass++) {
		const gu = gridLines(bu, cu);
		const gw = gridLines(bw, cw);
		grid = { us: gu, ws: gw, panels: 0, maxAspect: 1 };
		const bumpU = new Set<number>();
		const bumpW = new Set<number>();
		for (let i = 0; i + 1 < gu.length; i++)
			for (let j = 0; j + 1 < gw.length; j++) {
				const a = gu[i + 1] - gu[i];
				const b = gw[j + 1] - gw[j];
				const midU = (gu[i] + gu[i + 1]) / 2;
				const midW = (gw[j] + gw[j + 1]) / 2;
				if (pointInPolygonXY(midU, midW, poly, eps) !== 'inside') continue;
				grid.panels++;
				const aspect = Math.max(a, b) / Math.min(a, b);
				grid.maxAspect = Math.max(grid.maxAspect, aspect);
				if (aspect <= ACI_302.maxAspect + 1e-9) continue;
				if (a > b) bumpU.add(parentOf(bu, midU));
				else bumpW.add(parentOf(bw, midW));
			}
		if (!bumpU.size && !bumpW.size) break;
		if ((gu.length - 1) * (gw.length - 1) > 4000) break; // a huge slab: keep the first answer
		bumpU.forEach((i) => cu[i]++);
		bumpW.forEach((i) => cw[i]++);
	}
	return grid;
}

export interface JointLine {
	from: Pt;
	to: Pt;
	length: Length;
	/** 'along': parallel to the high edge; 'across': at right angles to it. */
	direction: 'along' | 'across';
}

export interface SectionJoints {
	index: number;
	panels: number;
	maxAspect: number;
	/** Largest panel size along and across the high edge. */
	panelSize: { along: Length; across: Length };
	lines: JointLine[];
}

export interface JointsResult {
	maxSpacing: Length;
	minSpacing: Length;
	depth: Small;
	method: 'tool' | 'saw';
	totalLength: Length;
	sections: SectionJoints[];
}

/** Internal grid per section in frame coordinates, for the mixing split. */
export interface SectionGrid {
	poly: Pt[];
	us: number[];
	ws: number[];
	panels?: number;
	maxAspect?: number;
}

const maxGap = (v: number[]) => v.slice(1).reduce((m, x, i) => Math.max(m, x - v[i]), 0);

/** A section's grid laid with a closer maximum spacing (for a pour split); the sliver limit follows it. */
export function closerGrid(poly: Pt[], maxSpacing: number, thickness: number, eps: number): SectionGrid {
	const { min, max } = jointSpacing(thickness);
	const g = panelGrid(poly, Math.min(max, maxSpacing), Math.min(min, maxSpacing), eps);
	return { poly, us: g.us, ws: g.ws, panels: g.panels, maxAspect: g.maxAspect };
}

/** Each section's joint grid (ACI 302.1R spacing for the slab), before any pour split re-lays one. */
export function sectionGrids(m: Model, layout: Layout, framed: Pt[][]): Required<SectionGrid>[] {
	const { min, max } = jointSpacing(m.thickness);
	return mapList(layout.sections, (s) => {
		const poly = framed[s.index];
		const g = panelGrid(poly, max, min, layout.eps);
		return { poly, us: g.us, ws: g.ws, panels: g.panels, maxAspect: g.maxAspect };
	});
}

export interface JointOptions {
	/** Lines that are cold joints (bulkheads) instead of control joints, per section. */
	coldCuts?: Map<number, { alongW: boolean; at: number[] }>;
	/** Grids already laid (a first pass, or joints re-laid closer for a pour split), reused as they are. */
	prior?: Required<SectionGrid>[];
}

/** framed: the outlines already in the frame (slopePlane works them out); computed here if absent. */
export function computeJoints(
	m: Model,
	layout: Layout,
	frame: Frame,
	framed?: Pt[][],
	opts: JointOptions = {}
): { joints: JointsResult; grids: SectionGrid[] } {
	const { min, max } = jointSpacing(m.thickness);
	let total = 0;
	const grids: SectionGrid[] = [];
	const sections = mapList(layout.sections, (s): SectionJoints => {
		const poly = framed?.[s.index] ?? mapList(s.outline, (p) => toFrame(frame, p));
		const g = opts.prior?.[s.index] ?? panelGrid(poly, max, min, layout.eps);
		grids.push({ poly, us: g.us, ws: g.ws, panels: g.panels, maxAspect: g.maxAspect });
		const cold = opts.coldCuts?.get(s.index);
		const isCold = (v: number, alongW: boolean) => !!cold && cold.alongW === alongW && cold.at.some((c) => Math.abs(c - v) <= layout.eps);
		const lines: JointLine[] = [];
		// A joint from (u0, w0) to (u1, w1) in the frame; fromFrame written out, so the frame
		// points need no arrays of their own.
		const { origin: o, t, n } = frame;
		const push = (u0: number, w0: number, u1: number, w1: number, direction: JointLine['direction']) => {
			const from: Pt = [mToPlan(o[0] + t[0] * u0 + n[0] * w0, m.units), mToPlan(o[1] + t[1] * u0 + n[1] * w0, m.units)];
			const to: Pt = [mToPlan(o[0] + t[0] * u1 + n[0] * w1, m.units), mToPlan(o[1] + t[1] * u1 + n[1] * w1, m.units)];
			const len = Math.hypot(u1 - u0, w1 - w0);
			total += len;
			lines.push({ from, to, length: length(len), direction });
		};
		for (let i = 1; i + 1 < g.us.length; i++) {
			const u = g.us[i];
			if (!isCold(u, false)) for (const [w0, w1] of clipVertical(poly, u, layout.eps)) push(u, w0, u, w1, 'across');
		}
		const swapped = mapList(poly, (p): Pt => [p[1], p[0]]);
		for (let i = 1; i + 1 < g.ws.length; i++) {
			const w = g.ws[i];
			if (!isCold(w, true)) for (const [u0, u1] of clipVertical(swapped, w, layout.eps)) push(u0, w, u1, w, 'along');
		}
		return {
			index: s.index,
			panels: g.panels,
			maxAspect: g.maxAspect,
			panelSize: { along: length(maxGap(g.us)), across: length(maxGap(g.ws)) },
			lines
		};
	});
	return {
		grids,
		joints: {
			maxSpacing: length(max),
			minSpacing: length(min),
			depth: small(jointDepth(m.thickness)),
			method: m.jointMethod,
			totalLength: length(total),
			sections
		}
	};
}
