// Section outlines: validity, areas, shared edges (cold joints) and the free edges that get forms.

import {
	bbox,
	boxesMeet,
	cross,
	dist,
	allEdgeBoxes,
	edgeBoxes,
	edgeBoxesMeet,
	interiorPoint,
	lerp,
	next,
	perimeter,
	pointInPolygonXY,
	project,
	segmentRelation,
	signedArea
} from './polygon';
import type { Box, Pt } from './polygon';
import { ascending, mapList } from './util';

/** A problem with the input, addressed by its path in the request (e.g. "sections.0.outline"). */
export interface PlanIssue {
	path: string;
	message: string;
}

export class PlanInputError extends Error {
	constructor(readonly issues: PlanIssue[]) {
		super(issues.map((i) => `${i.path || '(root)'}: ${i.message}`).join('; '));
		this.name = 'PlanInputError';
	}
}

/** Length tolerance: far below anything measurable on site, far above float noise. */
export const tolerance = (outlines: readonly (readonly Pt[])[]) => {
	let m = 1;
	for (const o of outlines) for (const p of o) m = Math.max(m, Math.abs(p[0]), Math.abs(p[1]));
	return m * 1e-9;
};

/**
 * Why an outline is not a usable simple polygon, or null when it is. `boxes` holds its edge boxes
 * from box `at` on (polygon.ts, edgeBoxes).
 */
export function outlineProblem(poly: readonly Pt[], eps: number, boxes: Float64Array = edgeBoxes(poly), at = 0): string | null {
	const n = poly.length;
	for (let i = 0; i < n; i++) {
		if (dist(poly[i], next(poly, i)) <= eps) return `vertices ${i} and ${(i + 1) % n} are the same point`;
	}
	if (Math.abs(signedArea(poly)) <= eps * perimeter(poly)) return 'the outline has no area';
	for (let i = 0; i < n; i++) {
		// Neighbouring edges share a vertex; they only fail by folding back onto each other.
		const a = poly[i];
		const b = next(poly, i);
		const c = poly[(i + 2) % n];
		// dot(sub(b, a), sub(c, b)) < 0, written out to skip two temporary arrays.
		if (Math.abs(cross(a, b, c)) <= eps * dist(a, b) && (b[0] - a[0]) * (c[0] - b[0]) + (b[1] - a[1]) * (c[1] - b[1]) < 0)
			return `edges ${i} and ${(i + 1) % n} fold back onto each other`;
		for (let j = i + 2; j < n; j++) {
			if ((i === 0 && j === n - 1) || !edgeBoxesMeet(boxes, at + i, boxes, at + j, eps)) continue;
			const rel = segmentRelation(a, b, poly[j], next(poly, j), eps);
			if (rel !== 'none') return `edges ${i} and ${j} ${rel === 'cross' ? 'cross' : 'touch'}: the outline must not cross or touch itself`;
		}
	}
	return null;
}

/** What the overlap test needs of an outline, worked out once. */
interface Probe {
	poly: readonly Pt[];
	box: Box;
	/** Its edge boxes, from box `at` on. */
	edges: Float64Array;
	at: number;
	/** One point strictly inside the outline. */
	interior: Pt;
}

function probe(poly: readonly Pt[], eps: number, edges: Float64Array = edgeBoxes(poly), at = 0): Probe {
	return { poly, box: bbox(poly), edges, at, interior: interiorPoint(poly, eps) };
}

const insideBox = (x: number, y: number, b: Box) => x > b.minX && x < b.maxX && y > b.minY && y < b.maxY;

/** Whether the point lies inside the other outline (its box first: most points are far off). */
const inside = (x: number, y: number, into: Probe, eps: number) => insideBox(x, y, into.box) && pointInPolygonXY(x, y, into.poly, eps) === 'inside';

/**
 * Whether one of the outline's vertices, edge midpoints or its interior point lies inside the
 * other: if any does, they overlap. The midpoints are worked out as tested, not kept in a list.
 */
