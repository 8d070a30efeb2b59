import { page } from '$app/state';
import { fallbackReader, formatDay, formatDayLong, formatMoment } from './reader';

/** Date formatting for components, in the locale and zone the root layout read for this visitor. */
export const when = {
	get reader() {
		return page.data.reader ?? fallbackReader;
	},
	moment(d: Date | string, style: 'date' | 'datetime' = 'datetime') {
		return formatMoment(d, this.reader, style);
	},
	day(iso: string) {
		return formatDay(iso, this.reader);
	},
	/** A calendar day with its weekday, for days someone plans around. */
	dayLong(iso: string) {
		return formatDayLong(iso, this.reader.locale);
	}
};
