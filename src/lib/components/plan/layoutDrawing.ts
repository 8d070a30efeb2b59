// The layout drawing as plain shapes in a box: the top view with house, joints, cold joints,
// stakes, corner letters, board ids, edge lengths and diagonals. The plan page draws it as SVG and
// the PDF with pdfkit, so both show one drawing. Plan y runs down the page, as in the editor.

import type { PlanResult } from '$lib/plan';
import { tapeLength } from '$lib/plan/format';
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
	/** Drawing units per plan unit (ft or m). */
	scale: number;
}

export type DrawingPlan = Pick<PlanResult, 'units' | 'geometry' | 'joints' | 'forms' | 'elevations'>;

/** Room around the slab for letters, board ids and stake numbers, in drawing units. */
const MARGIN = 34;

export function layoutDrawing(r: DrawingPlan, sheet: LayoutSheet, box: { width: number; height: number }): LayoutDrawing {
	const pts = r.geometry.sections.flatMap((s) => s.outline);
	const [x0, x1] = [Math.min(...pts.map((p) => p[0])), Math.max(...pts.map((p) => p[0]))];
	const [y0, y1] = [Math.min(...pts.map((p) => p[1])), Math.max(...pts.map((p) => p[1]))];
	const scale = Math.min((box.width - 2 * MARGIN) / Math.max(x1 - x0, 1e-9), (box.height - 2 * MARGIN) / Math.max(y1 - y0, 1e-9));
	const height = Math.min(box.height, (y1 - y0) * scale + 2 * MARGIN);
	const width = Math.min(box.width, (x1 - x0) * scale + 2 * MARGIN);
	const P = (p: readonly [number, number]): Pt => [MARGIN + (p[0] - x0) * scale, MARGIN + (p[1] - y0) * scale];
	const line = (a: readonly [number, number], b: readonly [number, number]): DrawnLine => ({ from: P(a), to: P(b) });

	const labels: DrawnLabel[] = [];
	const house: DrawnLine[] = [];
	let high: DrawnLine | null = null;
	const freestanding = r.geometry.houseEdges.length === 0;
	const cornerAt = new Map<string, DrawnLabel>();
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
				const label: DrawnLabel = { kind: 'corner', text, at: [at[0] + (bis[0] / k) * 14, at[1] + (bis[1] / k) * 14] };
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
				labels.push({ kind: 'high', text: 'HIGH SIDE', at: [at[0] + nn[0] * 22, at[1] + nn[1] * 22] });
			}
			if (e.kind === 'coldJoint') continue;
			const mid = P([(a[0] + b[0]) / 2, (a[1] + b[1]) / 2]);
			const nn = out(e.index);
			// Edge lengths sit just inside the slab, clear of the stakes outside it.
			labels.push({ kind: 'length', text: tapeLength(e.length, r.units), at: [mid[0] - nn[0] * 10, mid[1] - nn[1] * 10] });
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
		if (!run.formed || run.kind === 'bulkhead') continue;
		// A third of the way along, so the id does not sit on the length label's line of sight.
		const at = P([run.from[0] + (run.to[0] - run.from[0]) * 0.35, run.from[1] + (run.to[1] - run.from[1]) * 0.35]);
		labels.push({ kind: 'board', text: run.id, at: [at[0] + out[0] * 22, at[1] + out[1] * 22] });
	}
	const stakes = r.elevations.stakes.map((s) => ({ id: s.id, at: P([s.x, s.y]) }));
	for (const s of stakes) {
		const out = runOut.get(r.elevations.stakes.find((x) => x.id === s.id)!.run) ?? [0, 0];
		labels.push({ kind: 'stake', text: s.id, at: [s.at[0] + out[0] * 9, s.at[1] + out[1] * 9] });
	}
	const diagonals = sheet.diagonals.flatMap((d) => {
		const o = r.geometry.sections[d.section].outline;
		return [line(o[0], o[2]), line(o[1], o[3])];
	});
	const startCorner = sheet.corners.find((c) => c.label === sheet.start.corner);
	return {
		width,
		height,
		scale,
		slabs: r.geometry.sections.map((s) => s.outline.map(P)),
		house,
		high,
		joints: r.joints.sections.flatMap((s) => s.lines.map((l) => line(l.from, l.to))),
		coldJoints: r.geometry.coldJoints.map((j) => line(j.from, j.to)),
		diagonals,
		stakes,
		start: startCorner ? P(startCorner.at) : null,
		labels
	};
}
