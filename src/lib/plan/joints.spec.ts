import { describe, expect, it } from 'vitest';
import { slopePlane } from './elevations';
import { breakpoints, computeJoints, jointDepth, jointSpacing, panelGrid } from './joints';
import { ELL, modelOf, rect } from './test-plans';

const IN = 0.0254;
const FT = 0.3048;

describe('ACI 302.1R spacing and depth', () => {
	it('spaces joints 24–36 × thickness', () => {
		const s = jointSpacing(4 * IN);
		expect(s.min / FT).toBeCloseTo(8, 12); // 24 × 4 in = 96 in, ACI 302.1R
		expect(s.max / FT).toBeCloseTo(12, 12); // 36 × 4 in = 144 in, ACI 302.1R
	});

	it('never spaces them over 18 ft', () => {
		expect(jointSpacing(8 * IN).max / FT).toBeCloseTo(18, 12); // 36 × 8 in = 24 ft > 18 ft cap, ACI 302.1R
	});

	it('cuts a quarter of the thickness, at least 1 in', () => {
		expect(jointDepth(6 * IN) / IN).toBeCloseTo(1.5, 12); // 6 / 4, ACI 302.1R
		expect(jointDepth(3.5 * IN) / IN).toBeCloseTo(1, 12); // ¼ × 3½ = ⅞ < 1 in minimum, ACI 302.1R
	});
});

describe('panel grid', () => {
	it('splits a 20 × 12 ft slab into two panels', () => {
		const g = panelGrid(rect(0, 0, 20, 12), 12, 8, 1e-9);
		expect(g.panels).toBe(2); // 20 / 12 → 2 along, 10 × 12 each
		expect(g.maxAspect).toBeCloseTo(1.2, 12); // 12 / 10 ≤ 1.5, ACI 302.1R
	});

	it('adds panels until none is longer than 1.5 × its width', () => {
		// 24 × 6: two 12 × 6 panels have aspect 2 > 1.5 (ACI 302.1R), three 8 × 6 have 1.33.
		const g = panelGrid(rect(0, 0, 24, 6), 12, 8, 1e-9);
		expect(g.panels).toBe(3);
		expect(g.maxAspect).toBeCloseTo(4 / 3, 12);
	});

	it('drops cuts that would leave slivers', () => {
		expect(breakpoints([0.5, 10], 0, 20, 8 / 3)).toEqual([0, 10, 20]);
	});
});

describe('joint lines', () => {
	it('runs joints from the re-entrant corner of the L', () => {
		const { m, layout } = modelOf({ units: 'imperial', sections: [{ outline: ELL }], houseEdge: { section: 0, edge: 4 } });
		const { joints } = computeJoints(m, layout, slopePlane(m, layout).frame);
		const lines = joints.sections[0].lines.map((l) => [...l.from, ...l.to].map((v) => Math.round(v * 1e6) / 1e6));
		// Max 12 ft (36 × 4 in): across at x = 8 (from the corner) and 16; along at y = 6 (from the corner).
		expect(lines).toEqual([
			[8, 6, 8, 18],
			[16, 0, 16, 18],
			[8, 6, 24, 6]
		]);
		expect(joints.sections[0].panels).toBe(5);
		expect(joints.sections[0].maxAspect).toBeLessThanOrEqual(1.5 + 1e-9); // ACI 302.1R
		expect(joints.maxSpacing.feet).toBeCloseTo(12, 9);
		expect(joints.depth.inches).toBeCloseTo(1, 9); // max(¼ × 4 in, 1 in), ACI 302.1R
		expect(joints.totalLength.feet).toBeCloseTo(12 + 18 + 16, 9);
	});
});
