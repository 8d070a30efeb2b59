import { describe, expect, it } from 'vitest';
import { formatInches, formatLength, formatSmall, formatVolume, toRoundedJson } from './format';
import { length, small, volume } from './units';

describe('formatting', () => {
	it('reads inches to the nearest eighth', () => {
		expect(formatInches(1.375)).toBe('1⅜ in');
		expect(formatInches(0.5)).toBe('½ in');
		expect(formatInches(2)).toBe('2 in');
		expect(formatInches(-2.88)).toBe('−2⅞ in'); // 2.88 × 8 = 23.04 → 23 eighths
		expect(formatInches(0)).toBe('0 in');
	});

	it('formats in the plan units', () => {
		expect(formatSmall(small(0.1016), 'metric')).toBe('102 mm');
		expect(formatLength(length(3.6576), 'imperial')).toBe('12 ft');
		expect(formatVolume(volume(0.764554857984), 'imperial')).toBe('1 yd³ (27 ft³)');
	});

	it('rounds numbers in JSON output', () => {
		expect(toRoundedJson({ a: 1 / 3, b: [2.000049] })).toBe('{"a":0.3333,"b":[2]}');
	});
});
