import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatDistance, haversineKm, toKm } from './geo';

describe('haversineKm', () => {
	it('gives known distances', () => {
		// One degree of latitude is 111.2 km on the mean-radius sphere (2πR/360).
		expect(haversineKm({ lat: 0, lon: 0 }, { lat: 1, lon: 0 })).toBeCloseTo(111.195, 2);
		// A quarter of the equator: πR/2.
		expect(haversineKm({ lat: 0, lon: 0 }, { lat: 0, lon: 90 })).toBeCloseTo((Math.PI * 6371.0088) / 2, 6);
		// Antipodes: the square root is clamped, so no NaN from rounding.
		expect(haversineKm({ lat: 10, lon: 20 }, { lat: -10, lon: -160 })).toBeCloseTo(Math.PI * 6371.0088, 2);
	});

	it('is symmetric, zero on itself and never negative', () => {
		const point = fc.record({ lat: fc.double({ min: -89, max: 89, noNaN: true }), lon: fc.double({ min: -180, max: 180, noNaN: true }) });
		fc.assert(
			fc.property(point, point, (a, b) => {
				expect(haversineKm(a, b)).toBeCloseTo(haversineKm(b, a), 9);
				expect(haversineKm(a, a)).toBe(0);
				expect(haversineKm(a, b)).toBeGreaterThanOrEqual(0);
			})
		);
	});

	it('converts and formats miles and kilometres', () => {
		expect(toKm(10, 'mi')).toBeCloseTo(16.09344, 9); // international mile, 1959
		expect(toKm(10, 'km')).toBe(10);
		expect(formatDistance(16.09344, 'mi')).toBe('10 mi');
		expect(formatDistance(3.2, 'km')).toBe('3.2 km');
	});
});
