import { createEvents, type DateArray, type EventAttributes } from 'ics';
import { calendarEntries } from '$lib/plan/calendar';
import type { PlanAsLogged } from '$lib/plan/reminders';
import { formatDayLong } from '$lib/reader';

const dateArray = (iso: string): DateArray => [+iso.slice(0, 4), +iso.slice(5, 7), +iso.slice(8, 10)];
const nextDay = (iso: string) => new Date(Date.parse(`${iso}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);

/**
 * Which first-pour date the file's dates count from, in words: the day logged on the pour page once
 * a pour was started, else the planned day. Null without either.
 */
export function countedFrom(d: Pick<PlanAsLogged, 'pourDate' | 'plannedDate' | 'logged' | 'loggedLast'>, locale = 'en-US'): string | null {
	if (!d.pourDate) return null;
	const day = (iso: string) => formatDayLong(iso, locale);
	if (!d.logged)
		return `Dates counted from the planned first pour, ${day(d.pourDate)}. Once a pour is logged on the pour page, download this file again and the dates move to the day it was poured.`;
	if (d.loggedLast)
		return `Dates counted from the last pour as logged on the pour page, ${day(d.loggedLast)}; the earlier pours keep the plan's spacing before it.`;
	const planned = !d.plannedDate ? 'the plan had no date' : d.plannedDate === d.pourDate ? 'as planned' : `planned for ${day(d.plannedDate)}`;
	return `Dates counted from the first pour as logged on the pour page, ${day(d.pourDate)} (${planned}).`;
}

/**
 * The plan's day plan, pours and milestones as an iCalendar file, dated as the curing reminders are
 * (planAsLogged: from the logged first-pour day once there is one). Every entry is an all-day event
 * (DTSTART;VALUE=DATE, ending the next day): the plan knows the day of each step, not its hour. Each
 * entry says which pour date it counts from. Null when there is no pour date to count from.
 */
export function planCalendar(o: { id: string; name: string; dated: PlanAsLogged; url: string; locale?: string }): string | null {
	const from = countedFrom(o.dated, o.locale);
	const entries = calendarEntries(o.dated.result, o.name);
	if (!entries.length || !from) return null;
	const events: EventAttributes[] = entries.map((e) => ({
		uid: `${o.id}-${e.key}@stakeline`,
		title: e.title,
		description: `${e.description}\n\n${from}\n${o.url}`,
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
