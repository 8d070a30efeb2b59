// Outline editing for the planner: pure functions on [x, y] vertex lists in plan units.
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

/** Sets edge i's length by moving its end vertex along the edge's direction. */
export function setEdgeLength(o: Pt[], i: number, length: number): Pt[] {
	const a = o[i];
	const j = (i + 1) % o.length;
	const b = o[j];
	const current = edgeLength(o, i);
	if (current === 0 || !(length > 0)) return o;
	const k = length / current;
	const moved: Pt = [round(a[0] + (b[0] - a[0]) * k), round(a[1] + (b[1] - a[1]) * k)];
	return o.map((p, n) => (n === j ? moved : p));
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
