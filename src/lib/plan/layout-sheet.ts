// The layout sheet: what someone with a tape and stakes needs to set out the forms. Corners carry
// the letters of the wizard's edge table (A, B, C… around each section), stakes the ids of the
// stake-mark table, boards the run ids of the cut list. Pure: it reads a computed plan only.

import type { PlanResult } from './index';
import { dist as d, type Pt } from './polygon';
import { M_PER_FT, length } from './units';
import type { Length, Units } from './units';
import { tapeLength } from './format';

/** Corner letter as the edge table writes it: A…Z, then A1, B1… */
export const cornerLetter = (i: number) => String.fromCharCode(65 + (i % 26)) + (i >= 26 ? Math.floor(i / 26) : '');

/** The tape reading every plan view uses (the layout sheet, the stake marks, the print view, the PDF). */
export { tapeLength };

export interface SheetCorner {
	section: number;
	vertex: number;
	/** "A", or "2A" when the plan has more than one section. */
	label: string;
	at: Pt;
}

export interface SquareCheck {
	corner: string;
	/** The two edges that meet at the corner, as the edge table names them. */
	edges: [string, string];
	legA: Length;
	legB: Length;
	diagonal: Length;
	/** 3-4-5, 6-8-10 …: the legs and diagonal in the ratio of a right triangle. */
	ratio: string | null;
	/** The plan's angle at the corner, degrees. */
	angle: number;
}

export interface LayoutSheet {
	units: Units;
	corners: SheetCorner[];
	start: { corner: string; why: string };
	/** A freestanding pad's high side ("A–B"), where the top is highest; null along a house. */
	highEdge: string | null;
	squareCheck: SquareCheck | null;
	diagonals: {
		section: number;
		name: string;
		first: { from: string; to: string; length: Length };
		second: { from: string; to: string; length: Length };
		square: boolean;
	}[];
	boards: { id: string; kind: 'outer' | 'house' | 'bulkhead'; formed: boolean; edge: string; length: Length }[];
	stakes: { id: string; board: string; from: string; along: string; distance: Length }[];
}

/** Right-triangle legs to try at the first corner, largest first, in the plan's length unit. */
const CHECKS: Record<Units, { k: number; name: string }[]> = {
	imperial: [
		{ k: 2, name: '6-8-10 ft' },
		{ k: 1, name: '3-4-5 ft' },
		{ k: 0.5, name: '1½-2-2½ ft' }
	],
	metric: [
		{ k: 1, name: '3-4-5 m' },
		{ k: 0.3, name: '0.9-1.2-1.5 m' },
		{ k: 0.2, name: '0.6-0.8-1.0 m' }
	]
};

/** Lengths are given in the plan's unit; Length carries both systems. */
const planLength = (v: number, u: Units) => length(u === 'imperial' ? v * M_PER_FT : v);

/** An edge by its corner letters as the layout sheet names it: "A–B", or "2A–2B" with several pours. */
export function sheetEdgeName(g: Pick<PlanResult['geometry'], 'sections'>, s: number, e: number): string {
	const label = (v: number) => `${g.sections.length > 1 ? s + 1 : ''}${cornerLetter(v)}`;
	return `${label(e)}–${label((e + 1) % g.sections[s].outline.length)}`;
}

