// What the 3D preview draws, worked out from a PlanResult in metres: x and y as on the plan, z up.
// No three.js here, so the shapes are testable on their own and the viewer only turns them into
// buffers. Heights are true except the pitch, which is multiplied by `exaggeration` about the
// slab's high point so a 2 % fall can be seen; thickness, boards and stakes keep their real size.

import type { PlanResult } from '$lib/plan';
import { formatLength, formatSmall } from '$lib/plan-view';
import { DRESSED_THICKNESS_IN } from '$lib/plan/model';
import { dist, pointInPolygon, signedArea, sub, unit } from '$lib/plan/polygon';
import { M_PER_IN, planToM } from '$lib/plan/units';

export type P2 = readonly [number, number];
export type P3 = readonly [number, number, number];

/** A vertical prism over a counter-clockwise footprint, with a top and bottom height per corner. */
export interface Prism {
	footprint: P2[];
	top: number[];
	bottom: number[];
}

export interface Segment {
	from: P3;
	to: P3;
}

export interface Label {
	text: string;
	at: P3;
	kind: 'edge' | 'house' | 'fall';
}

/** The finished surface (exaggerated): z = z0 + dzdx·x + dzdy·y. */
export interface Surface {
	z0: number;
	dzdx: number;
	dzdy: number;
}

export interface SlabSceneModel {
	exaggeration: number;
	surface: Surface;
	sections: { index: number; name: string; solid: Prism }[];
	thickened: { section: number; edge: number; solid: Prism }[];
	forms: { run: string; solid: Prism }[];
	/** `bulkhead`: on the board at a cold joint, pulled before the next pour. */
	stakes: { id: string; bulkhead: boolean; solid: Prism }[];
	/** Inner edge of each thickened strip, traced on the top (the strips are under the slab). */
	thickenedLines: Segment[];
	controlJoints: Segment[];
	coldJoints: Segment[];
	/** Down the steepest fall, on the top; null on a level slab. */
	fallArrow: Segment | null;
	house: Prism[];
	/** The lawn: graded to the same (steepened) fall, `below` under the finished surface. */
	ground: { min: P2; max: P2; below: number; solid: Prism };
	/** The slab's own extent: outlines in plan, lowest concrete to highest top. */
	bounds: { min: P3; max: P3 };
	labels: Label[];
	view: { target: P3; eye: P3 };
}

export interface SceneOptions {
	/** How many times steeper the pitch is drawn. */
	exaggeration?: number;
}

const BOARD_M = DRESSED_THICKNESS_IN * M_PER_IN;
/** A 2×2 stake, dressed 1½ in square. */
const STAKE_M = 1.5 * M_PER_IN;
/** Stakes are driven a little below the board top so the screed rides over them. */
const STAKE_BELOW_TOP_M = 0.01;
const WALL_THICK_M = 0.3;
const WALL_ABOVE_M = 1;
/** How far a wall runs on past the slab where no other house edge continues it. */
const WALL_RUN_M = 0.6;
/** Boards sit this far into the lawn so no sliver of sky shows under them. */
export const LAWN_OVERLAP_M = 0.005;
/** Joint lines sit just above the top so they never flicker into it. */
export const LINE_LIFT_M = 0.002;

const add = (a: P2, b: P2, k = 1): P2 => [a[0] + b[0] * k, a[1] + b[1] * k];
/** z of the 2D vectors a × b (the engine's `cross` takes three points). */
const cross = (a: P2, b: P2) => a[0] * b[1] - a[1] * b[0];
const near = (a: P2, b: P2) => dist(a, b) < 1e-3;
export const lerp3 = (a: P3, b: P3, f: number): P3 => [a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f, a[2] + (b[2] - a[2]) * f];

export { signedArea };

export const surfaceAt = (s: Surface, p: P2) => s.z0 + s.dzdx * p[0] + s.dzdy * p[1];

