// Curing reminders: the days after a pour on which the homeowner has something to do (keep the slab
// moist, strip the forms) or may start doing something (walk on it, set furniture, drive on it),
// read from the plan computed for one first-pour date: the planned one, or a logged one later.

import type { ParsedPlan, ParseResult } from './schema';
import { parsePlanInput } from './schema';
import { PlanInputError } from './geometry';
import { computeParsedPlan, type PlanResult } from './index';
import { addDays, dayNumber } from './schedule';
import { foldRecords, loggedFirstPourDate, loggedLastPourDate, type PourRecord } from './pour-log';

export interface CuringItem {
	id: 'moist' | 'forms-off' | 'walk' | 'furniture' | 'vehicles' | 'curing-done' | 'freeze-safe';
	title: string;
	text: string;
	source: string;
}

/** One reminder e-mail: a calendar day and what it is for. */
export interface CuringDay {
	date: string;
	/** Days after the first pour (1 = the day after). */
	day: number;
	items: CuringItem[];
}

/**
 * At most this many daily keep-it-moist reminders: in cold weather the curing period (counted in
 * equivalent age) can run for weeks, and a reminder a day for longer is noise (common practice, no
 * published source).
 */
export const MAX_MOIST_DAYS = 14;

const days = (a: string, b: string) => dayNumber(+b.slice(0, 4), +b.slice(5, 7), +b.slice(8, 10)) - dayNumber(+a.slice(0, 4), +a.slice(5, 7), +a.slice(8, 10));

/** What to do on a curing day, by method (ACI 308R lists water, sheet and membrane curing). */
function moistItem(method: ParsedPlan['curing']['method']): CuringItem | null {
	switch (method) {
		case 'wet':
			return {
				id: 'moist',
				title: 'Keep it wet',
				text: 'Keep the slab continuously wet today by sprinkling or ponding; do not let it dry between wettings.',
				source: 'ACI 308R'
			};
		case 'cover':
			return {
				id: 'moist',
				title: 'Keep it covered and moist',
				text: 'Check the plastic sheet or wet burlap: lapped, weighted at the edges, and moist underneath; wet the slab again where it has dried.',
				source: 'ACI 308R'
			};
		default:
			return null; // a curing compound needs no daily wetting
	}
}

/**
 * The reminder days for a plan whose first pour is on `pourDate` (YYYY-MM-DD). Each day holds what
 * falls on it: a keep-moist reminder from the day after the first pour until curing ends (at most
 * MAX_MOIST_DAYS of them; none with a curing compound), and the milestones on the days the engine
 * reaches them (strip the forms, walk, furniture, vehicles when the slab takes them, end of curing)
 * and, when the plan's weather is cold, the day the last pour can survive a freeze.
 */
export function curingReminders(input: unknown, pourDate: string): CuringDay[] {
	const parsed = parsePlanInput(input);
	if (!parsed.ok) throw new PlanInputError(parsed.errors);
	const plan: ParsedPlan = { ...parsed.plan, conditions: { ...parsed.plan.conditions, pourDate } };
	return curingDaysOf(computeParsedPlan(plan), plan.curing.method);
}

/** The reminders planned from the plan's own pour date; none without one. */
export function plannedCuringReminders(input: unknown): { pourDate: string | null; days: CuringDay[] } {
	const parsed = parsePlanInput(input);
	const pourDate = parsed.ok ? (parsed.plan.conditions.pourDate ?? null) : null;
	return { pourDate, days: pourDate ? curingReminders(input, pourDate) : [] };
}

/** The plan as its reminders and calendar count it: from one first-pour date, and whether the pour log gave it. */
export interface PlanAsLogged {
	/** The first pour's date the days count from; null when the plan has none and nothing was started. */
	pourDate: string | null;
	/** The plan's own pour date (null when it has none). */
	plannedDate: string | null;
	/** True when pourDate is the day the pour log records, not the planned one. */
	logged: boolean;
	/**
	 * With several pours, the last one's logged day once it is logged: every date then counts from
	 * it, and pourDate is the first pour's day the plan's spacing gives, not necessarily the one logged.
	 */
	loggedLast: string | null;
	plan: ParsedPlan;
	/** The plan computed for pourDate: its day plan, pour days and milestones on the calendar. */
	result: PlanResult;
}

/**
 * The plan computed from the pour date the pour log records once the crew has started a pour
 * (`logged: true`), else from the plan's own pour date. A start logged on another day than planned
 * moves every date with it. The curing reminders and the calendar file both read this, so they
 * always agree. Null when the input does not parse.
 */
