// The layout drawing as plain shapes in a box: the top view with house, joints, cold joints,
// stakes, corner letters, board ids, edge lengths and diagonals. The plan page draws it as SVG and
// the PDF with pdfkit, so both show one drawing. Plan y runs down the page, as in the editor.

import type { PlanResult } from '$lib/plan';
import { tapeLength } from './text';
import type { LayoutSheet } from '$lib/plan/layout-sheet';
import type { Pt } from '$lib/plan/polygon';
import { signedArea } from '$lib/plan/polygon';

export interface DrawnLine {
	from: Pt;
	to: Pt;
}
export interface DrawnLabel {
	at: Pt;
	text: string;
	kind: 'corner' | 'board' | 'length' | 'stake' | 'high';
}
export interface LayoutDrawing {
	width: number;
	height: number;
	slabs: Pt[][];
	house: DrawnLine[];
	/** A freestanding pad's high side; null when a house wall is the high side. */
	high: DrawnLine | null;
	joints: DrawnLine[];
	coldJoints: DrawnLine[];
	diagonals: DrawnLine[];
	stakes: { id: string; at: Pt }[];
	start: Pt | null;
	labels: DrawnLabel[];
	/** Font size of each label kind, in drawing units: the renderers draw the labels at these sizes. */
	labelSize: LabelSizes;
	/** Drawing units per plan unit (ft or m). */
	scale: number;
}

export type LabelSizes = Record<DrawnLabel['kind'], number>;

export type DrawingPlan = Pick<PlanResult, 'units' | 'geometry' | 'joints' | 'forms' | 'elevations'>;

/** Room around the slab for letters, board ids and stake numbers, in drawing units at LABEL_SIZE. */
const BASE_MARGIN = 34;

/** The unit vector from a to b (plan or drawing units alike). */
function unit(a: readonly [number, number], b: readonly [number, number]): Pt {
	const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
	return [(b[0] - a[0]) / len, (b[1] - a[1]) / len];
}

/**
 * `box.labelSize` sets the label sizes (default LABEL_SIZE, for paper); the gaps between a label and
 * what it names, and the margin, grow with them.
 */
