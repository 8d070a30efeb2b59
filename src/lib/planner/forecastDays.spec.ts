import { describe, expect, it } from 'vitest';
import { forecastDate } from './forecastDays';

describe('the date beside each forecast day', () => {
	it('counts on from the first pour day, across months and leap days', () => {
		expect(forecastDate('2027-06-12', 0)).toBe('2027-06-12');
		expect(forecastDate('2027-06-29', 3)).toBe('2027-07-02');
		expect(forecastDate('2028-02-28', 1)).toBe('2028-02-29');
	});

	it('is empty, never a thrown RangeError, for what else the date box can hold', () => {
		// A six- or five-digit year typed into the year part, an empty box, a day that does not exist.
		for (const pourDate of ['192027-06-12', '20277-06-12', '275760-09-13', '', undefined, '2027-02-30', '2027-13-01', 'soon']) {
			for (const i of [0, 6, 59]) expect(forecastDate(pourDate, i)).toBe('');
		}
	});

	it('stops at the last four-digit year', () => {
		expect(forecastDate('9999-12-30', 1)).toBe('9999-12-31');
		expect(forecastDate('9999-12-30', 2)).toBe('');
	});
});