function prism(footprint: P2[], top: (p: P2) => number, bottom: (p: P2) => number): Prism {
	const fp = signedArea(footprint) < 0 ? [...footprint].reverse() : footprint;
	return { footprint: fp, top: fp.map(top), bottom: fp.map(bottom) };
}

interface EdgeLine {
	a: P2;
	b: P2;
	t: P2;
	/** Unit normal pointing into the section. */
	n: P2;
}

function edgeLines(outline: P2[]): EdgeLine[] {
	const orient = Math.sign(signedArea(outline));
	return outline.map((a, i) => {
		const b = outline[(i + 1) % outline.length];
		const t = unit(sub(b, a));
		return { a, b, t, n: orient > 0 ? [-t[1], t[0]] : [t[1], -t[0]] };
	});
}

/** Where the lines offset by d from two edges meeting at v cross (a mitre), or the square end. */
function mitre(v: P2, e1: EdgeLine, e2: EdgeLine, d: number): P2 {
	const k = cross(e1.t, e2.t);
	const p = add(v, e1.n, d);
	if (Math.abs(k) < 1e-9) return add(v, e2.n, d);
	const D = sub(add(v, e2.n, d), p);
	return add(p, e1.t, cross(D, e2.t) / k);
}

/**
 * The band along edge i between offsets d0 and d1 (inward positive), mitred against neighbouring
 * edges that carry the same band, square elsewhere; `extend` lengthens square ends along the edge.
 */
function band(es: EdgeLine[], i: number, d0: number, d1: number, joins: (j: number) => boolean, extend = [0, 0]): P2[] {
	const n = es.length;
	const e = es[i];
	const prev = es[(i + n - 1) % n];
	const next = es[(i + 1) % n];
	const start = (d: number) => (joins((i + n - 1) % n) ? mitre(e.a, prev, e, d) : add(add(e.a, e.n, d), e.t, -extend[0]));
	const end = (d: number) => (joins((i + 1) % n) ? mitre(e.b, e, next, d) : add(add(e.b, e.n, d), e.t, extend[1]));
	return [start(d0), end(d0), end(d1), start(d1)];
}

/** The parts of a result the 3D view reads: a page can send just these, on demand. */
export type ScenePlan = Pick<PlanResult, 'units' | 'slab' | 'volume' | 'forms' | 'elevations' | 'geometry' | 'joints'>;

type Run = PlanResult['forms']['runs'][number] & { from: P2; to: P2; t: P2; out: P2 };

/** What the part builders share: the plan in metres and the steepened surface. */
interface Ctx {
	result: ScenePlan;
	M: (p: readonly [number, number]) => P2;
	top: (p: P2) => number;
	outlines: P2[][];
	lines: EdgeLine[][];
	runs: Run[];
	boardDepth: number;
}

/** Boards stand outside the slab edge, top at finished height. Bulkheads are left out: the view is
 * of the finished slab, where the cold joint line marks them. */
function formBoards({ runs, top, boardDepth }: Ctx) {
	const boards = runs.filter((r) => r.formed && r.kind !== 'bulkhead');
	return boards.map((r) => {
		// Where the next board turns a convex corner this one runs on by a board thickness to close
		// it; only one of the two laps, so their tops never overlap.
		const nextRun = boards.find((q) => q !== r && near(q.from, r.to));
		const lap = nextRun && cross(r.t, nextRun.t) * cross(r.t, r.out) < 0 ? BOARD_M : 0;
		const end = add(r.to, r.t, lap);
		const fp = [r.from, end, add(end, r.out, BOARD_M), add(r.from, r.out, BOARD_M)];
		return { run: r.id, solid: prism(fp, top, (p) => top(p) - boardDepth) };
	});
}

