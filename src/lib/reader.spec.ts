import { describe, expect, it } from 'vitest';
import { defaultDistanceUnit, formatDay, formatMoment, todayIn, validTimeZone, zonedTime } from './reader';

describe('reader', () => {
	it('takes a known time zone and refuses anything else', () => {
		expect(validTimeZone('America/Los_Angeles')).toBe('America/Los_Angeles');
		expect(validTimeZone('Mars/Olympus')).toBe('UTC');
		expect(validTimeZone('')).toBe('UTC');
	});
	it("gives the contractor's today, not UTC's", () => {
		// 03:00 UTC on 2 March is still 1 March in Oregon (UTC−8) and already 2 March in Berlin.
		const now = new Date('2027-03-02T03:00:00Z');
		expect(todayIn('America/Los_Angeles', now)).toBe('2027-03-01');
		expect(todayIn('Europe/Berlin', now)).toBe('2027-03-02');
		expect(todayIn('UTC', now)).toBe('2027-03-02');
	});
	it('reads miles in the US and kilometres elsewhere', () => {
		expect(defaultDistanceUnit('en-US')).toBe('mi');
		expect(defaultDistanceUnit('en')).toBe('mi'); // en maximizes to en-Latn-US
		expect(defaultDistanceUnit('de-DE')).toBe('km');
		expect(defaultDistanceUnit('en-CA')).toBe('km');
	});
	it('writes moments in the reader zone and days without shifting them', () => {
		const m = new Date('2027-03-02T03:00:00Z');
		expect(formatMoment(m, { locale: 'en-US', timeZone: 'America/Los_Angeles' }, 'date')).toBe('Mar 1, 2027');
		expect(formatMoment(m, { locale: 'de-DE', timeZone: 'Europe/Berlin' }, 'date')).toBe('02.03.2027');
		expect(formatDay('2027-03-01', { locale: 'en-US' })).toBe('Mar 1, 2027');
	});

	it('finds the instant of a local hour on a day, on both sides of a daylight-saving change', () => {
		// Denver: UTC−7 in winter, UTC−6 in summer (clocks went forward on 2027-03-14).
		expect(zonedTime('2027-01-10', 7, 'America/Denver').toISOString()).toBe('2027-01-10T14:00:00.000Z');
		expect(zonedTime('2027-03-14', 7, 'America/Denver').toISOString()).toBe('2027-03-14T13:00:00.000Z');
		expect(zonedTime('2027-06-01', 7, 'Europe/Berlin').toISOString()).toBe('2027-06-01T05:00:00.000Z');
		expect(zonedTime('2027-06-01', 7, 'UTC').toISOString()).toBe('2027-06-01T07:00:00.000Z');
		// Read back in the zone, it is that day at 07:00.
		const t = zonedTime('2027-11-07', 7, 'America/Denver');
		expect(todayIn('America/Denver', t)).toBe('2027-11-07');
		expect(new Intl.DateTimeFormat('en-US', { timeZone: 'America/Denver', hour: 'numeric', hourCycle: 'h23' }).format(t)).toBe('07');
	});
});
