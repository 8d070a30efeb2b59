import { describe, expect, it } from 'vitest';
import { area, mass, small, temperature } from '$lib/plan/units';
import {
	figure,
	formatArea,
	formatDate,
	formatFall,
	formatElevation,
	formatMass,
	formatMinutes,
	formatQuantity,
	formatTemperature,
	plural,
	readerLocale,
	strengthNote
} from './text';

describe('unit text', () => {
	it('plain figures group thousands and drop trailing zeros and the sign of a zero', () => {
		expect(figure(1234.56)).toBe('1,234.6');
		expect(figure(2.5, 2)).toBe('2.5');
		expect(figure(-0.04)).toBe('0');
		expect(figure(-1.25, 1)).toBe('-1.3');
	});

	it('fall as a tape fraction when it is one, else in decimals', () => {
		// ¼ in per ft: 0.25 in / 12 in = 2.083 %, shown to 2 places
		expect(formatFall({ inchesPerFoot: 0.25, millimetersPerMeter: 20.83, percent: 2.0833 }, 'imperial')).toBe('¼ in per ft (2.08 %)');
		expect(formatFall({ inchesPerFoot: 0.24, millimetersPerMeter: 20, percent: 2 }, 'metric')).toBe('20 mm per m (2 %)');
		expect(formatFall({ inchesPerFoot: 0.24, millimetersPerMeter: 20, percent: 2 }, 'imperial')).toBe('0.24 in per ft (2 %)');
	});

	it('areas in the plan unit', () => {
		expect(formatArea(area(10), 'metric')).toBe('10 m²');
		// 10 m² / 0.3048² = 107.639… ft² (NIST SP 811 App. B, 1 ft = 0.3048 m)
		expect(formatArea(area(10), 'imperial')).toBe('107.6 ft²');
	});

	it('signed heights: a sign only when something is left after rounding', () => {
		expect(formatElevation(small(-0.0381), 'imperial')).toBe('−1½ in'); // 38.1 mm = 1½ in exactly (1 in = 25.4 mm)
		expect(formatElevation(small(0.0095), 'imperial')).toBe('+⅜ in'); // 9.5 mm = 0.374 in → nearest ⅛
		expect(formatElevation(small(-0.0002), 'imperial')).toBe('0 in');
		expect(formatElevation(small(-0.0114), 'metric')).toBe('−11 mm');
		expect(formatElevation(small(0.0004), 'metric')).toBe('0 mm');
	});

	it('masses and temperatures in the plan unit', () => {
		expect(formatMass(mass(23), 'imperial')).toBe('51 lb'); // 23 kg / 0.45359237 = 50.7 lb (NIST SP 811)
		expect(formatMass(mass(36.2874), 'metric')).toBe('36.3 kg');
		expect(formatTemperature(temperature(25), 'imperial')).toBe('77 °F');
		expect(formatTemperature(temperature(7.6), 'metric')).toBe('8 °C');
	});

	it('minutes read like a clock', () => {
		expect(formatMinutes(45.4)).toBe('45 min');
		expect(formatMinutes(120)).toBe('2 h');
		expect(formatMinutes(306)).toBe('5 h 6 min');
		expect(formatMinutes(-267.8)).toBe('4 h 28 min');
	});

	it('quantities and dates', () => {
		expect(formatQuantity(13.999999999999998, 'ft')).toBe('14 ft');
		expect(formatQuantity(2.4888, 'yd³')).toBe('2.49 yd³');
		expect(formatQuantity(77.4558, 'gal')).toBe('77.5 gal');
		expect(formatQuantity(0, 'per your layout')).toBe('per your layout');
		expect(formatDate('2027-05-15')).toBe('Sat, May 15, 2027');
		expect(formatDate('2027-05-15', 'en-GB')).toBe('Sat, 15 May 2027');
		expect(formatDate('2027-05-15', 'de-DE')).toBe('Sa., 15. Mai 2027');
		expect(readerLocale('de-DE,de;q=0.9,en;q=0.8')).toBe('de-DE');
		expect(readerLocale('x-!!, en-GB;q=0.5')).toBe('en-GB');
		expect(readerLocale(null)).toBe('en-US');
	});
});

describe('small words', () => {
	it('counts one board, not one boards', () => {
		expect(plural(1, 'board')).toBe('1 board');
		expect(plural(3, 'board')).toBe('3 boards');
	});

	it('explains a strength curve past 100 % and says nothing below it', () => {
		// ACI 209R-92 Eq. 2-1, moist-cured Type I: 28 / (4.0 + 0.85 × 28) = 1.0072 → 100.7 % at day 28.
		expect(strengthNote([{ percent: 70 }, { percent: 100.7 }])).toMatch(/ACI 209R-92.*100\.7 %/);
		expect(strengthNote([{ percent: 70 }, { percent: 99 }])).toBeUndefined();
	});
});