function stakePrisms({ result, M, runs, top }: Ctx) {
	const length = result.forms.stakes.length.millimeters / 1000;
	return result.elevations.stakes.map((s) => {
		const at = M([s.x, s.y]);
		const r = runs.find((q) => q.id === s.run);
		const t = r?.t ?? [1, 0];
		const out = r?.out ?? [0, -1];
		// Outside the board, tucked in from the board's ends so corner stakes do not overhang.
		const along = r && near(at, r.from) ? STAKE_M / 2 : r && near(at, r.to) ? -STAKE_M / 2 : 0;
		const c = add(add(at, out, BOARD_M + STAKE_M / 2), t, along);
		const h = STAKE_M / 2;
		const fp = [
			[-h, -h],
			[h, -h],
			[h, h],
			[-h, h]
		].map(([i, j]) => add(add(c, t, i), out, j));
		const stakeTop = top(at) - STAKE_BELOW_TOP_M;
		return {
			id: s.id,
			bulkhead: r?.kind === 'bulkhead',
			solid: prism(
				fp,
				() => stakeTop,
				() => stakeTop - length
			)
		};
	});
}

/** House walls: a block beyond the gap, mitred where house edges of one section meet, and run on
 * past the slab where no other house edge carries on from that corner. */
function houseWalls({ result, lines }: Ctx, gap: number, wallTop: number, lawn: (p: P2) => number): Prism[] {
	const edges = result.geometry.sections.flatMap((s, si) => s.edges.filter((e) => e.kind === 'house').map((e) => ({ si, i: e.index })));
	const isHouse = (si: number, i: number) => edges.some((h) => h.si === si && h.i === i);
	const continued = (p: P2, self: (typeof edges)[number]) => edges.some((h) => h !== self && [lines[h.si][h.i].a, lines[h.si][h.i].b].some((q) => near(p, q)));
	return edges.map((h) => {
		const e = lines[h.si][h.i];
		const extend = [continued(e.a, h) ? 0 : WALL_RUN_M, continued(e.b, h) ? 0 : WALL_RUN_M];
		const fp = band(lines[h.si], h.i, -gap, -gap - WALL_THICK_M, (j) => isHouse(h.si, j), extend);
		const foot = Math.min(...fp.map(lawn)) - 0.05;
		return prism(
			fp,
			() => wallTop,
			() => foot
		);
	});
}

const insideAny = (p: P2, outlines: P2[][]) => outlines.some((poly) => pointInPolygon(p, poly, 1e-9) === 'inside');

/** An arrow down the fall, on the slab, clear of the middle where joints tend to cross. */
function fallArrow({ outlines, top }: Ctx, downhill: P2 | null): Segment | null {
	if (!downhill) return null;
	const perp: P2 = [-downhill[1], downhill[0]];
	const pts = outlines.flat();
	const along = pts.map((p) => p[0] * downhill[0] + p[1] * downhill[1]);
	const across = pts.map((p) => p[0] * perp[0] + p[1] * perp[1]);
	const [a0, a1, c0, c1] = [Math.min(...along), Math.max(...along), Math.min(...across), Math.max(...across)];
	const at = (s: number, q: number): P2 => add([downhill[0] * s, downhill[1] * s], perp, q);
	for (const f of [0.72, 0.28, 0.5]) {
		const q = c0 + (c1 - c0) * f;
		const ends = [0.22, 0.45, 0.68].map((g) => at(a0 + (a1 - a0) * g, q));
		if (ends.every((p) => insideAny(p, outlines))) {
			const lift = (p: P2): P3 => [p[0], p[1], top(p) + LINE_LIFT_M];
			return { from: lift(ends[0]), to: lift(ends[2]) };
		}
	}
	return null;
}

function edgeLabels({ result, lines, top }: Ctx): Label[] {
	return result.geometry.sections.flatMap((s, si) =>
		s.edges
			.filter((e) => e.kind !== 'coldJoint')
			.map((e) => {
				const l = lines[si][e.index];
				const mid: P2 = [(l.a[0] + l.b[0]) / 2, (l.a[1] + l.b[1]) / 2];
				// Outside the forms on open edges; on the slab along the house, clear of the wall.
				const p = add(mid, l.n, e.kind === 'house' ? 0.35 : -(BOARD_M + 0.3));
				return { text: formatLength(e.length, result.units), at: [p[0], p[1], top(p) + 0.03] as P3, kind: 'edge' as const };
			})
	);
}

