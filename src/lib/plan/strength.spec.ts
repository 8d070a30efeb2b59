import { describe, expect, it } from 'vitest';
import { ageFactor, equivalentAges, maturity, strengthRatio, strengthTimeline } from './strength';

describe('ACI 209R-92 Eq. 2-1', () => {
	it('gives the ratio to 28-day strength', () => {
		expect(strengthRatio(1, 'typeI')).toBeCloseTo(0.206186, 6); // 1 / (4 + 0.85) = 1 / 4.85, ACI 209R-92 Eq. 2-1
		expect(strengthRatio(7, 'typeI')).toBeCloseTo(0.703518, 6); // 7 / (4 + 5.95) = 7 / 9.95, ACI 209R-92 Eq. 2-1
		expect(strengthRatio(28, 'typeI')).toBeCloseTo(1.007194, 6); // 28 / (4 + 23.8) = 28 / 27.8, ACI 209R-92 Eq. 2-1
		expect(strengthRatio(3, 'typeIII')).toBeCloseTo(0.592885, 6); // 3 / (2.3 + 2.76) = 3 / 5.06, ACI 209R-92 Eq. 2-1
		expect(strengthRatio(0, 'typeI')).toBe(0);
	});
});

describe('ASTM C1074 maturity', () => {
	it('ages at the reference rate at 20 °C and slower in the cold', () => {
		expect(ageFactor(20)).toBe(1); // exp(0), ASTM C1074
		// exp[−5000 (1/283.15 − 1/293.15)] = exp(−0.60239) = 0.54751, ASTM C1074
		expect(ageFactor(10)).toBeCloseTo(0.547512, 6);
		// exp[−5000 (1/303.15 − 1/293.15)] = exp(0.56262) = 1.75528, ASTM C1074
		expect(ageFactor(30)).toBeCloseTo(1.755282, 6);
	});

	it('sums equivalent age and the temperature-time factor', () => {
		expect(equivalentAges([20, 20, 10])).toEqual([1, 2, expect.closeTo(2.547512, 6)]); // Σ factor × 1 day, ASTM C1074
		// Nurse-Saul Σ (Ta − 0 °C) × 24 h: 480, 720, and nothing below the datum (ASTM C1074)
		expect(maturity([20, 10, -5])).toEqual([480, 720, 720]);
	});

	it('builds a timeline from the daily temperatures', () => {
		const days = strengthTimeline([20, 20, 20, 20, 20, 20, 20], 'typeI', 20);
		expect(days).toHaveLength(7);
		expect(days[6].percent).toBeCloseTo(70.3518, 4); // day 7 at 20 °C: 7 / 9.95, ACI 209R-92
		expect(days[6].megapascals).toBeCloseTo(14.0704, 4); // 0.703518 × 20 MPa
		const cold = strengthTimeline([10, 10, 10, 10, 10, 10, 10], 'typeI', 20);
		// 7 × 0.547512 = 3.83258 days equivalent: 3.83258 / (4 + 3.25770) = 52.807 % (ACI 209R-92 with ASTM C1074)
		expect(cold[6].percent).toBeCloseTo(52.807, 3);
	});
});