function hits(from: Probe, into: Probe, eps: number): boolean {
	const P = from.poly;
	const n = P.length;
	for (let i = 0; i < n; i++) if (inside(P[i][0], P[i][1], into, eps)) return true;
	for (let i = 0; i < n; i++) {
		// lerp(P[i], next, 0.5), written out
		const a = P[i];
		const b = P[i + 1 === n ? 0 : i + 1];
		if (inside(a[0] + (b[0] - a[0]) * 0.5, a[1] + (b[1] - a[1]) * 0.5, into, eps)) return true;
	}
	return inside(from.interior[0], from.interior[1], into, eps);
}

function probesOverlap(a: Probe, b: Probe, eps: number): boolean {
	if (!boxesMeet(a.box, b.box, eps)) return false;
	const A = a.poly;
	const B = b.poly;
	for (let i = 0; i < A.length; i++)
		for (let j = 0; j < B.length; j++)
			if (edgeBoxesMeet(a.edges, a.at + i, b.edges, b.at + j, eps) && segmentRelation(A[i], next(A, i), B[j], next(B, j), eps) === 'cross') return true;
	return hits(a, b, eps) || hits(b, a, eps);
}

/** True when the interiors of two valid outlines overlap (touching along edges is fine). */
export function outlinesOverlap(a: readonly Pt[], b: readonly Pt[], eps: number): boolean {
	return probesOverlap(probe(a, eps), probe(b, eps), eps);
}

/** Every problem with the set of outlines, each with the path of the outline it concerns. */
export function geometryIssues(outlines: readonly (readonly Pt[])[]): PlanIssue[] {
	const eps = tolerance(outlines);
	const issues: PlanIssue[] = [];
	// One set of edge boxes serves both the self-crossing test and the overlap probe.
	const { boxes, first } = allEdgeBoxes(outlines);
	const probes = mapList(outlines, (o, i) => {
		const problem = outlineProblem(o, eps, boxes, first[i]);
		if (problem) issues.push({ path: `sections.${i}.outline`, message: `Section ${i + 1}: ${problem}.` });
		return problem ? null : probe(o, eps, boxes, first[i]);
	});
	for (let i = 0; i < outlines.length; i++)
		for (let j = i + 1; j < outlines.length; j++) {
			const a = probes[i];
			const b = probes[j];
			if (a && b && probesOverlap(a, b, eps))
				issues.push({
					path: `sections.${j}.outline`,
					message: `Section ${j + 1} overlaps section ${i + 1}; sections may only share edges.`
				});
		}
	return issues;
}

export interface ColdJointSeg {
	sections: [number, number];
	edges: [number, number];
	from: Pt;
	to: Pt;
	length: number;
}

/** Edge ab shared with cd: the overlapping piece as parameters on ab, or null. */
function sharedPart(a: Pt, b: Pt, c: Pt, d: Pt, eps: number): [number, number] | null {
	if (segmentRelation(a, b, c, d, eps) !== 'overlap') return null;
	const p = project(a, b, c);
	const q = project(a, b, d);
	return [Math.max(0, Math.min(p, q)), Math.min(1, Math.max(p, q))];
}

/** Shared edges between sections, found pairwise; each becomes a cold joint. */
export function findColdJoints(outlines: readonly (readonly Pt[])[], eps: number): ColdJointSeg[] {
	const out: ColdJointSeg[] = [];
	const boxes = mapList(outlines, (o) => bbox(o));
	const { boxes: edges, first } = allEdgeBoxes(outlines);
	for (let s = 0; s < outlines.length; s++)
		for (let r = s + 1; r < outlines.length; r++) {
			if (!boxesMeet(boxes[s], boxes[r], eps)) continue;
			const A = outlines[s];
			const B = outlines[r];
			for (let i = 0; i < A.length; i++)
				for (let j = 0; j < B.length; j++) {
					if (!edgeBoxesMeet(edges, first[s] + i, edges, first[r] + j, eps)) continue;
					const part = sharedPart(A[i], next(A, i), B[j], next(B, j), eps);
					if (!part) continue;
					const from = lerp(A[i], next(A, i), part[0]);
					const to = lerp(A[i], next(A, i), part[1]);
					out.push({ sections: [s, r], edges: [i, j], from, to, length: dist(from, to) });
				}
		}
	return out;
}

