// Form boards, cut list, stakes and screws.

import type { Layout } from './geometry';
import type { Model } from './model';
import { dist, lerp } from './polygon';
import type { Pt } from './polygon';
import { countUp, length, mToPlan, small } from './units';
import type { Length, Small } from './units';
import { ascending, filterList, mapList, times } from './util';

/** Saw kerf lost per cut, 3 mm (⅛ in); from memory. */
export const KERF_M = 0.003;
/** Screws per board fixed to a stake; from memory. */
export const SCREWS_PER_FIXING = 2;
/** Board and slab within this count as flush, 3 mm (⅛ in); from memory. */
const FLUSH_M = 0.003;
/** A cleat across each splice, 2 ft (0.6 m) of the same board; common practice, no published source. */
export const CLEAT_M = 0.6;
/** Screws through a cleat, two each side of the splice; from memory. */
export const SCREWS_PER_CLEAT = 4;
/** Screws through a lapping board into the end of the other at a corner; from memory. */
export const SCREWS_PER_CORNER = 2;

export type RunKind = 'outer' | 'house' | 'bulkhead';

export interface Run {
	id: string;
	kind: RunKind;
	/** The section whose pour this form holds. */
	section: number;
	edge: number;
	from: Pt;
	to: Pt;
	length: number;
	formed: boolean;
}

export interface StakePoint {
	id: string;
	run: string;
	at: Pt;
	kind: 'corner' | 'splice' | 'line';
}

/** A bulkhead inside a section where a pour is split, metres. */
export interface SplitBulkhead {
	section: number;
	from: Pt;
	to: Pt;
}

/** Outer edges, house edges, the bulkheads at each cold joint for the earlier pour, and those of split pours. */
export function formRuns(m: Model, layout: Layout, splits: readonly SplitBulkhead[] = []): Run[] {
	const runs: Run[] = [];
	const isHouse = (s: number, e: number) => m.houseEdges.some((h) => h.section === s && h.edge === e);
	const add = (kind: RunKind, section: number, edge: number, from: Pt, to: Pt, formed: boolean) =>
		runs.push({ id: `R${runs.length + 1}`, kind, section, edge, from, to, length: dist(from, to), formed });
	for (const sec of layout.sections)
		for (const e of sec.edges) {
			const kind: RunKind = isHouse(sec.index, e.index) ? 'house' : 'outer';
			const formed = kind === 'outer' || m.houseEdgeFormed;
			for (const [t0, t1] of e.free) add(kind, sec.index, e.index, lerp(e.from, e.to, t0), lerp(e.from, e.to, t1), formed);
		}
	for (const j of layout.coldJoints) add('bulkhead', j.sections[0], j.edges[0], j.from, j.to, true);
	for (const b of splits) add('bulkhead', b.section, -1, b.from, b.to, true);
	return runs;
}

/**
 * An empty table of chain heads (−1) for about `n` entries: a power of two at least twice `n`, so
 * a hash masked to its size picks a bucket and chains stay short. A table instead of a Map: the
 * Map grows by copying itself as it fills, which was most of what placing stakes allocated.
 */
function bucketHeads(n: number): Int32Array {
	let size = 16;
	while (size < 2 * n) size *= 2;
	return new Int32Array(size).fill(-1);
}

/**
 * Board length each formed run needs, by the run's place in `runs`. At every corner one board runs
 * past the other by its thickness; a run takes the lap at its start unless that would cost it a
 * splice a stock board avoids, and then the run ending at that corner takes it instead (common
 * practice).
 */
export function lapLengths(runs: readonly Run[], t: number, maxStock: number): { lengths: Float64Array; laps: number } {
	const n = runs.length;
	const lengths = new Float64Array(n);
	for (let i = 0; i < n; i++) lengths[i] = runs[i].length;
	let laps = 0;
	const formed = (r: Run) => r.formed && r.kind !== 'bulkhead';
	// Run ends share exact vertices; a 0.1 mm grid absorbs float noise. Runs are bucketed by a hash
	// of the grid point (points that share a bucket are told apart by comparing them) and chained,
	// latest first: `latest` holds a bucket's last run, `before` the one listed ahead of each
	// (−1: none), so no list is made per bucket.
	const q = (v: number) => Math.round(v * 1e4);
	const latest = bucketHeads(n);
	const mask = latest.length - 1;
	const bucket = (p: Pt) => (Math.imul(q(p[0]), 73856093) ^ Math.imul(q(p[1]), 19349663)) & mask;
	const before = new Int32Array(n);
	for (let i = 0; i < n; i++) {
		if (!formed(runs[i])) continue;
		const b = bucket(runs[i].to);
		before[i] = latest[b];
		latest[b] = i;
	}
	/** The last run listed that ends at p, or −1. */
	const runEndingAt = (p: Pt) => {
		for (let i = latest[bucket(p)]; i >= 0; i = before[i]) {
			const to = runs[i].to;
			if (q(to[0]) === q(p[0]) && q(to[1]) === q(p[1])) return i;
		}
		return -1;
	};
	for (let i = 0; i < n; i++) {
		const r = runs[i];
		if (!formed(r)) continue;
		const prev = runEndingAt(r.from);
		if (prev < 0) continue; // a free end (against the house): no corner to lap
		laps++;
		const own = lengths[i];
		const other = lengths[prev];
		const costs = (len: number) => countUp((len + t) / maxStock) > countUp(len / maxStock);
		if (costs(own) && !costs(other)) lengths[prev] = other + t;
		else lengths[i] = own + t;
	}
	return { lengths, laps };
}

