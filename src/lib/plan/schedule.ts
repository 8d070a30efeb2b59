// The day plan: site work, one pour per day (a bulkhead comes off only once the earlier section has
// set), stripping, moist curing, and the strength milestones from the equivalent-age timeline.

import type { ColdJointSeg } from './geometry';
import type { Model } from './model';
import * as utilLib from './util';
import * as strengthLib from './strength';
import type { StrengthDay } from './strength';

// Bound once: under the test runner every call through an import is a getter call.
const { times } = utilLib;
const { ageFactor, equivalentAges, strengthRatio, strengthTimeline } = strengthLib;

/** Plan day of the first pour: day 1 layout and digging, day 2 forms and base. */
export const FIRST_POUR_DAY = 3;
/** Days of timeline computed so late milestones in cold weather are still found. */
const HORIZON = 90;

/** ACI 308R / ACI 318 §26.5.3: keep moist at least 7 days (3 high-early), and until 70 % of f'c. */
export const CURING = { typeI: 7, typeIII: 3, percent: 70 } as const;

/** Calendar offset (0 = first pour) of each section's pour. */
export function pourOffsets(m: Model, coldJoints: readonly ColdJointSeg[], tempOn: (d: number) => number): number[] {
	// cumulative[d]: equivalent age gained from day 0 up to the start of day d.
	const cumulative = [0];
	let lastT = NaN;
	let f = 0;
	for (let d = 0; d < HORIZON; d++) {
		const t = tempOn(d);
		if (t !== lastT) {
			f = ageFactor(t); // one exp per change of temperature, not per day
			lastT = t;
		}
		cumulative.push(cumulative[d] + f);
	}
	const offsets: number[] = [];
	for (let k = 0; k < m.sections.length; k++) {
		const earlier = coldJoints.filter((j) => j.sections[1] === k).map((j) => offsets[j.sections[0]]);
		let day = k === 0 ? 0 : offsets[k - 1] + 1;
		const set = (from: number) => cumulative[Math.min(day, HORIZON)] - cumulative[from] >= m.milestones.formsOffDays - 1e-9;
		while (day < HORIZON && !earlier.every(set)) day++;
		offsets.push(day);
	}
	return offsets;
}

/** Days since 1970-01-01 for a proleptic Gregorian date (civil-calendar arithmetic, no Date). */
export function dayNumber(y: number, m: number, d: number): number {
	const yy = m <= 2 ? y - 1 : y;
	const era = Math.floor(yy / 400);
	const yoe = yy - era * 400;
	const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
	return era * 146097 + yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy - 719468;
}

/** The inverse of dayNumber, as YYYY-MM-DD. */
export function isoDate(z: number): string {
	const zz = z + 719468;
	const era = Math.floor(zz / 146097);
	const doe = zz - era * 146097;
	const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
	const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
	const mp = Math.floor((5 * doy + 2) / 153);
	const d = doy - Math.floor((153 * mp + 2) / 5) + 1;
	const m = mp < 10 ? mp + 3 : mp - 9;
	const y = yoe + era * 400 + (m <= 2 ? 1 : 0);
	return `${String(y).padStart(4, '0')}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`;
}

/** An ISO date n days later. The schedule builds dozens of these, so no Date parsing. */
export const addDays = (iso: string, n: number) => datesFrom(iso)(n);

/** Dates counted from one ISO date, with the parse done once. */
export function datesFrom(iso: string): (n: number) => string {
	const base = dayNumber(+iso.slice(0, 4), +iso.slice(5, 7), +iso.slice(8, 10));
	return (n) => isoDate(base + n);
}

export interface Milestone {
	id: 'forms-off' | 'walk' | 'furniture' | 'vehicles' | 'curing-done';
	title: string;
	/** Days after the last pour; null when not reached within the horizon. */
	day: number | null;
	planDay: number | null;
	date?: string;
	rule: string;
	source: string;
}

export interface ScheduleDay {
	day: number;
	date?: string;
	tasks: { id: string; text: string }[];
}

export interface ScheduleResult {
	days: ScheduleDay[];
	pourDays: { section: number; day: number; date?: string }[];
	curingDays: number;
}

/** Equivalent age after each whole day since the last pour, far enough out for cold weather. */
export function ageSeries(lastPour: number, tempOn: (d: number) => number): number[] {
	return equivalentAges(times(HORIZON, (i) => tempOn(lastPour + i)));
}

/** The day-by-day strength timeline shown to people, with dates when the pour date is known. */
export function strengthSeries(m: Model, lastPour: number, tempOn: (d: number) => number, days: number): StrengthDay[] {
	const temps = times(days, (i) => tempOn(lastPour + i));
	const out = strengthTimeline(temps, m.cement, m.designStrengthMpa);
	if (m.pourDate) {
		const date = datesFrom(m.pourDate);
		for (const d of out) d.date = date(lastPour + d.day);
	}
	return out;
}

