import { createEvents, type DateArray, type EventAttributes } from 'ics';
import { calendarEntries } from '$lib/plan/calendar';
import type { PlanResult } from '$lib/plan';

const dateArray = (iso: string): DateArray => [+iso.slice(0, 4), +iso.slice(5, 7), +iso.slice(8, 10)];
const nextDay = (iso: string) => new Date(Date.parse(`${iso}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);

/**
 * The plan's day plan, pours and milestones as an iCalendar file. Every entry is an all-day event
 * (DTSTART;VALUE=DATE, ending the next day): the plan knows the day of each step, not its hour.
 * Null when the plan has no pour date.
 */
export function planCalendar(o: { id: string; name: string; result: PlanResult; url: string }): string | null {
	const entries = calendarEntries(o.result, o.name);
	if (!entries.length) return null;
	const events: EventAttributes[] = entries.map((e) => ({
		uid: `${o.id}-${e.key}@stakeline`,
		title: e.title,
		description: `${e.description}\n\n${o.url}`,
		start: dateArray(e.date),
		end: dateArray(nextDay(e.date)),
		categories: [e.kind === 'pour' ? 'Pour' : e.kind === 'milestone' ? 'Milestone' : 'Site work'],
		url: o.url,
		transp: 'TRANSPARENT',
		productId: 'stakeline/plan'
	}));
	const { error, value } = createEvents(events, { productId: 'stakeline/plan', calName: o.name });
	if (error || !value) throw error ?? new Error('calendar not written');
	return value;
}