export function planAsLogged(input: unknown, records: readonly PourRecord[], known?: PlanResult): PlanAsLogged | null {
	return planAsLoggedFrom(parsePlanInput(input), records, known);
}

/** planAsLogged for an input already parsed (the plan page parses it once for all its readings). */
export function planAsLoggedFrom(parsed: ParseResult, records: readonly PourRecord[], known?: PlanResult): PlanAsLogged | null {
	if (!parsed.ok) return null;
	// `known`: this input's result from this engine version, already at hand (the plan page's stored one).
	const planned = known ?? computeParsedPlan(parsed.plan);
	const plannedDate = parsed.plan.conditions.pourDate ?? null;
	const log = records.length ? foldRecords(records) : null;
	const plannedDays = planned.schedule.pourDays.map((p) => p.day);
	const loggedDate = log && loggedFirstPourDate(log, plannedDays);
	if (!loggedDate) return { pourDate: plannedDate, plannedDate, logged: false, loggedLast: null, plan: parsed.plan, result: planned };
	const plan: ParsedPlan = { ...parsed.plan, conditions: { ...parsed.plan.conditions, pourDate: loggedDate } };
	return { pourDate: loggedDate, plannedDate, logged: true, loggedLast: loggedLastPourDate(log, plannedDays), plan, result: computeParsedPlan(plan) };
}

/** The reminder days and where they count from (see PlanAsLogged). */
export type CuringDaysAsLogged = Pick<PlanAsLogged, 'pourDate' | 'logged' | 'loggedLast'> & { days: CuringDay[] };

/** The reminders counted as planAsLogged counts: from the logged first-pour day once there is one. */
export function curingRemindersFor(input: unknown, records: readonly PourRecord[], known?: PlanResult): CuringDaysAsLogged {
	return curingRemindersFrom(parsePlanInput(input), records, known);
}

/** curingRemindersFor for an input already parsed. */
export function curingRemindersFrom(parsed: ParseResult, records: readonly PourRecord[], known?: PlanResult): CuringDaysAsLogged {
	const d = planAsLoggedFrom(parsed, records, known);
	if (!d?.pourDate) return { pourDate: null, days: [], logged: false, loggedLast: null };
	return { pourDate: d.pourDate, days: curingDaysOf(d.result, d.plan.curing.method), logged: d.logged, loggedLast: d.loggedLast };
}

/** The reminder days of a plan already computed with a pour date. */
export function curingDaysOf(r: PlanResult, method: ParsedPlan['curing']['method']): CuringDay[] {
	const first = r.schedule.pourDays[0]?.date;
	if (!first) return [];
	const byDate = new Map<string, CuringItem[]>();
	const add = (date: string, item: CuringItem) => {
		if (days(first, date) < 1) return; // pour-day work is in the day plan, not a reminder
		if (!byDate.has(date)) byDate.set(date, []);
		byDate.get(date)!.push(item);
	};
	const done = r.milestones.find((m) => m.id === 'curing-done');
	const moist = moistItem(method);
	if (moist) {
		// From the day after the first pour to the day before curing ends after the last pour.
		const end = done?.date ?? addDays(r.schedule.pourDays.at(-1)!.date!, r.schedule.curingDays);
		const n = Math.min(days(first, end) - 1, MAX_MOIST_DAYS);
		for (let d = 1; d <= n; d++) add(addDays(first, d), moist);
	}
	for (const m of r.milestones)
		if (m.date)
			add(m.date, {
				id: m.id,
				title: m.title,
				text: m.id === 'curing-done' ? `${m.title}: ${m.rule}.` : `${m.title} from today: ${m.rule}.`,
				source: m.source
			});
	// The cold-weather caution's own figure: the day the slowest pour reaches 500 psi.
	const safe = r.weather.pours.flatMap((p) => (p.date && p.freezeSafeDay !== null ? [addDays(p.date, p.freezeSafeDay)] : [])).sort();
	if (r.weather.cold && safe.length)
		add(safe.at(-1)!, {
			id: 'freeze-safe',
			title: 'Safe from a single freeze',
			text: 'The slab has reached about 500 psi (3.5 MPa), enough to survive a single freeze; keep it covered through any frost until curing ends, and keep de-icing salts off it this first winter.',
			source: 'ACI 306R (500 psi after Powers); strength from ACI 209R-92 on ASTM C1074 equivalent age'
		});
	return [...byDate.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)).map(([date, items]) => ({ date, day: days(first, date), items }));
}
