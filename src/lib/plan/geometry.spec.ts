import { describe, expect, it } from 'vitest';
import { findColdJoints, freeIntervals, geometryIssues, layoutSections, outlineProblem, outlinesOverlap } from './geometry';
import type { Pt } from './polygon';

const eps = 1e-9;
const rect = (x0: number, y0: number, w: number, h: number): Pt[] => [
	[x0, y0],
	[x0 + w, y0],
	[x0 + w, y0 + h],
	[x0, y0 + h]
];

describe('outline validity', () => {
	it('accepts simple outlines in either direction', () => {
		expect(outlineProblem(rect(0, 0, 20, 12), eps)).toBeNull();
		expect(outlineProblem(rect(0, 0, 20, 12).reverse(), eps)).toBeNull();
	});

	it('rejects self-intersecting, degenerate and folded outlines', () => {
		expect(
			outlineProblem(
				[
					[0, 0],
					[10, 0],
					[2, 8],
					[8, 10]
				],
				eps
			)
		).toMatch(/cross/); // edges 1 and 3 meet near (4.4, 5.6)
		expect(
			outlineProblem(
				[
					[0, 0],
					[10, 0],
					[10, 0],
					[0, 10]
				],
				eps
			)
		).toMatch(/same point/);
		expect(
			outlineProblem(
				[
					[0, 0],
					[5, 0],
					[10, 0]
				],
				eps
			)
		).toMatch(/no area/);
		expect(
			outlineProblem(
				[
					[0, 0],
					[10, 0],
					[4, 0],
					[4, 5]
				],
				eps
			)
		).toMatch(/fold back/);
		// A figure eight touching itself at one vertex.
		expect(
			outlineProblem(
				[
					[0, 0],
					[4, 0],
					[2, 2],
					[4, 4],
					[0, 4],
					[2, 2]
				],
				eps
			)
		).toMatch(/touch/);
	});
});

describe('overlapping sections', () => {
	it('allows sections that only share an edge', () => {
		expect(outlinesOverlap(rect(0, 0, 10, 12), rect(10, 0, 10, 12), eps)).toBe(false);
		expect(outlinesOverlap(rect(0, 0, 10, 12), rect(30, 0, 10, 12), eps)).toBe(false);
	});

	it('catches crossing, nested and identical sections', () => {
		expect(outlinesOverlap(rect(0, 0, 10, 12), rect(5, 5, 10, 12), eps)).toBe(true);
		expect(outlinesOverlap(rect(0, 0, 10, 12), rect(2, 2, 3, 3), eps)).toBe(true);
		expect(outlinesOverlap(rect(0, 0, 10, 12), rect(0, 0, 10, 12), eps)).toBe(true);
	});

	it('reports each problem at the outline it concerns', () => {
		const issues = geometryIssues([
			rect(0, 0, 10, 12),
			rect(5, 0, 10, 12),
			[
				[0, 0],
				[1, 0],
				[0, 1],
				[1, 1]
			]
		]);
		expect(issues).toContainEqual(expect.objectContaining({ path: 'sections.1.outline' }));
		expect(issues).toContainEqual(expect.objectContaining({ path: 'sections.2.outline' }));
	});
});

describe('cold joints', () => {
	it('finds the shared edge of two sections', () => {
		const [j] = findColdJoints([rect(0, 0, 10, 12), rect(10, 0, 10, 12)], eps);
		expect(j.sections).toEqual([0, 1]);
		expect(j.edges).toEqual([1, 3]); // right edge of the first, left edge of the second
		expect(j.length).toBeCloseTo(12, 12);
	});

	it('finds a shared piece of a longer edge', () => {
		const joints = findColdJoints([rect(0, 0, 20, 10), rect(5, 10, 10, 10)], eps);
		expect(joints).toHaveLength(1);
		expect(joints[0].length).toBeCloseTo(10, 12); // x 5..15 along y = 10
		// The first section's top edge runs 20 → 0; the shared part is t 0.25..0.75.
		expect(freeIntervals([20, 10], [0, 10], joints, eps)).toEqual([
			[0, 0.25],
			[0.75, 1]
		]);
	});

	it('leaves shared edges out of the outer perimeter', () => {
		const l = layoutSections([rect(0, 0, 10, 12), rect(10, 0, 10, 12)]);
		expect(l.outerPerimeter).toBeCloseTo(64, 9); // 2 × (10 + 12) × 2 − 2 × 12, as one 20 × 12
		expect(l.sections.map((s) => s.area)).toEqual([120, 120]);
	});
});
