import { describe, expect, it } from 'vitest';
import {
	areaLeftOf,
	clipVertical,
	fromFrame,
	interiorPoint,
	isReflex,
	perimeter,
	pointInPolygon,
	segmentRelation,
	signedArea,
	toFrame,
	type Frame,
	type Pt
} from './polygon';

import { ELL as ell, rect as rectAt } from './test-plans';

const rect: Pt[] = rectAt(0, 0, 20, 12);
// ell: a 24 × 18 rectangle less an 8 × 6 notch at the origin.
const eps = 1e-9;

describe('area and perimeter', () => {
	it('measures a rectangle', () => {
		expect(signedArea(rect)).toBe(240); // 20 × 12, counter-clockwise
		expect(signedArea([...rect].reverse())).toBe(-240); // clockwise
		expect(perimeter(rect)).toBe(64); // 2 × (20 + 12)
	});

	it('measures an L with a notch', () => {
		expect(signedArea(ell)).toBe(384); // 24 × 18 − 8 × 6 = 432 − 48
		expect(perimeter(ell)).toBe(84); // 16 + 18 + 24 + 12 + 8 + 6
	});
});

describe('segment relations', () => {
	it('tells crossing, touching, overlapping and apart', () => {
		expect(segmentRelation([0, 0], [2, 2], [0, 2], [2, 0], eps)).toBe('cross');
		expect(segmentRelation([0, 0], [2, 0], [2, 0], [3, 1], eps)).toBe('touch');
		expect(segmentRelation([0, 0], [4, 0], [2, 0], [6, 0], eps)).toBe('overlap');
		expect(segmentRelation([0, 0], [1, 0], [2, 0], [3, 0], eps)).toBe('none');
		expect(segmentRelation([0, 0], [1, 0], [0, 1], [1, 1], eps)).toBe('none');
	});
});

describe('point in polygon', () => {
	it('tells inside, outside and on the boundary', () => {
		expect(pointInPolygon([5, 5], rect, eps)).toBe('inside');
		expect(pointInPolygon([25, 5], rect, eps)).toBe('outside');
		expect(pointInPolygon([20, 5], rect, eps)).toBe('boundary');
		expect(pointInPolygon([4, 3], ell, eps)).toBe('outside'); // inside the notch
	});

	it('finds a point strictly inside', () => {
		expect(pointInPolygon(interiorPoint(ell, eps), ell, eps)).toBe('inside');
		expect(
			pointInPolygon(
				interiorPoint(
					[
						[0, 0],
						[10, 0],
						[0, 10]
					],
					eps
				),
				[
					[0, 0],
					[10, 0],
					[0, 10]
				],
				eps
			)
		).toBe('inside');
	});
});

describe('clipping', () => {
	it('keeps only the interior where a line runs along an edge', () => {
		// x = 8 runs along the notch edge from y 0 to 6: only y 6..18 is inside.
		expect(clipVertical(ell, 8, eps)).toEqual([[6, 18]]);
		expect(clipVertical(ell, 16, eps)).toEqual([[0, 18]]);
		expect(clipVertical(rect, 25, eps)).toEqual([]);
	});

	it('measures the area left of a line', () => {
		expect(areaLeftOf(rect, 5)).toBeCloseTo(60, 12); // 5 × 12
		expect(areaLeftOf(ell, 8)).toBeCloseTo(96, 12); // 8 × 12 above the notch
		expect(areaLeftOf(ell, 30)).toBeCloseTo(384, 12); // the whole L
	});
});

describe('corners and frames', () => {
	it('finds the re-entrant corner of the L', () => {
		const reflex = ell.map((_, i) => isReflex(ell, i, 1));
		expect(reflex).toEqual([false, false, false, false, false, true]); // vertex 5 is (8, 6)
	});

	it('maps to a frame and back', () => {
		const f: Frame = { origin: [3, 4], t: [0.6, 0.8], n: [-0.8, 0.6] };
		const q = toFrame(f, [10, -2]);
		const p = fromFrame(f, q);
		expect(p[0]).toBeCloseTo(10, 12);
		expect(p[1]).toBeCloseTo(-2, 12);
	});
});
