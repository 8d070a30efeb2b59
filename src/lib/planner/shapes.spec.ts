import { describe, expect, it } from 'vitest';
import { edgeLength, edgeLengthProblem, edgesAfter, lShape, rectangle, removeVertex, setEdgeLength, splitEdge, splitSection } from './shapes';

const shoelace = (o: [number, number][]) => Math.abs(o.reduce((s, p, i) => s + p[0] * o[(i + 1) % o.length][1] - o[(i + 1) % o.length][0] * p[1], 0)) / 2;

describe('outline shapes', () => {
	it('build a rectangle and an L with the notch cut away', () => {
		expect(shoelace(rectangle(12, 10))).toBe(120);
		// 16 × 12 minus a 6 × 5 notch = 192 − 30 = 162
		expect(shoelace(lShape(16, 12, 6, 5))).toBe(162);
		expect(lShape(16, 12, 6, 5)).toHaveLength(6);
	});

	it('set an edge length by moving the whole far side, so a rectangle stays a rectangle', () => {
		const r = setEdgeLength(rectangle(12, 10), 0, 14);
		expect(r).toEqual([
			[0, 0],
			[14, 0],
			[14, 10],
			[0, 10]
		]);
		expect(shoelace(r)).toBe(140); // 14 × 10
		const back = setEdgeLength(rectangle(12, 10), 3, 8); // D–A runs from (0,10) to (0,0): A–B moves up 2
		expect(back).toEqual([
			[0, 2],
			[12, 2],
			[12, 10],
			[0, 10]
		]);
		// L notch C–D from 6 to 8 ft: the notch's far side D–E moves, the long side stays 16.
		const l = setEdgeLength(lShape(16, 12, 6, 5), 2, 8);
		expect(l).toEqual([
			[0, 0],
			[16, 0],
			[16, 7],
			[8, 7],
			[8, 12],
			[0, 12]
		]);
		expect(shoelace(l)).toBe(152); // 16 × 12 − 8 × 5
	});

	it('a lone corner of a slanted edge moves alone', () => {
		const tri: [number, number][] = [
			[0, 0],
			[4, 0],
			[0, 3]
		];
		const t = setEdgeLength(tri, 1, 10); // B–C is 5 long (3-4-5); doubled moves C to (-4, 6)
		expect(t).toEqual([
			[0, 0],
			[4, 0],
			[-4, 6]
		]);
		expect(edgeLength(t, 1)).toBe(10);
	});

	it('edges keep their walls through a split: both halves of a wall stay walls', () => {
		const before = [rectangle(20, 10)];
		const after = splitSection(rectangle(20, 10))!;
		// Edge 0 (0,0)–(20,0) is cut at x = 10: each piece has the half along y = 0.
		const refs = edgesAfter(before, after, [{ section: 0, edge: 0 }]);
		expect(refs).toHaveLength(2);
		for (const r of refs) {
			const o = after[r.section];
			const [a, b] = [o[r.edge], o[(r.edge + 1) % o.length]];
			expect(a[1]).toBe(0);
			expect(b[1]).toBe(0);
		}
		expect(refs.map((r) => r.section).sort()).toEqual([0, 1]);
		// An L around a house corner: both notch walls land on the piece that holds the notch.
		const l = lShape(16, 12, 6, 5);
		const pieces = splitSection(l)!;
		const walls = edgesAfter([l], pieces, [
			{ section: 0, edge: 2 },
			{ section: 0, edge: 3 }
		]);
		expect(walls).toHaveLength(2);
		expect(walls.map((w) => edgeLength(pieces[w.section], w.edge)).sort()).toEqual([5, 6]);
		// A removed section takes its edges with it.
		expect(edgesAfter(after, [after[1]], [{ section: 0, edge: 0 }])).toEqual([]);
	});

	it('add and remove vertices, never below three', () => {
		const s = splitEdge(rectangle(12, 10), 0);
		expect(s[1]).toEqual([6, 0]);
		expect(shoelace(s)).toBe(120);
		expect(removeVertex(removeVertex(s, 1), 0)).toHaveLength(3);
		expect(removeVertex(rectangle(1, 1).slice(0, 3), 0)).toHaveLength(3);
	});

	it('split a rectangle into two pours with the same total area', () => {
		const [a, b] = splitSection(rectangle(20, 10))!;
		expect(shoelace(a) + shoelace(b)).toBe(200);
		expect(shoelace(a)).toBe(100);
	});

	it('split an L across its long side, or refuse a cut that leaves pieces apart', () => {
		const l = lShape(16, 12, 6, 5);
		const [a, b] = splitSection(l, 0.25)!;
		expect(shoelace(a) + shoelace(b)).toBeCloseTo(162, 9);
		// A U shape cut through both arms would leave one side in two pieces.
		const u: [number, number][] = [
			[0, 0],
			[30, 0],
			[30, 10],
			[20, 10],
			[20, 4],
			[10, 4],
			[10, 10],
			[0, 10]
		];
		expect(splitSection(u, 0.5)).not.toBeNull(); // cut at x = 15 crosses the base only: fine
		const tall: [number, number][] = [
			[0, 0],
			[10, 0],
			[10, 30],
			[6, 30],
			[6, 12],
			[4, 12],
			[4, 30],
			[0, 30]
		];
		expect(splitSection(tall, 0.5)).toBeNull(); // cut at y = 15 crosses both arms
	});
});

describe('a length typed into the edge table', () => {
	it('says why it cannot be used instead of dropping it', () => {
		const o = rectangle(12, 10);
		expect(edgeLengthProblem(o, 0, 14, 'imperial')).toBeNull();
		expect(edgeLengthProblem(o, 0, -3, 'imperial')).toBe('Enter a length above 0 ft.');
		expect(edgeLengthProblem(o, 0, 0, 'metric')).toBe('Enter a length above 0 m.');
		expect(edgeLengthProblem(o, 0, 5000, 'imperial')).toMatch(/at most 1000 ft around/); // LIMITS.perimeter
		expect(edgeLengthProblem(o, 0, 400, 'imperial')).toMatch(/at most 3000 ft²/); // 400 × 10 = 4000 ft² > LIMITS.area
	});
});
