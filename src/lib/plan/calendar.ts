// The plan's days as calendar entries: the day plan (locate call, digging, forms), each pour, and
// each strength milestone. The engine counts whole days, not hours, so every entry is all-day: a
// clock time would be made up.

import type { PlanResult } from './index';

export interface CalendarEntry {
	/** Stable across downloads, so a calendar updates an entry instead of adding a second one. */
	key: string;
	/** YYYY-MM-DD; the entry lasts that one day. */
	date: string;
	kind: 'work' | 'pour' | 'milestone';
	title: string;
	description: string;
}

const WORK_LABELS: Record<string, string> = {
	locate: 'Call for the utility locate',
	layout: 'Lay out and dig',
	dig: 'Lay out and dig',
	forms: 'Set forms and base',
	base: 'Set forms and base',
	reinforcement: 'Set forms and base'
};

/** Calendar entries of a plan computed with a pour date; none without one. */
export function calendarEntries(r: PlanResult, planName: string): CalendarEntry[] {
	if (!r.schedule.pourDays[0]?.date) return [];
	const out: CalendarEntry[] = [];
	const milestoneIds = new Set<string>(r.milestones.map((m) => m.id));
	const pourOf = (id: string) => {
		const m = /-(\d+)$/.exec(id);
		return m ? Number(m[1]) : null;
	};
	for (const day of r.schedule.days) {
		if (!day.date) continue;
		const work = day.tasks.filter((t) => pourOf(t.id) === null && !milestoneIds.has(t.id));
		if (!work.length) continue;
		const labels = [...new Set(work.map((t) => WORK_LABELS[t.id] ?? 'Site work'))];
		out.push({
			key: `day-${day.day}`,
			date: day.date,
			kind: 'work',
			title: `${planName}: ${labels.join('; ')}`,
			description: work.map((t) => t.text).join('\n')
		});
	}
	r.schedule.pourDays.forEach((p, i) => {
		if (!p.date) return;
		const split = r.schedule.pourDays.some((q) => q.section === p.section && q.part > 0);
		const name = `${r.geometry.sections[p.section]?.name ?? `Section ${p.section + 1}`}${split ? `, part ${p.part + 1}` : ''}`;
		const tasks = r.schedule.days.find((d) => d.day === p.day)?.tasks.filter((t) => pourOf(t.id) === i) ?? [];
		out.push({
			key: `pour-${i}`,
			date: p.date,
			kind: 'pour',
			title: `${planName}: Pour ${name} (${p.bags} bags)`,
			description: tasks.map((t) => t.text).join('\n')
		});
	});
	for (const m of r.milestones)
		if (m.date)
			out.push({ key: `milestone-${m.id}`, date: m.date, kind: 'milestone', title: `${planName}: ${m.title}`, description: `${m.rule}. Source: ${m.source}.` });
	return out.sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
}
