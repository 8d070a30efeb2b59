// Plane geometry on simple polygons given as vertex lists. Unit-free: callers pass a length
// tolerance in the same unit as the coordinates.

import { ascending } from './util';

export type Pt = readonly [number, number];

export const sub = (a: Pt, b: Pt): Pt => [a[0] - b[0], a[1] - b[1]];
export const dot = (a: Pt, b: Pt) => a[0] * b[0] + a[1] * b[1];
export const dist = (a: Pt, b: Pt) => {
	const dx = a[0] - b[0];
	const dy = a[1] - b[1];
	return Math.sqrt(dx * dx + dy * dy); // Math.hypot is several times slower
};
/** Point at t along a→b; exact at the ends so shared corners compare equal. */
export const lerp = (a: Pt, b: Pt, t: number): Pt => (t === 0 ? a : t === 1 ? b : [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t]);
/** a scaled to length 1. */
export const unit = (a: Pt): Pt => {
	const l = Math.sqrt(a[0] * a[0] + a[1] * a[1]);
	return [a[0] / l, a[1] / l];
};
/** z of (b − a) × (p − a): positive when p is left of a→b. */
export const cross = (a: Pt, b: Pt, p: Pt) => (b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0]);

export const next = (poly: readonly Pt[], i: number) => poly[i + 1 === poly.length ? 0 : i + 1];

/** |sin| of the angle between edge i of p and edge j of q: 0 when they run parallel, 1 when square. */
export function edgeSine(p: readonly Pt[], i: number, q: readonly Pt[], j: number): number {
	const u = unit(sub(next(p, i), p[i]));
	const v = unit(sub(next(q, j), q[j]));
	return Math.abs(u[0] * v[1] - u[1] * v[0]);
}

/**
 * A cross fall runs along the high side, so it tilts a wall's fall only in proportion to the sine
 * between them: beside a wall nearly parallel to the high side (under 1 in 10) it cannot help.
 */
export const CROSS_FALL_MIN_SINE = 0.1;

/** Shoelace area, positive for counter-clockwise order. */
export function signedArea(poly: readonly Pt[]): number {
	let s = 0;
	for (let i = 0; i < poly.length; i++) {
		const a = poly[i];
		const b = next(poly, i);
		s += a[0] * b[1] - b[0] * a[1];
	}
	return s / 2;
}

export function perimeter(poly: readonly Pt[]): number {
	let s = 0;
	for (let i = 0; i < poly.length; i++) s += dist(poly[i], next(poly, i));
	return s;
}

/** Which side of a→b the point lies on, 0 when within eps of the line. */
function side(a: Pt, b: Pt, p: Pt, eps: number): number {
	const c = cross(a, b, p);
	return Math.abs(c) <= eps * dist(a, b) ? 0 : Math.sign(c);
}

/** Parameter of p projected on a→b (0 at a, 1 at b). */
export function project(a: Pt, b: Pt, p: Pt): number {
	// Written out (same arithmetic as dot(sub(p, a), d) / dot(d, d)): no temporary arrays.
	const dx = b[0] - a[0];
	const dy = b[1] - a[1];
	return ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (dx * dx + dy * dy);
}

export function distToSegment(p: Pt, a: Pt, b: Pt): number {
	return distToSegmentXY(p[0], p[1], a, b);
}

function distToSegmentXY(px: number, py: number, a: Pt, b: Pt): number {
	const dx = b[0] - a[0];
	const dy = b[1] - a[1];
	const l2 = dx * dx + dy * dy;
	const t = l2 ? Math.min(1, Math.max(0, ((px - a[0]) * dx + (py - a[1]) * dy) / l2)) : 0;
	const ex = a[0] + dx * t - px;
	const ey = a[1] + dy * t - py;
	return Math.sqrt(ex * ex + ey * ey);
}

export type Relation = 'none' | 'cross' | 'touch' | 'overlap';

/** How segments ab and cd meet: a proper crossing, a touch at a point, or a collinear overlap. */
export function segmentRelation(a: Pt, b: Pt, c: Pt, d: Pt, eps: number): Relation {
	if (
		Math.max(a[0], b[0]) < Math.min(c[0], d[0]) - eps ||
		Math.max(c[0], d[0]) < Math.min(a[0], b[0]) - eps ||
		Math.max(a[1], b[1]) < Math.min(c[1], d[1]) - eps ||
		Math.max(c[1], d[1]) < Math.min(a[1], b[1]) - eps
	)
		return 'none';
	const s1 = side(a, b, c, eps);
	const s2 = side(a, b, d, eps);
	const s3 = side(c, d, a, eps);
	const s4 = side(c, d, b, eps);
	if (s1 * s2 < 0 && s3 * s4 < 0) return 'cross';
	if (s1 === 0 && s2 === 0) {
		const len = dist(a, b);
		const t0 = Math.max(0, Math.min(project(a, b, c), project(a, b, d)));
		const t1 = Math.min(1, Math.max(project(a, b, c), project(a, b, d)));
		if ((t1 - t0) * len > eps) return 'overlap';
		return (t1 - t0) * len >= -eps ? 'touch' : 'none';
	}
	// Written out rather than through a helper closure, which would be allocated on every call.
	if (distToSegment(c, a, b) <= eps || distToSegment(d, a, b) <= eps || distToSegment(a, c, d) <= eps || distToSegment(b, c, d) <= eps) return 'touch';
	return 'none';
}

