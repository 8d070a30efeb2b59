// Outline editing for the planner: pure functions on [x, y] vertex lists in plan units.
import { LIMITS } from '$lib/plan/limits';
import { signedArea } from '$lib/plan/polygon';

export type Pt = [number, number];

export const rectangle = (length: number, width: number): Pt[] => [
	[0, 0],
	[length, 0],
	[length, width],
	[0, width]
];

/**
 * An L: the full length along the house (edge 0), with a notch of notchLength × notchWidth cut
 * from the far corner — the shape that wraps around a house corner or a planting bed.
 */
export function lShape(length: number, width: number, notchLength: number, notchWidth: number): Pt[] {
	return [
		[0, 0],
		[length, 0],
		[length, width - notchWidth],
		[length - notchLength, width - notchWidth],
		[length - notchLength, width],
		[0, width]
	];
}

export const snap = (v: number, step: number) => Math.round(v / step) * step;
const round = (v: number) => Math.round(v * 1000) / 1000;

export function edgeLength(o: Pt[], i: number): number {
	const a = o[i];
	const b = o[(i + 1) % o.length];
	return Math.hypot(b[0] - a[0], b[1] - a[1]);
}

/**
 * Sets edge i's length by moving its end vertex along the edge's direction, together with the
 * run of corners after it that lie square across from it (the far side of a rectangle, or the
 * far side of an L's notch), so right angles stay right angles. A lone corner moves alone.
 */
export function setEdgeLength(o: Pt[], i: number, length: number): Pt[] {
	const a = o[i];
	const j = (i + 1) % o.length;
	const b = o[j];
	const current = edgeLength(o, i);
	if (current === 0 || !(length > 0)) return o;
	const ux = (b[0] - a[0]) / current;
	const uy = (b[1] - a[1]) / current;
	const dx = ux * (length - current);
	const dy = uy * (length - current);
	const along = (p: Pt) => (p[0] - a[0]) * ux + (p[1] - a[1]) * uy;
	const eps = 1e-6 * Math.max(current, length, 1);
	const moving = new Set([j]);
	for (let k = (j + 1) % o.length; k !== i && Math.abs(along(o[k]) - current) < eps; k = (k + 1) % o.length) moving.add(k);
	return o.map((p, n) => (moving.has(n) ? [round(p[0] + dx), round(p[1] + dy)] : p));
}

/**
 * Why a length typed into the edge table cannot be used, or null when it can: above zero, and the
 * changed outline inside the engine's limits (LIMITS in the schema: perimeter and area).
 */
export function edgeLengthProblem(o: Pt[], i: number, length: number, units: 'imperial' | 'metric'): string | null {
	const u = units === 'imperial' ? 'ft' : 'm';
	if (!Number.isFinite(length) || length <= 0) return `Enter a length above 0 ${u}.`;
	const next = setEdgeLength(o, i, length);
	const around = next.reduce((sum, _, k) => sum + edgeLength(next, k), 0);
	const maxAround = LIMITS.perimeter[units];
	if (around > maxAround + 1e-9) return `Too long: the outline would be ${Math.round(around)} ${u} around, and a plan may be at most ${maxAround} ${u} around.`;
	const area = Math.abs(signedArea(next));
	const maxArea = LIMITS.area[units];
	if (area > maxArea + 1e-9) return `Too large: the slab would cover ${Math.round(area)} ${u}², and a plan may cover at most ${maxArea} ${u}².`;
	return null;
}

/** Inserts a vertex at the middle of edge i. */
export function splitEdge(o: Pt[], i: number): Pt[] {
	const a = o[i];
	const b = o[(i + 1) % o.length];
	const mid: Pt = [round((a[0] + b[0]) / 2), round((a[1] + b[1]) / 2)];
	return [...o.slice(0, i + 1), mid, ...o.slice(i + 1)];
}

export function removeVertex(o: Pt[], i: number): Pt[] {
	return o.length <= 3 ? o : o.filter((_, n) => n !== i);
}

