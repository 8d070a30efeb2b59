// The calendar date beside each day of the wizard's day-by-day forecast. The date box holds what
// its user typed, and Chromium takes years up to 275760: a six-digit year is not an ISO date, and
// new Date(NaN).toISOString() throws, so anything but a real YYYY-MM-DD day gets no date at all.

const DAY = 86_400_000;

/** The date of day `i` of the forecast (0 is the first pour day), or '' while the pour day is not a real date. */
export function forecastDate(pourDate: string | undefined, i: number): string {
	if (!pourDate || !/^\d{4}-\d{2}-\d{2}$/.test(pourDate)) return '';
	const start = Date.parse(`${pourDate}T00:00:00Z`);
	// Date.parse takes 2027-02-30 as 2 March: only a day that reads back the same is real.
	if (!Number.isFinite(start) || new Date(start).toISOString().slice(0, 10) !== pourDate) return '';
	// A UTC day is always 86,400,000 ms (no daylight saving), so adding days is plain arithmetic.
	const day = new Date(start + i * DAY);
	// Past 9999-12-31 the ISO form gains a sign and two digits (+010000-01-01): no plan date.
	return day.getUTCFullYear() > 9999 ? '' : day.toISOString().slice(0, 10);
}