export function milestones(m: Model, ages: number[], lastPour: number): Milestone[] {
	const ms = m.milestones;
	const first = (ok: (te: number) => boolean) => {
		const i = ages.findIndex(ok);
		return i < 0 ? null : i + 1;
	};
	const byAge = (days: number) => first((te) => te >= days - 1e-9);
	const byPercent = (p: number) => first((te) => strengthRatio(te, m.cement) * 100 >= p - 1e-9);
	const curingMin = CURING[m.cement];
	const to70 = byPercent(CURING.percent);
	const list: Omit<Milestone, 'planDay' | 'date'>[] = [
		{ id: 'forms-off', title: 'Strip the forms', day: byAge(ms.formsOffDays), rule: `${ms.formsOffDays} day(s) at 20 °C equivalent age`, source: 'common practice (about 24 h)' },
		{ id: 'walk', title: 'Walk on it', day: byAge(ms.walkDays), rule: `${ms.walkDays} day(s) at 20 °C equivalent age`, source: 'common practice (24–48 h)' },
		{ id: 'furniture', title: 'Set furniture on it', day: byAge(ms.furnitureDays), rule: `${ms.furnitureDays} day(s) at 20 °C equivalent age`, source: 'from memory' },
		{ id: 'vehicles', title: 'Drive on it', day: byPercent(ms.vehiclePercent), rule: `${ms.vehiclePercent} % of design strength`, source: 'common practice (about 70 % of design strength)' },
		{ id: 'curing-done', title: 'Stop moist curing', day: to70 === null ? null : Math.max(curingMin, to70), rule: `at least ${curingMin} days and until ${CURING.percent} % of design strength`, source: 'ACI 308R; ACI 318 §26.5.3' }
	];
	const date = m.pourDate ? datesFrom(m.pourDate) : null;
	return list.map((x) => {
		const planDay = x.day === null ? null : FIRST_POUR_DAY + lastPour + x.day;
		return { ...x, planDay, date: date && planDay !== null ? date(planDay - FIRST_POUR_DAY) : undefined };
	});
}

export function buildSchedule(
	m: Model,
	offsets: number[],
	bagsPerSection: number[],
	stones: Milestone[]
): ScheduleResult {
	const days = new Map<number, ScheduleDay['tasks']>();
	const add = (day: number, id: string, text: string) => {
		if (!days.has(day)) days.set(day, []);
		days.get(day)!.push({ id, text });
	};
	add(0, 'locate', 'Before digging: call 811 (or your one-call number) and wait for the utility marks.');
	add(1, 'layout', 'Lay out the outline with stakes and string; mark the high point from the reference.');
	add(1, 'dig', 'Dig to slab thickness plus base depth, and the trenches for any thickened edges.');
	add(2, 'forms', 'Set the form boards and stakes to the level-line table; coat the boards with release agent.');
	add(2, 'base', 'Spread the base and compact it in lifts; fit the isolation strip against the house.');
	if (m.reinforcement === 'mesh' || m.reinforcement === 'rebar')
		add(2, 'reinforcement', 'Lay the reinforcement on supports so it ends up within the slab, not on the ground.');
	offsets.forEach((o, i) => {
		const day = FIRST_POUR_DAY + o;
		if (i > 0) add(day, `bulkhead-${i}`, 'Take off the bulkhead at the cold joint before this pour.');
		add(day, `pour-${i}`, `Pour ${m.sections[i].name}: ${bagsPerSection[i]} bags — mix, place, screed, float, edge.`);
		add(day, `joints-${i}`, m.jointMethod === 'saw'
			? 'Saw the control joints as soon as the surface is firm enough not to ravel (from memory: within about 4–12 h).'
			: 'Tool the control joints with a groover while the concrete is still plastic.');
		add(day, `cure-${i}`, 'Start moist curing once the surface can take it without marking.');
	});
	for (const s of stones)
		if (s.planDay !== null) add(s.planDay, s.id, `${s.title} (${s.rule}).`);
	const curing = stones.find((s) => s.id === 'curing-done')?.day ?? CURING[m.cement];
	const date = m.pourDate ? datesFrom(m.pourDate) : null;
	const list = [...days.entries()]
		.sort((a, b) => a[0] - b[0])
		.map(([day, tasks]) => ({
			day,
			date: date ? date(day - FIRST_POUR_DAY) : undefined,
			tasks
		}));
	return {
		days: list,
		pourDays: offsets.map((o, i) => ({
			section: i,
			day: FIRST_POUR_DAY + o,
			date: date ? date(o) : undefined
		})),
		curingDays: curing
	};
}