export function buildScene(result: ScenePlan, opts: SceneOptions = {}): SlabSceneModel {
	const k = opts.exaggeration ?? 10;
	const M = (p: readonly [number, number]): P2 => [planToM(p[0], result.units), planToM(p[1], result.units)];
	const mm = (v: { millimeters: number }) => v.millimeters / 1000;
	const thickness = mm(result.slab.thickness);
	const boardDepth = mm(result.forms.boardDepth);

	// The engine's surface plane, steepened about its high point: z = h − down·(p − at), in metres.
	const { at: planAt, atHeight, down } = result.slab.surface;
	const at = M(planAt);
	const h = mm(atHeight);
	const high = Math.max(...result.elevations.vertices.map((v) => mm(v.elevation)));
	const [b, c] = [-down[0], -down[1]];
	const surface: Surface = { z0: high + k * (h - b * at[0] - c * at[1] - high), dzdx: k * b, dzdy: k * c };
	const top = (p: P2) => surfaceAt(surface, p);
	const slabBottom = (p: P2) => top(p) - thickness;
	const lift = (p: P2): P3 => [p[0], p[1], top(p) + LINE_LIFT_M];
	const onTop = (p: readonly [number, number]) => lift(M(p));

	const geo = result.geometry.sections;
	const outlines = geo.map((s) => s.outline.map(M));
	const lines = outlines.map(edgeLines);
	const thick = geo.map((s) => s.edges.map((e) => e.thickened));
	const runs = result.forms.runs.map((r): Run => {
		const [from, to] = [M(r.from), M(r.to)];
		const t = unit(sub(to, from));
		// A bulkhead splitting a pour lies on no edge (edge −1): either side of it will do.
		const n = r.edge >= 0 ? lines[r.section][r.edge].n : ([-t[1], t[0]] as P2);
		return { ...r, from, to, t, out: [-n[0], -n[1]] };
	});
	const ctx: Ctx = { result, M, top, outlines, lines, runs, boardDepth };

	const sections = geo.map((s, i) => ({ index: s.index, name: s.name, solid: prism(outlines[i], top, slabBottom) }));

	const width = result.slab.trench ? mm(result.slab.trench.width) : 0;
	const extraDepth = result.slab.trench ? mm(result.slab.trench.depth) : 0;
	const strips = geo.flatMap((s, si) =>
		s.edges.filter((e) => e.thickened).map((e) => ({ si, e: e.index, quad: band(lines[si], e.index, 0, width, (j) => thick[si][j]) }))
	);
	const thickened = strips.map(({ si, e, quad }) => ({
		section: si,
		edge: e,
		solid: prism(quad, slabBottom, (p) => slabBottom(p) - extraDepth)
	}));
	// The strips are hidden under the slab, so their inner edge is traced on the top as well.
	const thickenedLines = strips.map(({ quad }) => ({ from: lift(quad[3]), to: lift(quad[2]) }));

	const [xs, ys] = [outlines.flat().map((p) => p[0]), outlines.flat().map((p) => p[1])];
	const bottoms = [...sections, ...thickened].flatMap((s) => s.solid.bottom);
	const tops = sections.flatMap((s) => s.solid.top);
	const bounds: SlabSceneModel['bounds'] = {
		min: [Math.min(...xs), Math.min(...ys), Math.min(...bottoms)],
		max: [Math.max(...xs), Math.max(...ys), Math.max(...tops)]
	};

	// The lawn follows the same fall and is banked to the board bottoms, as on site; trenches and
	// stake feet are below it (the viewer draws the lawn see-through to show them).
	const below = boardDepth - LAWN_OVERLAP_M;
	const lawn = (p: P2) => top(p) - below;
	const span = Math.max(bounds.max[0] - bounds.min[0], bounds.max[1] - bounds.min[1]);
	const margin = Math.max(2, span * 0.6);
	const gMin: P2 = [bounds.min[0] - margin, bounds.min[1] - margin];
	const gMax: P2 = [bounds.max[0] + margin, bounds.max[1] + margin];
	const ground = {
		min: gMin,
		max: gMax,
		below,
		solid: prism([gMin, [gMax[0], gMin[1]], gMax, [gMin[0], gMax[1]]], lawn, (p) => lawn(p) - 0.05)
	};

	const wallTop = bounds.max[2] + WALL_ABOVE_M;
	const house = houseWalls(ctx, result.slab.houseGap ? mm(result.slab.houseGap) : 0, wallTop, lawn);

	const downhill: P2 | null = Math.hypot(b, c) > 1e-9 ? unit([-b, -c]) : null;
	const arrow = fallArrow(ctx, downhill);

	const labels = edgeLabels(ctx);
	if (house.length) {
		const fp = house[0].footprint;
		const mid = (i: 0 | 1) => fp.reduce((a, p) => a + p[i], 0) / fp.length;
		labels.push({ text: 'House wall', at: [mid(0), mid(1), wallTop + 0.1], kind: 'house' });
	}
	if (arrow) {
		const { percent } = result.elevations.steepest;
		const drop = formatSmall(result.elevations.totalDrop, result.units);
		// Just past the head, so the label names the arrow without hiding it.
		const d = unit([arrow.to[0] - arrow.from[0], arrow.to[1] - arrow.from[1]]);
		const p = add([arrow.to[0], arrow.to[1]], d, 0.45);
		const text = `Falls ${Math.round(percent * 10) / 10} % · ${drop}`;
		labels.push({ text, at: [p[0], p[1], top(p) + 0.05], kind: 'fall' });
	}

	spreadLabels(labels);

	// Look from the low side, well off square, so the fall runs across the view toward the viewer.
	const target = lerp3(bounds.min, bounds.max, 0.5);
	const d = downhill ?? unit([0.4, -1]);
	const yaw = Math.PI / 3.2;
	const dir: P2 = [d[0] * Math.cos(yaw) - d[1] * Math.sin(yaw), d[0] * Math.sin(yaw) + d[1] * Math.cos(yaw)];
	const dist = Math.max(3, span * 1.15);
	const eye: P3 = [target[0] + dir[0] * dist, target[1] + dir[1] * dist, target[2] + dist * 0.55];

	return {
		exaggeration: k,
		surface,
		sections,
		thickened,
		thickenedLines,
		forms: formBoards(ctx),
		stakes: stakePrisms(ctx),
		controlJoints: result.joints.sections.flatMap((s) => s.lines.map((l) => ({ from: onTop(l.from), to: onTop(l.to) }))),
		coldJoints: result.geometry.coldJoints.map((j) => ({ from: onTop(j.from), to: onTop(j.to) })),
		fallArrow: arrow,
		house,
		ground,
		bounds,
		labels,
		view: { target, eye }
	};
}

/** Labels closer than this (m, in plan) would overlap on screen at the opening view. */
export const LABEL_CLEARANCE_M = 0.9;
/** How far a crowded label is lifted above the one it would cover, m. */
const LABEL_STEP_M = 0.3;

/**
 * Lift each label that sits within LABEL_CLEARANCE_M (in plan) of an earlier one until it is clear
 * of every earlier label in height too, so on screen they stack instead of covering each other.
 */
export function spreadLabels(labels: Label[]): void {
	for (let i = 1; i < labels.length; i++) {
		const a = labels[i];
		for (let tries = 0; tries < 20; tries++) {
			const hit = labels
				.slice(0, i)
				.some((b) => Math.hypot(a.at[0] - b.at[0], a.at[1] - b.at[1]) < LABEL_CLEARANCE_M && Math.abs(a.at[2] - b.at[2]) < LABEL_STEP_M - 1e-9);
			if (!hit) break;
			a.at = [a.at[0], a.at[1], a.at[2] + LABEL_STEP_M];
		}
	}
}
