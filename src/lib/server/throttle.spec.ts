import { describe, expect, it } from 'vitest';
import { formatWait, pauseSeconds, SIGN_IN } from './throttle';

describe('sign-in throttle rule', () => {
	it('allows five attempts per account and address pair in 15 minutes', () => {
		expect(SIGN_IN.pair.points).toBe(5);
		expect(SIGN_IN.pair.duration).toBe(15 * 60);
	});

	it('doubles each pause of the same pair, up to a day', () => {
		expect([1, 2, 3, 4].map(pauseSeconds)).toEqual([15 * 60, 30 * 60, 60 * 60, 120 * 60]);
		expect(pauseSeconds(7)).toBe(16 * 60 * 60); // 15 min × 2^6
		expect(pauseSeconds(8)).toBe(24 * 60 * 60); // 32 h capped at a day
		expect(pauseSeconds(40)).toBe(24 * 60 * 60);
	});

	it('says the wait in minutes, or hours when long', () => {
		expect(formatWait(30_000)).toBe('about a minute');
		expect(formatWait(14 * 60_000 + 1)).toBe('15 minutes');
		expect(formatWait(4 * 60 * 60_000)).toBe('4 hours');
	});
});