export function bounds(outlines: Pt[][]) {
	const xs = outlines.flat().map((p) => p[0]);
	const ys = outlines.flat().map((p) => p[1]);
	return { minX: Math.min(...xs), maxX: Math.max(...xs), minY: Math.min(...ys), maxY: Math.max(...ys) };
}

/** The part of polygon o on the side of x (or y) = c where keep(value) holds (Sutherland–Hodgman). */
function clip(o: Pt[], axis: 0 | 1, c: number, below: boolean): Pt[] {
	const inside = (p: Pt) => (below ? p[axis] <= c : p[axis] >= c);
	const out: Pt[] = [];
	for (let i = 0; i < o.length; i++) {
		const p = o[i];
		const q = o[(i + 1) % o.length];
		if (inside(p)) out.push(p);
		if (inside(p) !== inside(q)) {
			const t = (c - p[axis]) / (q[axis] - p[axis]);
			const x: Pt = [round(p[0] + (q[0] - p[0]) * t), round(p[1] + (q[1] - p[1]) * t)];
			out.push(x);
		}
	}
	// Drop repeated points where the cut passes through a vertex.
	return out.filter((p, i) => {
		const n = out[(i + 1) % out.length];
		return p[0] !== n[0] || p[1] !== n[1];
	});
}

/**
 * Splits a section into two pours across its longer side at `at` (0–1 of the way along), so the
 * cold joint is a straight line across the slab. Returns null when the cut would not give two
 * simple pieces (for example through the notch of an L, where one side falls apart).
 */
export function splitSection(o: Pt[], at = 0.5): [Pt[], Pt[]] | null {
	const b = bounds([o]);
	const axis: 0 | 1 = b.maxX - b.minX >= b.maxY - b.minY ? 0 : 1;
	const lo = axis === 0 ? b.minX : b.minY;
	const hi = axis === 0 ? b.maxX : b.maxY;
	const c = round(lo + (hi - lo) * at);
	const first = clip(o, axis, c, true);
	const second = clip(o, axis, c, false);
	if (first.length < 3 || second.length < 3) return null;
	// A piece that touches the cut line more than twice came apart into several.
	const onCut = (piece: Pt[]) => piece.filter((p) => p[axis] === c).length;
	if (onCut(first) !== 2 || onCut(second) !== 2) return null;
	return [first, second];
}

/** True when edge (p, q) lies on the segment a–b (collinear, both ends within it). */
function onSegment(p: Pt, q: Pt, a: Pt, b: Pt): boolean {
	const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
	if (len === 0 || Math.hypot(q[0] - p[0], q[1] - p[1]) < 1e-9) return false;
	const eps = 1e-6 * Math.max(len, 1);
	const inside = (x: Pt) => {
		const t = ((x[0] - a[0]) * (b[0] - a[0]) + (x[1] - a[1]) * (b[1] - a[1])) / len;
		const off = Math.abs((x[0] - a[0]) * (b[1] - a[1]) - (x[1] - a[1]) * (b[0] - a[0])) / len;
		return off < eps && t > -eps && t < len + eps;
	};
	return inside(p) && inside(q);
}

export type EdgeAt = { section: number; edge: number };

/**
 * Where edges went after the sections changed (a split, a removed pour): every new edge lying
 * along one of the old edges, in section order. A wall split in two by a pour cut stays a wall on
 * both pours; an edge whose section is gone maps to nothing.
 */
export function edgesAfter(before: Pt[][], after: Pt[][], refs: EdgeAt[]): EdgeAt[] {
	const out: EdgeAt[] = [];
	for (const ref of refs) {
		const o = before[ref.section];
		if (!o || ref.edge >= o.length) continue;
		const a = o[ref.edge];
		const b = o[(ref.edge + 1) % o.length];
		after.forEach((n, s) =>
			n.forEach((p, e) => {
				if (onSegment(p, n[(e + 1) % n.length], a, b) && !out.some((r) => r.section === s && r.edge === e)) out.push({ section: s, edge: e });
			})
		);
	}
	return out;
}
