import { describe, expect, it } from 'vitest';
import { needsRenewal, sessionExpiry, SESSION_LIFETIME_MS } from './auth';

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
});
