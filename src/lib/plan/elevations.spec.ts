import { describe, expect, it } from 'vitest';
import { computeElevations, elevationAt, fallAwayFrom, slopePlane } from './elevations';
import { computeForms } from './lumber';
import { cornerEll, modelOf, rect } from './test-plans';
import type { PlanInput } from './schema';

const FT = 0.3048;
const IN = 0.0254;

const elevations = (input: PlanInput) => {
	const { m, layout } = modelOf(input);
	const plane = slopePlane(m, layout);
	const { stakes } = computeForms(m, layout);
	return { plane, layout, e: computeElevations(m, layout, plane, stakes) };
};

describe('a 20 × 12 ft patio falling 2 % away from the house', () => {
	const input: PlanInput = { units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], reference: { label: 'door sill', below: 1.5 } };

	it('puts the high edge at the reference less 1½ in and the far edge 2.88 in lower', () => {
		const { e } = elevations(input);
		// 12 ft × 2 % = 0.24 ft = 2.88 in (IRC R401.3 minimum fall)
		expect(e.vertices.map((v) => v.elevation.inches)).toEqual([-1.5, -1.5, -4.38, -4.38].map((x) => expect.closeTo(x, 9)));
		expect(e.totalDrop.inches).toBeCloseTo(2.88, 9);
	});

	it('tables each stake below a level line from the high stake', () => {
		const { e } = elevations(input);
		const s = e.stakes.find((x) => Math.abs(x.x - 20) < 1e-9 && Math.abs(x.y - 6) < 1e-9)!;
		expect(s.belowLevelLine.inches).toBeCloseTo(1.44, 9); // 6 ft × 0.24 in/ft (2 %)
		expect(e.stakes.find((x) => x.id === e.highStake)!.belowLevelLine.inches).toBe(0);
	});

	it('meets IRC R401.3 at the house edge', () => {
		const { e } = elevations(input);
		expect(e.houseEdges[0].fallAway.percent).toBeCloseTo(2, 12); // IRC R401.3, ≥ 2 %
		expect(e.houseEdges[0].meetsIrc).toBe(true);
	});

	it('fails IRC R401.3 at ⅛ in/ft and when the slope runs toward the house', () => {
		const gentle = elevations({ ...input, slope: { fall: { value: 0.125, unit: 'inPerFt' } } }).e;
		expect(gentle.houseEdges[0].fallAway.percent).toBeCloseTo(1.0417, 4); // 0.125 / 12
		expect(gentle.houseEdges[0].meetsIrc).toBe(false); // IRC R401.3 asks 2 %
		const wrong = elevations({ ...input, slope: { highEdge: { section: 0, edge: 2 } } }).e;
		expect(wrong.houseEdges[0].fallAway.percent).toBeCloseTo(-2, 12); // toward the wall
	});

	it('reads ¼ in/ft and a total drop as ratios', () => {
		const q = elevations({ ...input, slope: { fall: { value: 0.25, unit: 'inPerFt' } } }).e;
		expect(q.fall.percent).toBeCloseTo(2.0833, 4); // ¼ / 12, ACI 302.1R positive drainage
		const d = elevations({ ...input, slope: { fall: { value: 3, unit: 'totalDrop' } } }).e;
		expect(d.fall.inchesPerFoot).toBeCloseTo(0.25, 12); // 3 in over 12 ft
	});
});

describe('an L around a house corner', () => {
	it('needs a cross fall so both wall edges drain', () => {
		const { e, plane, layout } = elevations(cornerEll);
		expect(e.houseEdges.map((h) => h.fallAway.percent)).toEqual([expect.closeTo(2, 9), expect.closeTo(2, 9)]); // IRC R401.3
		expect(e.steepest.percent).toBeCloseTo(2.8284, 4); // √(2² + 2²)
		// (24, 18) is 24 ft along and 12 ft out: 0.02 × (24 + 12) ft = 0.72 ft = 8.64 in below the high corner (0, 6)
		expect(elevationAt(plane, [24 * FT, 18 * FT]) / IN).toBeCloseTo(-8.64, 9);
		expect(fallAwayFrom({ ...plane, cross: 0 }, layout, 0, 5)).toBeCloseTo(0, 12); // no cross fall: flat along edge 5
	});
});