export type Where = 'inside' | 'outside' | 'boundary';

export interface Box {
	minX: number;
	minY: number;
	maxX: number;
	maxY: number;
}

export function bbox(poly: readonly Pt[]): Box {
	let [minX, minY, maxX, maxY] = [Infinity, Infinity, -Infinity, -Infinity];
	for (const [x, y] of poly) {
		if (x < minX) minX = x;
		if (x > maxX) maxX = x;
		if (y < minY) minY = y;
		if (y > maxY) maxY = y;
	}
	return { minX, minY, maxX, maxY };
}

export const boxesMeet = (a: Box, b: Box, eps: number) => a.minX <= b.maxX + eps && b.minX <= a.maxX + eps && a.minY <= b.maxY + eps && b.minY <= a.maxY + eps;

export function pointInPolygon(p: Pt, poly: readonly Pt[], eps: number): Where {
	return pointInPolygonXY(p[0], p[1], poly, eps);
}

/** pointInPolygon for the point (px, py), so a hot loop need not build a point to ask. */
export function pointInPolygonXY(px: number, py: number, poly: readonly Pt[], eps: number): Where {
	let inside = false;
	const far = 2 * eps; // well clear of the edge's box: its distance is surely over eps
	const n = poly.length;
	for (let i = 0; i < n; i++) {
		const a = poly[i];
		const b = poly[i + 1 === n ? 0 : i + 1];
		// Skip the square root for edges nowhere near p; the answer is the same.
		const clear =
			(px < a[0] - far && px < b[0] - far) ||
			(px > a[0] + far && px > b[0] + far) ||
			(py < a[1] - far && py < b[1] - far) ||
			(py > a[1] + far && py > b[1] + far);
		if (!clear && distToSegmentXY(px, py, a, b) <= eps) return 'boundary';
		if (a[1] > py !== b[1] > py) {
			const x = a[0] + ((py - a[1]) / (b[1] - a[1])) * (b[0] - a[0]);
			if (x > px) inside = !inside;
		}
	}
	return inside ? 'inside' : 'outside';
}

/**
 * Sorts numbers ascending in place. Array.prototype.sort copies the array (boxing each number)
 * before it sorts; the short lists here are sorted by insertion instead, which is stable like
 * it, so the order is the same.
 */
export function sortNumbers(v: number[]): number[] {
	if (v.length > 32) return v.sort(ascending);
	for (let i = 1; i < v.length; i++) {
		const x = v[i];
		let j = i - 1;
		while (j >= 0 && v[j] - x > 0) {
			v[j + 1] = v[j];
			j--;
		}
		v[j + 1] = x;
	}
	return v;
}

/**
 * Where the vertical line x = c runs strictly inside the polygon, as [yFrom, yTo] intervals. Cut
 * points are proper crossings plus vertices within eps of the line; each gap between them is kept
 * only if its middle is inside, so a stretch along an edge (the boundary) is left out and a slightly
 * rotated copy of the same outline gives the same answer.
 */
export function clipVertical(poly: readonly Pt[], c: number, eps: number): [number, number][] {
	const ys: number[] = [];
	for (let i = 0; i < poly.length; i++) {
		const a = poly[i];
		const b = next(poly, i);
		const da = a[0] - c;
		const db = b[0] - c;
		if (Math.abs(da) <= eps) ys.push(a[1]);
		else if ((da > eps && db < -eps) || (da < -eps && db > eps)) ys.push(a[1] + (-da / (b[0] - a[0])) * (b[1] - a[1]));
	}
	sortNumbers(ys);
	const out: [number, number][] = [];
	for (let k = 0; k + 1 < ys.length; k++) {
		const y0 = ys[k];
		const y1 = ys[k + 1];
		if (y1 - y0 <= eps || pointInPolygonXY(c, (y0 + y1) / 2, poly, eps) !== 'inside') continue;
		const last = out[out.length - 1];
		if (last && y0 - last[1] <= eps) last[1] = y1;
		else out.push([y0, y1]);
	}
	return out;
}

/**
 * Area of the part of the polygon with x ≤ c, without building the clipped polygon: the boundary
 * integral of y dx over each edge's piece left of the line (the closing vertical adds nothing).
 */
