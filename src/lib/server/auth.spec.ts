import { describe, expect, it } from 'vitest';
import { ABSOLUTE_LIFETIME_MS, needsRenewal, sessionExpiry, SESSION_LIFETIME_MS } from './auth';

const DAY = 86_400_000;

describe('session lifetime', () => {
	it('is 30 days from creation', () => {
		const now = Date.parse('2026-03-01T00:00:00Z');
		expect(sessionExpiry(now).toISOString()).toBe('2026-03-31T00:00:00.000Z');
		expect(SESSION_LIFETIME_MS).toBe(30 * DAY);
	});

	it('renews only in its last 15 days', () => {
		const now = Date.now();
		expect(needsRenewal(new Date(now + 16 * DAY), now)).toBe(false);
		expect(needsRenewal(new Date(now + 15 * DAY + 1000), now)).toBe(false);
		expect(needsRenewal(new Date(now + 15 * DAY - 1000), now)).toBe(true);
		expect(needsRenewal(new Date(now + DAY), now)).toBe(true);
	});

	it('never runs past 90 days from sign-in, however often it is renewed', () => {
		const signedIn = Date.parse('2026-03-01T00:00:00Z');
		expect(ABSOLUTE_LIFETIME_MS).toBe(90 * DAY);
		// Used on day 70: 30 more days would be day 100; the cap is day 90 (30 May).
		expect(sessionExpiry(signedIn + 70 * DAY, signedIn).toISOString()).toBe('2026-05-30T00:00:00.000Z');
		expect(sessionExpiry(signedIn + 20 * DAY, signedIn).toISOString()).toBe('2026-04-20T00:00:00.000Z');
	});
});
