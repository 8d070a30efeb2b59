import type { DistanceUnit } from './schemas/contractor';

/** Who reads the page: their locale and time zone. Shared by server and browser. */
export type Reader = { locale: string; timeZone: string };

/** The browser writes its IANA time zone here (root layout); the server reads it for the next page. */
export const TIME_ZONE_COOKIE = 'tz';

/**
 * One formatter per locale and options: building an Intl.DateTimeFormat costs far more than using
 * one, and a plan page formats dozens of dates (a profile of the plan page under load found 40 % of
 * its render time there). Formatters hold no user data; the map is capped so odd locales and zones
 * cannot grow it.
 */
const formats = new Map<string, Intl.DateTimeFormat>();
function dateFormat(locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
	const key = `${locale}|${JSON.stringify(options)}`;
	let f = formats.get(key);
	if (!f) {
		f = new Intl.DateTimeFormat(locale, options);
		if (formats.size >= 256) formats.clear();
		formats.set(key, f);
	}
	return f;
}

/**
 * Remembers a pure function of a short string (a header or cookie value), up to 256 answers, then
 * starts over: every request reads the reader's locale and zone, and asking Intl costs far more than
 * a lookup (profile of the plan page under load). Answers hold no user data.
 */
function remembered<T>(answer: (key: string) => T): (key: string) => T {
	const seen = new Map<string, T>();
	return (key) => {
		let a = seen.get(key);
		if (a === undefined) {
			a = answer(key);
			if (seen.size >= 256) seen.clear();
			seen.set(key, a);
		}
		return a;
	};
}

const knownTimeZone = remembered((tz) => {
	try {
		return new Intl.DateTimeFormat('en-US', { timeZone: tz }).resolvedOptions().timeZone;
	} catch {
		return 'UTC';
	}
});

/** A time zone this runtime knows, else UTC (an unknown or hostile cookie changes nothing). */
export function validTimeZone(tz: string | null | undefined): string {
	if (!tz || tz.length > 64) return 'UTC';
	return knownTimeZone(tz);
}

/** The calendar day (YYYY-MM-DD) it is now in `timeZone`: a contractor's "today", not UTC's. */
export function todayIn(timeZone: string, now = new Date()): string {
	const parts = dateFormat('en-US', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(now);
	const get = (t: string) => parts.find((p) => p.type === t)!.value;
	return `${get('year')}-${get('month')}-${get('day')}`;
}

/** The instant it is `hour`:00 on the calendar day `iso` (YYYY-MM-DD) in `timeZone`. */
export function zonedTime(iso: string, hour: number, timeZone: string): Date {
	const wall = Date.UTC(+iso.slice(0, 4), +iso.slice(5, 7) - 1, +iso.slice(8, 10), hour);
	// The zone's offset at an instant: its wall clock read as if UTC, less the instant.
	const offset = (t: number) => {
		const p = dateFormat('en-US', {
			timeZone,
			hourCycle: 'h23',
			year: 'numeric',
			month: 'numeric',
			day: 'numeric',
			hour: 'numeric',
			minute: 'numeric',
			second: 'numeric'
		}).formatToParts(t);
		const n = (type: string) => +p.find((x) => x.type === type)!.value;
		return Date.UTC(n('year'), n('month') - 1, n('day'), n('hour'), n('minute'), n('second')) - t;
	};
	// Twice, so an hour next to a daylight-saving change lands on the zone's own offset for it.
	const first = wall - offset(wall);
	return new Date(wall - offset(first));
}

/** Regions that measure road distance in miles; everyone else reads kilometres. */
const MILE_REGIONS = new Set(['US', 'GB', 'LR', 'MM']);
export const defaultDistanceUnit: (locale: string) => DistanceUnit = remembered((locale) => {
	let region: string | undefined;
	try {
		region = new Intl.Locale(locale).maximize().region;
	} catch {
		region = undefined;
	}
	return region && MILE_REGIONS.has(region) ? 'mi' : 'km';
});

/** A moment (stored timestamp) in the reader's locale and zone. */
export const formatMoment = (d: Date | string, r: Reader, style: 'date' | 'datetime' = 'datetime') =>
	dateFormat(r.locale, { dateStyle: 'medium', ...(style === 'datetime' ? { timeStyle: 'short' } : {}), timeZone: r.timeZone }).format(
		typeof d === 'string' ? new Date(d) : d
	);

/** A calendar day (YYYY-MM-DD, no zone: a start date, a validity date) in the reader's locale. */
export const formatDay = (iso: string, r: Pick<Reader, 'locale'>) =>
	dateFormat(r.locale, { dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(`${iso}T00:00:00Z`));

/**
 * The reader's locale from an Accept-Language header: the first tag this runtime can format dates
 * in, else en-US. Read on the server, so the page renders and hydrates with the same dates.
 */
export function readerLocale(acceptLanguage: string | null | undefined): string {
	// Browsers send a handful of distinct headers; a longer one is read each time, not remembered.
	const header = acceptLanguage ?? '';
	return header.length <= 200 ? localeOfHeader(header) : firstSupportedLocale(header);
}

const localeOfHeader = remembered((header) => firstSupportedLocale(header));

function firstSupportedLocale(acceptLanguage: string): string {
	for (const part of acceptLanguage.split(',').slice(0, 10)) {
		const tag = part.split(';')[0].trim();
		if (!tag || tag === '*') continue;
		try {
			const [ok] = Intl.DateTimeFormat.supportedLocalesOf(tag);
			if (ok) return ok;
		} catch {
			// not a well-formed language tag: try the next one
		}
	}
	return 'en-US';
}

/**
 * A calendar day with its weekday ("Thu, Dec 3, 2026"), for days someone plans around (a pour day,
 * a reply or expiry date) and for e-mails, which have no reader's zone. Read in UTC so the server
 * and the browser agree.
 */
export const formatDayLong = (iso: string, locale = 'en-US') =>
	dateFormat(locale, { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${iso}T00:00:00Z`));

export const fallbackReader: Reader = { locale: 'en-US', timeZone: 'UTC' };