/** How many equal pieces, none longer than the longest stock board, a board run of `len` takes. */
const pieceCount = (len: number, maxStock: number) => Math.max(1, countUp(len / maxStock));

/** Equal pieces no longer than the longest stock board. */
export function splitRun(len: number, maxStock: number): number[] {
	const n = pieceCount(len, maxStock);
	return times(n, () => len / n);
}

export interface Board {
	stock: number;
	cuts: { run: string; length: number }[];
	left: number;
}

/** First-fit decreasing into stock lengths: reuse offcuts, else open the shortest board that fits. */
export function cutBoards(pieces: { run: string; length: number }[], stock: readonly number[], kerf = KERF_M): Board[] {
	const boards: Board[] = [];
	const sorted = [...stock].sort(ascending);
	// Longest first (`ascending` with the pieces swapped: it allocates nothing per comparison).
	for (const p of [...pieces].sort((a, b) => ascending(b.length, a.length))) {
		let best: Board | undefined;
		for (const b of boards) if (b.left >= p.length - 1e-9 && (!best || b.left < best.left)) best = b;
		if (!best) {
			let len = sorted[sorted.length - 1];
			for (const s of sorted)
				if (s >= p.length - 1e-9) {
					len = s;
					break;
				}
			best = { stock: len, cuts: [], left: len };
			boards.push(best);
		}
		best.cuts.push(p);
		best.left = Math.max(0, best.left - p.length - kerf);
	}
	return boards;
}

/** Stakes along one run: both ends, every splice, and enough between that no gap exceeds spacing. */
export function runStakes(r: Run, splices: number[], spacing: number): { at: Pt; kind: StakePoint['kind'] }[] {
	const out: { at: Pt; kind: StakePoint['kind'] }[] = [];
	eachStake(r, splices, spacing, (at, kind) => void out.push({ at, kind }));
	return out;
}

/** runStakes without the list: calls visit for each stake in order (the wizard's hot path). */
function eachStake(r: Run, splices: readonly number[], spacing: number, visit: (at: Pt, kind: StakePoint['kind']) => void) {
	visit(r.from, 'corner');
	let prev = 0;
	for (let i = 0; i <= splices.length; i++) {
		const last = i === splices.length;
		const mark = last ? 1 : Math.min(splices[i], r.length) / r.length;
		const gaps = Math.max(1, countUp(((mark - prev) * r.length) / spacing));
		for (let k = 1; k < gaps; k++) visit(lerp(r.from, r.to, prev + ((mark - prev) * k) / gaps), 'line');
		visit(lerp(r.from, r.to, mark), last ? 'corner' : 'splice');
		prev = mark;
	}
}

export interface FormsResult {
	lumber: Model['forms']['lumber'];
	boardDepth: Small;
	thickness: Small;
	fit: 'flush' | 'shallow' | 'deep';
	difference: Small;
	note: string;
	runs: { id: string; kind: RunKind; section: number; edge: number; formed: boolean; length: Length; from: Pt; to: Pt }[];
	formLength: Length;
	buy: { stock: Length; count: number }[];
	cutList: { stock: Length; cuts: { run: string; length: Length }[]; offcut: Length }[];
	stakes: { count: number; length: Small; spacing: Length };
	screws: number;
	/** Cleats across splices, each CLEAT_M of board. */
	cleats: number;
	/** Corners where one board laps the other. */
	corners: number;
	isolationStrip: Length;
}

export function formFit(depth: number, thickness: number): Pick<FormsResult, 'fit' | 'difference' | 'note'> {
	const d = depth - thickness;
	const difference = small(Math.abs(d));
	if (Math.abs(d) <= FLUSH_M) return { fit: 'flush', difference, note: 'The board depth matches the slab: set its top at finished height.' };
	if (d < 0)
		return {
			fit: 'shallow',
			difference,
			note: 'The board is shallower than the slab: set its top at finished height and dig the ground inside it down to full depth (a shallow trench under the board); bank soil outside so concrete cannot run out beneath.'
		};
	return {
		fit: 'deep',
		difference,
		note: 'The board is deeper than the slab: set its top at finished height and let the bottom sit below grade, or fill the extra depth with base inside the forms.'
	};
}

/** Total length of the runs left unformed (poured against an isolation strip). */
function unformedLength(runs: readonly Run[]): number {
	let total = 0;
	for (const r of runs) if (!r.formed) total += r.length;
	return total;
}