export function layoutSheet(r: Pick<PlanResult, 'units' | 'geometry' | 'forms' | 'elevations'>): LayoutSheet {
	const u = r.units;
	const many = r.geometry.sections.length > 1;
	const label = (s: number, v: number) => `${many ? s + 1 : ''}${cornerLetter(v)}`;
	const outline = (s: number) => r.geometry.sections[s].outline;
	const edgeName = (s: number, e: number) => sheetEdgeName(r.geometry, s, e);
	const corners = r.geometry.sections.flatMap((s) => s.outline.map((at, v) => ({ section: s.index, vertex: v, label: label(s.index, v), at })));

	// Start where the house wall begins (the wall is the one straight line already on site), else
	// at the high edge.
	const ref = r.geometry.houseEdges[0] ?? r.geometry.highEdge;
	const start = {
		corner: label(ref.section, ref.edge),
		why: r.geometry.houseEdges.length
			? `where edge ${edgeName(ref.section, ref.edge)} starts along the house wall`
			: `the start of the high edge ${edgeName(ref.section, ref.edge)}`
	};

	const o = outline(ref.section);
	const n = o.length;
	const at = o[ref.edge];
	const next = o[(ref.edge + 1) % n];
	const prev = o[(ref.edge + n - 1) % n];
	const [la, lb] = [d(at, next), d(at, prev)];
	const cos = ((next[0] - at[0]) * (prev[0] - at[0]) + (next[1] - at[1]) * (prev[1] - at[1])) / (la * lb);
	const angle = (Math.acos(Math.max(-1, Math.min(1, cos))) * 180) / Math.PI;
	const square = Math.abs(angle - 90) < 0.05;
	// Legs in 4:3 with the 4 along the longer edge; off square, the law of cosines gives the diagonal.
	const fit = CHECKS[u].find(({ k }) => 4 * k <= Math.max(la, lb) + 1e-9 && 3 * k <= Math.min(la, lb) + 1e-9);
	let squareCheck: SquareCheck | null = null;
	if (fit) {
		const [a, b] = la >= lb ? [4 * fit.k, 3 * fit.k] : [3 * fit.k, 4 * fit.k];
		const c = Math.sqrt(a * a + b * b - 2 * a * b * cos);
		squareCheck = {
			corner: start.corner,
			edges: [edgeName(ref.section, ref.edge), edgeName(ref.section, (ref.edge + n - 1) % n)],
			legA: planLength(a, u),
			legB: planLength(b, u),
			diagonal: planLength(c, u),
			ratio: square ? fit.name : null,
			angle
		};
	}

	const diagonals = r.geometry.sections
		.filter((s) => s.outline.length === 4)
		.map((s) => {
			const [p0, p1, p2, p3] = s.outline;
			const [d1, d2] = [d(p0, p2), d(p1, p3)];
			return {
				section: s.index,
				name: s.name,
				first: { from: label(s.index, 0), to: label(s.index, 2), length: planLength(d1, u) },
				second: { from: label(s.index, 1), to: label(s.index, 3), length: planLength(d2, u) },
				// Equal diagonals make a parallelogram a rectangle: within 1/16 in or 1 mm reads equal.
				square: Math.abs(d1 - d2) < (u === 'imperial' ? 1 / 192 : 0.001)
			};
		});

	const runs = new Map(r.forms.runs.map((x) => [x.id, x]));
	// A bulkhead that splits a pour inside a section lies on no outline edge (edge −1).
	const along = (x: (typeof r.forms.runs)[number]) => (x.edge >= 0 ? edgeName(x.section, x.edge) : `bulkhead splitting pour ${x.section + 1}`);
	const boards = r.forms.runs.map((x) => ({ id: x.id, kind: x.kind, formed: x.formed, edge: along(x), length: x.length }));
	const stakes = r.elevations.stakes.map((s) => {
		const run = runs.get(s.run);
		if (!run) return { id: s.id, board: s.run, from: '', along: '', distance: planLength(0, u) };
		const onEdge = run.edge >= 0;
		const corner = onEdge ? outline(run.section)[run.edge] : run.from;
		return {
			id: s.id,
			board: run.id,
			from: onEdge ? label(run.section, run.edge) : `the start of ${run.id}`,
			along: along(run),
			distance: planLength(d(corner, [s.x, s.y]), u)
		};
	});

	const highEdge = r.geometry.houseEdges.length ? null : edgeName(r.geometry.highEdge.section, r.geometry.highEdge.edge);
	return { units: u, corners, start, highEdge, squareCheck, diagonals, boards, stakes };
}