export function areaLeftOf(poly: readonly Pt[], c: number): number {
	let s = 0;
	const n = poly.length;
	for (let i = 0; i < n; i++) {
		const a = poly[i];
		const b = poly[i + 1 === n ? 0 : i + 1];
		const x0 = a[0];
		const x1 = b[0];
		if (x0 === x1 || (x0 > c && x1 > c)) continue;
		const xa = Math.min(x0, c);
		const xb = Math.min(x1, c);
		const yc = a[1] + ((c - x0) / (x1 - x0)) * (b[1] - a[1]);
		const ya = x0 <= c ? a[1] : yc;
		const yb = x1 <= c ? b[1] : yc;
		s += ((xb - xa) * (ya + yb)) / 2;
	}
	return Math.abs(s);
}

/**
 * A point strictly inside the polygon: the middle of the first chord of a horizontal line between
 * the two lowest vertex levels (no vertex lies on that line, so crossings are plain).
 */
export function interiorPoint(poly: readonly Pt[], eps: number): Pt {
	let y0 = Infinity;
	for (const p of poly) if (p[1] < y0) y0 = p[1];
	let y1 = Infinity;
	for (const p of poly) if (p[1] > y0 + eps && p[1] < y1) y1 = p[1];
	const y = (y0 + y1) / 2;
	const xs: number[] = [];
	const n = poly.length;
	for (let i = 0; i < n; i++) {
		const a = poly[i];
		const b = poly[i + 1 === n ? 0 : i + 1];
		if (a[1] < y !== b[1] < y) xs.push(a[0] + ((y - a[1]) / (b[1] - a[1])) * (b[0] - a[0]));
	}
	sortNumbers(xs);
	return xs.length > 1 ? [(xs[0] + xs[1]) / 2, y] : poly[0];
}

/**
 * Bounding box of every edge, packed [minX, minY, maxX, maxY] per edge, for quick rejection:
 * edge i's box is box `at + i` of `out`.
 */
export function edgeBoxes(poly: readonly Pt[], out = new Float64Array(4 * poly.length), at = 0): Float64Array {
	const n = poly.length;
	for (let i = 0; i < n; i++) {
		const a = poly[i];
		const b = poly[i + 1 === n ? 0 : i + 1];
		const k = 4 * (at + i);
		out[k] = Math.min(a[0], b[0]);
		out[k + 1] = Math.min(a[1], b[1]);
		out[k + 2] = Math.max(a[0], b[0]);
		out[k + 3] = Math.max(a[1], b[1]);
	}
	return out;
}

/**
 * The edge boxes of several outlines in one typed array (the numbers stored unboxed, outside the
 * JS heap): outline k's edge i is box `first[k] + i`. One array for all, because creating a typed
 * array that size costs about a microsecond, more than filling it.
 */
export function allEdgeBoxes(polys: readonly (readonly Pt[])[]): { boxes: Float64Array; first: number[] } {
	const first: number[] = [];
	let n = 0;
	for (const p of polys) {
		first.push(n);
		n += p.length;
	}
	const boxes = new Float64Array(4 * n);
	for (let k = 0; k < polys.length; k++) edgeBoxes(polys[k], boxes, first[k]);
	return { boxes, first };
}

/** Whether edge i of one packed set and edge j of another have meeting boxes. */
export const edgeBoxesMeet = (A: Float64Array, i: number, B: Float64Array, j: number, eps: number) =>
	A[i * 4] <= B[j * 4 + 2] + eps && B[j * 4] <= A[i * 4 + 2] + eps && A[i * 4 + 1] <= B[j * 4 + 3] + eps && B[j * 4 + 1] <= A[i * 4 + 3] + eps;

/** Interior angle test: true where the outline turns against its winding (a re-entrant corner). */
export function isReflex(poly: readonly Pt[], i: number, orientation: number): boolean {
	const n = poly.length;
	return cross(poly[(i + n - 1) % n], poly[i], poly[(i + 1) % n]) * orientation < 0;
}

/** A local frame: u along a unit tangent, w along a unit normal, both from an origin. */
export interface Frame {
	origin: Pt;
	t: Pt;
	n: Pt;
}

export const toFrame = (f: Frame, p: Pt): Pt => {
	// Same arithmetic as [dot(d, t), dot(d, n)] with d = p − origin, without the temporary d.
	const dx = p[0] - f.origin[0];
	const dy = p[1] - f.origin[1];
	return [dx * f.t[0] + dy * f.t[1], dx * f.n[0] + dy * f.n[1]];
};

export const fromFrame = (f: Frame, q: Pt): Pt => [f.origin[0] + f.t[0] * q[0] + f.n[0] * q[1], f.origin[1] + f.t[1] * q[0] + f.n[1] * q[1]];