export function computeForms(m: Model, layout: Layout, splits: readonly SplitBulkhead[] = []): { forms: FormsResult; stakes: StakePoint[] } {
	const runs = formRuns(m, layout, splits);
	const maxStock = m.forms.stockLengths[m.forms.stockLengths.length - 1];
	const pieces: { run: string; length: number }[] = [];
	const stakes: StakePoint[] = [];
	let fixings = 0;
	// A point shared by two runs gets one stake: points within 0.1 mm are the same. Points sit in
	// 1 mm cells; a lookup visits only the cells its ±0.1 mm box touches (one, near a cell border
	// two or four), so float noise at a border cannot make two stakes of one. Cells are hashed to
	// buckets of a table (cells sharing a bucket only cost a distance check). The stakes in one
	// bucket are chained: `lastIn` holds its latest stake, `before[i]` the one ahead of stake i
	// (−1: none). Sized for about one stake per spacing of form and two per run; more only make
	// the chains longer.
	let expected = 0;
	for (const r of runs) if (r.formed) expected += r.length / m.forms.stakeSpacing + 2;
	const lastIn = bucketHeads(expected);
	const mask = lastIn.length - 1;
	const before: number[] = [];
	const bucket = (i: number, j: number) => (Math.imul(i, 73856093) ^ Math.imul(j, 19349663)) & mask;
	const near = (p: Pt, i: number, j: number) => {
		for (let s = lastIn[bucket(i, j)]; s >= 0; s = before[s]) if (dist(p, stakes[s].at) <= 1e-4) return true;
		return false;
	};
	/** Whether a stake stands within 0.1 mm of p; if none does, the next stake (at p) is entered. */
	const taken = (p: Pt) => {
		const i0 = Math.floor((p[0] - 1e-4) * 1e3);
		const i1 = Math.floor((p[0] + 1e-4) * 1e3);
		const j0 = Math.floor((p[1] - 1e-4) * 1e3);
		const j1 = Math.floor((p[1] + 1e-4) * 1e3);
		if (near(p, i0, j0) || (i1 !== i0 && near(p, i1, j0)) || (j1 !== j0 && (near(p, i0, j1) || (i1 !== i0 && near(p, i1, j1))))) return true;
		const k = bucket(Math.floor(p[0] * 1e3), Math.floor(p[1] * 1e3));
		before.push(lastIn[k]);
		lastIn[k] = stakes.length;
		return false;
	};
	let formLength = 0;
	let cleats = 0;
	const { lengths: boardLength, laps: corners } = lapLengths(runs, m.forms.boardThickness, maxStock);
	for (let k = 0; k < runs.length; k++) {
		const r = runs[k];
		if (!r.formed) continue;
		formLength += r.length;
		// splitRun's pieces, counted rather than listed (this runs on every keystroke).
		const board = boardLength[k];
		const n = pieceCount(board, maxStock);
		const piece = board / n;
		const splices: number[] = [];
		for (let i = 0; i < n; i++) {
			pieces.push({ run: r.id, length: piece });
			if (i) {
				splices.push(piece * i);
				pieces.push({ run: `${r.id} cleat`, length: Math.min(CLEAT_M, maxStock) });
				cleats++;
			}
		}
		eachStake(r, splices, m.forms.stakeSpacing, (at, kind) => {
			fixings += kind === 'splice' ? 2 : 1;
			if (!taken(at)) stakes.push({ id: `S${stakes.length + 1}`, run: r.id, at, kind });
		});
	}
	const boards = cutBoards(pieces, m.forms.stockLengths);
	const fit = formFit(m.forms.depth, m.thickness);
	const u = m.units;
	const P = (p: Pt): Pt => [mToPlan(p[0], u), mToPlan(p[1], u)];
	return {
		stakes,
		forms: {
			lumber: m.forms.lumber,
			boardDepth: small(m.forms.depth),
			thickness: small(m.thickness),
			fit: fit.fit,
			difference: fit.difference,
			note: fit.note,
			runs: mapList(runs, (r) => ({
				id: r.id,
				kind: r.kind,
				section: r.section,
				edge: r.edge,
				formed: r.formed,
				length: length(r.length),
				from: P(r.from),
				to: P(r.to)
			})),
			formLength: length(formLength),
			buy: filterList(
				mapList(m.forms.stockLengths, (s) => ({ stock: length(s), count: boards.filter((b) => b.stock === s).length })),
				(b) => b.count > 0
			),
			cutList: mapList(boards, (b) => ({
				stock: length(b.stock),
				cuts: mapList(b.cuts, (c) => ({ run: c.run, length: length(c.length) })),
				offcut: length(b.left)
			})),
			stakes: { count: stakes.length, length: small(m.forms.stakeLength), spacing: length(m.forms.stakeSpacing) },
			screws: fixings * SCREWS_PER_FIXING + cleats * SCREWS_PER_CLEAT + corners * SCREWS_PER_CORNER,
			cleats,
			corners,
			isolationStrip: length(unformedLength(runs))
		}
	};
}