/**
 * A whole edge, free: one list for every edge that shares nothing. Never changed (readonly), and
 * not frozen either: a frozen array would make the loops that read `free` polymorphic.
 */
const WHOLE_EDGE: readonly (readonly [number, number])[] = [[0, 1]];

/** What an edge that meets no other section shares: one list for all of them, never changed. */
const NO_JOINTS: readonly ColdJointSeg[] = [];

/** The pieces of one edge (as parameter intervals) not shared with another section. */
export function freeIntervals(a: Pt, b: Pt, shared: readonly ColdJointSeg[], eps: number): readonly (readonly [number, number])[] {
	if (!shared.length) return WHOLE_EDGE;
	const len = dist(a, b);
	const out: [number, number][] = [];
	// Most shared edges meet one other edge: its piece needs no list and no sort.
	if (shared.length === 1) {
		const p = project(a, b, shared[0].from);
		const q = project(a, b, shared[0].to);
		pastPiece(out, 0, Math.min(p, q), Math.max(p, q), len, eps);
		return out;
	}
	const cuts = mapList(shared, (j): [number, number] => {
		const p = project(a, b, j.from);
		const q = project(a, b, j.to);
		return [Math.min(p, q), Math.max(p, q)];
	}).sort((x, y) => ascending(x[0], y[0]));
	let at = 0;
	for (let k = 0; k < cuts.length; k++) at = pastPiece(out, at, cuts[k][0], cuts[k][1], len, eps, k === cuts.length - 1);
	return out;
}

/**
 * One shared piece [p, q] met walking along an edge from `at`: keeps the free gap before it, and
 * after the last piece the free rest of the edge. Returns where the walk has got to.
 */
function pastPiece(out: [number, number][], at: number, p: number, q: number, len: number, eps: number, last = true): number {
	if ((p - at) * len > eps) out.push([at, p]);
	const to = Math.max(at, q);
	if (last && (1 - to) * len > eps) out.push([to, 1]);
	return to;
}

export interface EdgeInfo {
	index: number;
	from: Pt;
	to: Pt;
	length: number;
	/** Pieces of the edge shared with other sections. */
	shared: readonly ColdJointSeg[];
	/** Pieces not shared, as [t0, t1] along the edge. */
	free: readonly (readonly [number, number])[];
}

export interface SectionShape {
	index: number;
	outline: Pt[];
	area: number;
	perimeter: number;
	/** +1 counter-clockwise, −1 clockwise. */
	orientation: number;
	edges: EdgeInfo[];
}

export interface Layout {
	sections: SectionShape[];
	coldJoints: ColdJointSeg[];
	/** Length of the outer boundary of all sections together (shared edges left out). */
	outerPerimeter: number;
	eps: number;
}

/** Areas, edges and cold joints of valid outlines (metres). */
export function layoutSections(outlines: readonly (readonly Pt[])[]): Layout {
	const eps = tolerance(outlines);
	const coldJoints = findColdJoints(outlines, eps);
	let outerPerimeter = 0;
	// Each edge's joints, in the order found: one pass instead of a filter over all joints per edge.
	const byEdge: ColdJointSeg[][][] = mapList(outlines, () => []);
	for (const j of coldJoints) for (let k = 0; k < 2; k++) (byEdge[j.sections[k]][j.edges[k]] ??= []).push(j);
	const sections = mapList(outlines, (outline, s): SectionShape => {
		const a = signedArea(outline);
		const edges = mapList(outline, (from, i): EdgeInfo => {
			const to = next(outline, i);
			const shared = byEdge[s][i] ?? NO_JOINTS;
			const free = freeIntervals(from, to, shared, eps);
			const length = dist(from, to);
			for (const [p, q] of free) outerPerimeter += (q - p) * length;
			return { index: i, from, to, length, shared, free };
		});
		return {
			index: s,
			outline: [...outline],
			area: Math.abs(a),
			perimeter: perimeter(outline),
			orientation: Math.sign(a),
			edges
		};
	});
	return { sections, coldJoints, outerPerimeter, eps };
}
