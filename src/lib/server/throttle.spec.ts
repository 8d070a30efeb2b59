import { describe, expect, it } from 'vitest';
import { formatWait, waitFor, WINDOW_MS } from './throttle';

const now = Date.parse('2026-06-01T12:00:00Z');
const ago = (minutes: number) => new Date(now - minutes * 60_000);

describe('sign-in throttle rule', () => {
	it('allows attempts under the limit', () => {
		expect(waitFor([], now, 5)).toBe(0);
		expect(waitFor([ago(1), ago(2), ago(3), ago(4)], now, 5)).toBe(0);
	});

	it('blocks at the limit until the oldest counted failure leaves the window', () => {
		const failures = [ago(10), ago(8), ago(6), ago(4), ago(2)];
		expect(waitFor(failures, now, 5)).toBe(5 * 60_000); // oldest at −10 min, window 15 min
	});

	it('counts only the failures inside the window', () => {
		expect(waitFor([ago(20), ago(16), ago(3), ago(2), ago(1)], now, 5)).toBe(0);
		expect(WINDOW_MS).toBe(15 * 60_000);
	});

	it('waits for enough failures to age out when far over the limit', () => {
		const failures = [ago(14), ago(12), ago(9), ago(7), ago(5), ago(1)];
		// six inside, limit five: two must leave, the second oldest (−12 min) leaves in 3 min
		expect(waitFor(failures, now, 5)).toBe(3 * 60_000);
	});

	it('says the wait in minutes', () => {
		expect(formatWait(30_000)).toBe('about a minute');
		expect(formatWait(14 * 60_000 + 1)).toBe('15 minutes');
	});
});