export function layoutDrawing(r: DrawingPlan, sheet: LayoutSheet, box: { width: number; height: number; labelSize?: LabelSizes }): LayoutDrawing {
	const size = box.labelSize ?? LABEL_SIZE;
	// How much larger than on paper each kind is drawn: its offsets grow by as much.
	const larger = (kind: DrawnLabel['kind']) => size[kind] / LABEL_SIZE[kind];
	const MARGIN = BASE_MARGIN * Math.max(...KINDS.map(larger));
	const pts = r.geometry.sections.flatMap((s) => s.outline);
	const [x0, x1] = [Math.min(...pts.map((p) => p[0])), Math.max(...pts.map((p) => p[0]))];
	const [y0, y1] = [Math.min(...pts.map((p) => p[1])), Math.max(...pts.map((p) => p[1]))];
	const scale = Math.min((box.width - 2 * MARGIN) / Math.max(x1 - x0, 1e-9), (box.height - 2 * MARGIN) / Math.max(y1 - y0, 1e-9));
	const height = Math.min(box.height, (y1 - y0) * scale + 2 * MARGIN);
	const width = Math.min(box.width, (x1 - x0) * scale + 2 * MARGIN);
	const P = (p: readonly [number, number]): Pt => [MARGIN + (p[0] - x0) * scale, MARGIN + (p[1] - y0) * scale];
	const line = (a: readonly [number, number], b: readonly [number, number]): DrawnLine => ({ from: P(a), to: P(b) });

	const labels: Wanted[] = [];
	const house: DrawnLine[] = [];
	let high: DrawnLine | null = null;
	const freestanding = r.geometry.houseEdges.length === 0;
	const cornerAt = new Map<string, Wanted>();
	for (const s of r.geometry.sections) {
		const o = s.outline;
		const n = o.length;
		const ccw = signedArea(o) > 0;
		// Outward normal of edge i in plan units (y down does not change which side is out).
		const out = (i: number): Pt => {
			const [a, b] = [o[i], o[(i + 1) % n]];
			const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
			const t = [(b[0] - a[0]) / len, (b[1] - a[1]) / len];
			return ccw ? [t[1], -t[0]] : [-t[1], t[0]];
		};
		o.forEach((v, i) => {
			const [na, nb] = [out((i + n - 1) % n), out(i)];
			const bis: Pt = [na[0] + nb[0], na[1] + nb[1]];
			const k = Math.hypot(bis[0], bis[1]) || 1;
			const at = P(v);
			const text = sheet.corners.find((c) => c.section === s.index && c.vertex === i)?.label ?? '';
			// Where pours share a corner, one label names it for both: "1B/2A".
			const key = `${Math.round(at[0])},${Math.round(at[1])}`;
			const shared = cornerAt.get(key);
			if (shared) shared.text = `${shared.text}/${text}`;
			else {
				const dir: Pt = [bis[0] / k, bis[1] / k];
				const label: Wanted = {
					kind: 'corner',
					text,
					at: [at[0] + dir[0] * 14 * larger('corner'), at[1] + dir[1] * 14 * larger('corner')],
					normal: dir,
					tangent: [-dir[1], dir[0]]
				};
				cornerAt.set(key, label);
				labels.push(label);
			}
		});
		for (const e of s.edges) {
			const [a, b] = [o[e.index], o[(e.index + 1) % n]];
			if (e.kind === 'house') house.push(line(a, b));
			if (freestanding && r.geometry.highEdge.section === s.index && r.geometry.highEdge.edge === e.index) {
				high = line(a, b);
				// Outside the slab, two thirds along: clear of the board id (a third along) and the stakes.
				const at = P([a[0] + (b[0] - a[0]) * 0.65, a[1] + (b[1] - a[1]) * 0.65]);
				const nn = out(e.index);
				const off = 22 * larger('high');
				labels.push({ kind: 'high', text: 'HIGH SIDE', at: [at[0] + nn[0] * off, at[1] + nn[1] * off], normal: nn, tangent: unit(a, b) });
			}
			if (e.kind === 'coldJoint') continue;
			const mid = P([(a[0] + b[0]) / 2, (a[1] + b[1]) / 2]);
			const nn = out(e.index);
			// Edge lengths sit just inside the slab, clear of the stakes outside it.
			labels.push({
				kind: 'length',
				text: tapeLength(e.length, r.units),
				at: [mid[0] - nn[0] * 10 * larger('length'), mid[1] - nn[1] * 10 * larger('length')],
				normal: [-nn[0], -nn[1]],
				tangent: unit(a, b)
			});
		}
	}
	const runOut = new Map<string, Pt>();
	for (const run of r.forms.runs) {
		const o = r.geometry.sections[run.section].outline;
		// Along the run itself: a bulkhead where a pour is split lies on no edge (its edge is -1).
		const [a, b] = [run.from, run.to];
		const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
		const t = [(b[0] - a[0]) / len, (b[1] - a[1]) / len];
		const out: Pt = signedArea(o) > 0 ? [t[1], -t[0]] : [-t[1], t[0]];
		runOut.set(run.id, out);
		// Bulkheads too: the cut list and the stake table name them, so the drawing must show where they stand.
		if (!run.formed) continue;
		// A third of the way along, so the id does not sit on the length label's line of sight.
		const at = P([run.from[0] + (run.to[0] - run.from[0]) * 0.35, run.from[1] + (run.to[1] - run.from[1]) * 0.35]);
		const off = 22 * larger('board');
		labels.push({ kind: 'board', text: run.id, at: [at[0] + out[0] * off, at[1] + out[1] * off], normal: out, tangent: [t[0], t[1]] });
	}
	const stakes = r.elevations.stakes.map((s) => ({ id: s.id, at: P([s.x, s.y]), run: s.run }));
	for (const s of stakes) {
		const out = runOut.get(s.run) ?? [0, 1];
		const off = 9 * larger('stake');
		labels.push({ kind: 'stake', text: s.id, at: [s.at[0] + out[0] * off, s.at[1] + out[1] * off], normal: out, tangent: [-out[1], out[0]] });
	}
	const diagonals = sheet.diagonals.flatMap((d) => {
		const o = r.geometry.sections[d.section].outline;
		return [line(o[0], o[2]), line(o[1], o[3])];
	});
	const startCorner = sheet.corners.find((c) => c.label === sheet.start.corner);
	const start = startCorner ? P(startCorner.at) : null;
	const slabs = r.geometry.sections.map((s) => s.outline.map(P));
	const joints = r.joints.sections.flatMap((s) => s.lines.map((l) => line(l.from, l.to)));
	// Cold joints between sections, and the bulkheads that split a pour inside a section (on no edge, -1).
	const coldJoints = [
		...r.geometry.coldJoints.map((j) => line(j.from, j.to)),
		...r.forms.runs.filter((run) => run.kind === 'bulkhead' && run.edge < 0).map((run) => line(run.from, run.to))
	];
	// Everything drawn that a label must keep off: outlines, walls, joints, diagonals, stakes, the start circle.
	const drawn = [
		...slabs.flatMap((o) => o.map((p, i) => ({ from: p, to: o[(i + 1) % o.length] }))),
		...house,
		...(high ? [high] : []),
		...joints,
		...coldJoints,
		...diagonals
	];
	const dots: Box[] = stakes.map((s) => ({ x0: s.at[0] - 3, y0: s.at[1] - 3, x1: s.at[0] + 3, y1: s.at[1] + 3 }));
	if (start) dots.push({ x0: start[0] - 9, y0: start[1] - 9, x1: start[0] + 9, y1: start[1] + 9 });
	const order: DrawnLabel['kind'][] = ['corner', 'high', 'length', 'board', 'stake'];
	const wanted = order.flatMap((k) => labels.filter((l) => l.kind === k));
	return {
		width,
		height,
		scale,
		slabs,
		house,
		high,
		joints,
		coldJoints,
		diagonals,
		stakes: stakes.map((s) => ({ id: s.id, at: s.at })),
		start,
		labelSize: size,
		labels: placeLabels(wanted, drawn, dots, { width, height }, size)
	};
}

