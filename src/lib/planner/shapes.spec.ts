import { describe, expect, it } from 'vitest';
import { edgeLength, lShape, rectangle, removeVertex, setEdgeLength, splitEdge, splitSection } from './shapes';

const shoelace = (o: [number, number][]) =>
	Math.abs(o.reduce((s, p, i) => s + p[0] * o[(i + 1) % o.length][1] - o[(i + 1) % o.length][0] * p[1], 0)) / 2;

describe('outline shapes', () => {
	it('build a rectangle and an L with the notch cut away', () => {
		expect(shoelace(rectangle(12, 10))).toBe(120);
		// 16 × 12 minus a 6 × 5 notch = 192 − 30 = 162
		expect(shoelace(lShape(16, 12, 6, 5))).toBe(162);
		expect(lShape(16, 12, 6, 5)).toHaveLength(6);
	});

	it('set an edge length by moving its end vertex', () => {
		const r = setEdgeLength(rectangle(12, 10), 0, 14);
		expect(r[1]).toEqual([14, 0]);
		expect(edgeLength(r, 0)).toBe(14);
		expect(r[2]).toEqual([12, 10]); // only one vertex moves
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
		const u: [number, number][] = [[0, 0], [30, 0], [30, 10], [20, 10], [20, 4], [10, 4], [10, 10], [0, 10]];
		expect(splitSection(u, 0.5)).not.toBeNull(); // cut at x = 15 crosses the base only: fine
		const tall: [number, number][] = [[0, 0], [10, 0], [10, 30], [6, 30], [6, 12], [4, 12], [4, 30], [0, 30]];
		expect(splitSection(tall, 0.5)).toBeNull(); // cut at y = 15 crosses both arms
	});
});
