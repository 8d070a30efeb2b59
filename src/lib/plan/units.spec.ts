import { describe, expect, it } from 'vitest';
import { area, countUp, length, mass, massToKg, orderVolumeToM3, planToM, roundUpTo, small, smallToM, tempToC, temperature, volume, windToKmh } from './units';

describe('dual-unit values', () => {
	it('gives a volume in ft³, yd³ and m³', () => {
		const v = volume(0.764554857984); // 1 yd³, NIST SP 811 App. B
		expect(v.cubicYards).toBeCloseTo(1, 12);
		expect(v.cubicFeet).toBeCloseTo(27, 10); // 1 yd³ = 27 ft³
	});

	it('gives areas, lengths and small dimensions both ways', () => {
		expect(area(1).squareFeet).toBeCloseTo(10.7639104, 6); // 1 / 0.3048², NIST SP 811
		expect(length(3.6576).feet).toBeCloseTo(12, 12); // 12 × 0.3048
		expect(small(0.1016).inches).toBeCloseTo(4, 12); // 4 × 0.0254
		expect(small(0.1016).millimeters).toBeCloseTo(101.6, 10);
	});

	it('gives masses and temperatures both ways', () => {
		expect(mass(36.2873896).pounds).toBeCloseTo(80, 9); // 80 × 0.45359237 kg
		expect(temperature(100).fahrenheit).toBeCloseTo(212, 12); // °F = °C × 9/5 + 32, NIST SP 811
	});
});

describe('input conversions', () => {
	it('reads plan lengths as ft or m and small dimensions as in or mm', () => {
		expect(planToM(10, 'imperial')).toBeCloseTo(3.048, 12); // 10 × 0.3048
		expect(planToM(10, 'metric')).toBe(10);
		expect(smallToM(4, 'imperial')).toBeCloseTo(0.1016, 12); // 4 × 0.0254
		expect(smallToM(100, 'metric')).toBeCloseTo(0.1, 12);
	});

	it('reads °F, lb, mph and yd³', () => {
		expect(tempToC(32, 'imperial')).toBeCloseTo(0, 12); // (32 − 32) × 5/9
		expect(tempToC(70, 'imperial')).toBeCloseTo(21.1111, 4); // (70 − 32) × 5/9
		expect(tempToC(21, 'metric')).toBe(21);
		expect(massToKg(80, 'imperial')).toBeCloseTo(36.2873896, 7); // 80 × 0.45359237
		expect(windToKmh(5, 'imperial')).toBeCloseTo(8.04672, 9); // 5 × 1.609344, 1 mile = 1609.344 m exact
		expect(orderVolumeToM3(1, 'imperial')).toBeCloseTo(0.764554857984, 12); // NIST SP 811 App. B
	});
});

describe('rounding counts up', () => {
	it('forgives float noise but not real excess', () => {
		expect(countUp(2.0000000000001)).toBe(2);
		expect(countUp(2.01)).toBe(3);
		expect(countUp(0)).toBe(0);
		expect(roundUpTo(3.26, 0.25)).toBeCloseTo(3.5, 12); // next quarter up
	});
});