// ---- Label placement: each label tries spots near where it belongs, nearest first, and takes the
// first whose box is clear of every drawn line, stake, the start circle and the labels placed
// before it (and inside the drawing). Both renderers draw the labels at these sizes.

/** Font size of each label kind, in drawing units (SVG px, PDF pt). */
export const LABEL_SIZE: LabelSizes = { corner: 11, high: 9, length: 8, board: 9, stake: 7 };
const KINDS = Object.keys(LABEL_SIZE) as DrawnLabel['kind'][];
/**
 * On screen the drawing is laid out in CSS px at the width it is shown, with labels at least 12 px
 * (paper's 7-unit stake ids were about 8 px on a desktop and 4 px on a phone).
 */
export const SCREEN_LABEL_SIZE: LabelSizes = { corner: 16, high: 13, length: 12, board: 13, stake: 12 };
/** A phone's column (under 480 px) has room for one size less. */
export const PHONE_LABEL_SIZE: LabelSizes = { corner: 14, high: 11, length: 11, board: 12, stake: 11 };

/** The box a label's text takes, centred on its point (a generous 0.62 em per character). */
export function labelBox(l: Pick<DrawnLabel, 'at' | 'text' | 'kind'>, sizes: LabelSizes = LABEL_SIZE): Box {
	const size = sizes[l.kind];
	const w = l.text.length * size * 0.62;
	return { x0: l.at[0] - w / 2, y0: l.at[1] - size * 0.6, x1: l.at[0] + w / 2, y1: l.at[1] + size * 0.6 };
}

export interface Box {
	x0: number;
	y0: number;
	x1: number;
	y1: number;
}

const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/** Whether segment a–b passes through box r (Liang–Barsky clipping). */
export function segmentHitsBox(a: Pt, b: Pt, r: Box): boolean {
	let t0 = 0;
	let t1 = 1;
	const dx = b[0] - a[0];
	const dy = b[1] - a[1];
	const edges: [number, number][] = [
		[-dx, a[0] - r.x0],
		[dx, r.x1 - a[0]],
		[-dy, a[1] - r.y0],
		[dy, r.y1 - a[1]]
	];
	for (const [p, q] of edges) {
		if (p === 0) {
			if (q < 0) return false;
		} else {
			const t = q / p;
			if (p < 0) t0 = Math.max(t0, t);
			else t1 = Math.min(t1, t);
			if (t0 > t1) return false;
		}
	}
	return true;
}

type Wanted = DrawnLabel & { normal: Pt; tangent: Pt };

/** Offsets to try, nearest first: out along the label's normal, then sideways along its line. */
const TRIES: [number, number][] = (() => {
	const out: [number, number][] = [];
	for (const n of [0, 4, 8, 12, 16, 22, 28, 36, 46, -6, -12, -20, -30, -42, -56])
		for (const t of [0, 8, -8, 16, -16, 26, -26, 38, -38, 52, -52, 68, -68]) out.push([n, t]);
	return out.sort((p, q) => Math.abs(p[0]) + Math.abs(p[1]) * 0.8 - (Math.abs(q[0]) + Math.abs(q[1]) * 0.8));
})();

function placeLabels(wanted: Wanted[], lines: DrawnLine[], dots: Box[], size: { width: number; height: number }, sizes: LabelSizes): DrawnLabel[] {
	const placed: Box[] = [];
	const out: DrawnLabel[] = [];
	const pad = 1.5;
	const grow = (b: Box): Box => ({ x0: b.x0 - pad, y0: b.y0 - pad, x1: b.x1 + pad, y1: b.y1 + pad });
	const hits = (b: Box) =>
		(b.x0 < 0 || b.y0 < 0 || b.x1 > size.width || b.y1 > size.height ? 1 : 0) +
		lines.filter((l) => segmentHitsBox(l.from, l.to, b)).length +
		dots.filter((d) => overlaps(d, b)).length +
		placed.filter((p) => overlaps(p, b)).length;
	// Many stakes: only the nearest spots, to keep the drawing cheap on a large plan.
	const tries = wanted.length > 250 ? TRIES.slice(0, 12) : TRIES;
	for (const w of wanted) {
		let best: { at: Pt; box: Box; n: number } | null = null;
		// Larger labels step further between tries, as far as the paper size steps are to its labels.
		const k = sizes[w.kind] / LABEL_SIZE[w.kind];
		for (const [n0, t0] of tries) {
			const [n, t] = [n0 * k, t0 * k];
			const at: Pt = [w.at[0] + w.normal[0] * n + w.tangent[0] * t, w.at[1] + w.normal[1] * n + w.tangent[1] * t];
			const box = grow(labelBox({ ...w, at }, sizes));
			const count = hits(box);
			if (!best || count < best.n) best = { at, box, n: count };
			if (count === 0) break;
		}
		placed.push(best!.box);
		out.push({ kind: w.kind, text: w.text, at: best!.at });
	}
	return out;
}
