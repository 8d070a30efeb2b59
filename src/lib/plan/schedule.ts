// The day plan: the utility locate, site work, one pour per day (a bulkhead comes off only once the
// earlier pour has set), finishing and jointing, curing, and the strength milestones from the
// equivalent-age timeline.

import type { ColdJointSeg } from './geometry';
import type { Model } from './model';
import { mapList, times } from './util';
import { ageFactor, equivalentAges, strengthRatio, strengthTimeline } from './strength';
import type { StrengthDay } from './strength';

/** Plan day of the first pour when no date is known: day 1 the locate call, day 4 layout and digging, day 5 forms and base. */
export const FIRST_POUR_DAY = 6;
/**
 * Working days' notice the one-call centre gets before digging: 2–3 in most US states, so the plan
 * keeps 3 (state one-call laws; 811 guidance says a few working days — common practice).
 */
export const LOCATE_WORKING_DAYS = 3;

/** 0 Sunday … 6 Saturday; 1970-01-01 was a Thursday. */
export const weekday = (dayNum: number) => (((dayNum + 4) % 7) + 7) % 7;

/** Calendar days from the locate call back from a dig date: the call leaves n working days before it (weekends skipped; holidays are the reader's to add). */
export function locateLead(digIso: string | undefined, n = LOCATE_WORKING_DAYS): number {
	if (!digIso) return n;
	const dig = dayNumber(+digIso.slice(0, 4), +digIso.slice(5, 7), +digIso.slice(8, 10));
	let d = dig;
	for (let count = 0; count < n;) {
		d--;
		const w = weekday(d);
		if (w !== 0 && w !== 6) count++;
	}
	return dig - d;
}

/** Plan day of the first pour: the call on day 1, digging when the notice has run, forms the next day, then the pour. */
export function firstPourDay(m: Pick<Model, 'pourDate'>): number {
	return 1 + locateLead(m.pourDate ? addDays(m.pourDate, -2) : undefined) + 2;
}

/** One pour: a whole section, or one part of a split section. */
export interface Pour {
	section: number;
	part: number;
	bags: number;
}
/** Days of timeline computed so late milestones in cold weather are still found. */
const HORIZON = 90;

/**
 * End of curing: 7 days (3 high-early) at 20 °C equivalent age — ACI 318-19 §26.5.3.1 asks them
 * above 50 °F, so cooler days count for less (ASTM C1074) — or sooner once 70 % of f'c is reached,
 * whichever comes first (the 70 % alternative: ACI 308.1, from memory).
 */
export const CURING = { typeI: 7, typeIII: 3, percent: 70 } as const;

/**
 * Calendar offset (0 = first pour) of each pour. A pour waits a day after the one before, and its
 * bulkheads come off only once the pour behind each has set (the forms-off equivalent age): the
 * earlier part of its own section, or any earlier section it shares a cold joint with.
 */
export function pourOffsets(
	m: Model,
	coldJoints: readonly ColdJointSeg[],
	tempOn: (d: number) => number,
	pours: readonly Pick<Pour, 'section' | 'part'>[] = mapList(m.sections, (s) => ({ section: s.index, part: 0 }))
): number[] {
	// cumulative[d]: equivalent age gained from day 0 up to the start of day d.
	// A typed array: one allocation, numbers stored unboxed.
	const cumulative = new Float64Array(HORIZON + 1);
	let lastT = NaN;
	let f = 0;
	for (let d = 0; d < HORIZON; d++) {
		const t = tempOn(d);
		if (t !== lastT) {
			f = ageFactor(t); // one exp per change of temperature, not per day
			lastT = t;
		}
		cumulative[d + 1] = cumulative[d] + f;
	}
	const offsets: number[] = [];
	for (let k = 0; k < pours.length; k++) {
		const { section, part } = pours[k];
		const earlier: number[] = [];
		if (part > 0) earlier.push(offsets[k - 1]);
		else
			for (const j of coldJoints)
				if (j.sections[1] === section)
					pours.forEach((q, i) => {
						if (i < k && q.section === j.sections[0]) earlier.push(offsets[i]);
					});
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
	/** One entry per pour; a split section has one per part. */
	pourDays: { section: number; part: number; bags: number; day: number; date?: string }[];
	curingDays: number;
	/** The plan day of the locate call and of digging. */
	locateDay: number;
	digDay: number;
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
	const first0 = firstPourDay(m);
	const ms = m.milestones;
	const first = (ok: (te: number) => boolean) => {
		const i = ages.findIndex(ok);
		return i < 0 ? null : i + 1;
	};
	const byAge = (days: number) => first((te) => te >= days - 1e-9);
	const byPercent = (p: number) => first((te) => strengthRatio(te, m.cement) * 100 >= p - 1e-9);
	const curingMin = CURING[m.cement];
	// Equivalent age at 20 °C (ASTM C1074) in the plan's own temperature unit, in plain words.
	const asIfAt = `of curing as if at ${m.units === 'imperial' ? '68 °F' : '20 °C'}, cooler days counting for less`;
	const to70 = byPercent(CURING.percent);
	const byDays = byAge(curingMin);
	const list: Omit<Milestone, 'planDay' | 'date'>[] = [
		{
			id: 'forms-off',
			title: 'Strip the forms',
			day: byAge(ms.formsOffDays),
			rule: `${dayCount(ms.formsOffDays)} ${asIfAt}`,
			source: 'common practice (about 24 h)'
		},
		{ id: 'walk', title: 'Walk on it', day: byAge(ms.walkDays), rule: `${dayCount(ms.walkDays)} ${asIfAt}`, source: 'common practice (24–48 h)' },
		{
			id: 'furniture',
			title: 'Set furniture on it',
			day: byAge(ms.furnitureDays),
			rule: `${dayCount(ms.furnitureDays)} ${asIfAt}`,
			source: 'common practice, no published source'
		}, // from memory
		...(m.loads.vehicles
			? [
					{
						id: 'vehicles' as const,
						title: 'Drive on it',
						day: byPercent(ms.vehiclePercent),
						rule: `${ms.vehiclePercent} % of design strength`,
						source: 'common practice (about 70 % of design strength)'
					}
				]
			: []),
		{
			id: 'curing-done',
			title: m.curing.method === 'compound' ? 'Curing compound has done its work' : 'Stop curing',
			day: byDays === null ? to70 : to70 === null ? byDays : Math.min(byDays, to70),
			rule: `${curingMin} days ${asIfAt}, or sooner once ${CURING.percent} % of design strength, whichever comes first`,
			source: `ACI 318-19 §26.5.3.1 (${curingMin} days above 50 °F); 70 %: ACI 308.1` // the 70 % alternative from memory
		}
	];
	const date = m.pourDate ? datesFrom(m.pourDate) : null;
	return mapList(list, (x) => {
		const planDay = x.day === null ? null : first0 + lastPour + x.day;
		return {
			id: x.id,
			title: x.title,
			day: x.day,
			rule: x.rule,
			source: x.source,
			planDay,
			date: date && planDay !== null ? date(planDay - first0) : undefined
		};
	});
}

/** "1 day", "1.5 days", "2 days". */
const dayCount = (n: number) => `${n} day${n === 1 ? '' : 's'}`;

/** Finishing steps on a pour day, each with its source (ACI 302.1R or common practice). */
function finishing(m: Model, jointDepthIn: string): { id: string; text: string }[] {
	return [
		{ id: 'screed', text: 'Screed the surface off the forms as each load goes in, then bull-float it at once (common practice).' },
		{
			id: 'bleed',
			text: 'Wait until the bleed water has left the surface before edging or floating again: working water back in weakens the top (ACI 302.1R).'
		}, // from memory
		{ id: 'edge', text: 'Run an edger along every form and bulkhead (common practice).' },
		m.jointMethod === 'saw'
			? {
					id: 'saw-window',
					text: `Saw the control joints ${jointDepthIn} deep as soon as the cut does not ravel: about 4–12 h after placing with a conventional saw, sooner in heat (ACI 302.1R-15, as ACI's own guidance states); an early-entry saw can cut within a few hours.`
				}
			: {
					id: 'tool',
					text: `Tool the control joints ${jointDepthIn} deep with a groover while the concrete is still plastic, and again after floating (ACI 302.1R).`
				},
		{ id: 'broom', text: 'Broom the surface across the fall for grip once it holds the marks (common practice).' }
	];
}

/** The curing step for the chosen method (ACI 308R lists water, sheet and membrane curing). */
function curingStep(m: Model): string {
	switch (m.curing.method) {
		case 'wet':
			return 'Start wet curing once the surface will not mark: keep it continuously wet by sprinkling or ponding, never letting it dry between wettings (ACI 308R).';
		case 'compound':
			return 'Once the surface sheen has gone, spray the ASTM C309 curing compound in one even coat at the label rate (ACI 308R).';
		default:
			return 'Once the surface will not mark, wet it and cover it with plastic sheet or wet burlap, lapped and weighted at the edges; keep it moist under the cover (ACI 308R).';
	}
}

export function buildSchedule(m: Model, pours: readonly Pour[], offsets: number[], stones: Milestone[], jointDepthIn = '¼ of the thickness'): ScheduleResult {
	const first0 = firstPourDay(m);
	const digDay = first0 - 2;
	const days = new Map<number, ScheduleDay['tasks']>();
	const add = (day: number, id: string, text: string) => {
		if (!days.has(day)) days.set(day, []);
		days.get(day)!.push({ id, text });
	};
	add(
		1,
		'locate',
		`Call 811 (or your one-call number) at least ${LOCATE_WORKING_DAYS} working days before digging, and wait until every utility has marked or cleared (state one-call law rules the notice).`
	);
	add(digDay, 'layout', 'Check the utility marks are all in; lay out the outline with stakes and string; mark the high point from the reference.');
	add(digDay, 'dig', 'Dig to slab thickness plus base depth, the base past the forms, and the trenches for any thickened edges; dig by hand near any marks.');
	// The coat follows the Build-up step's choice (oil: see the form-release-oil caution).
	const coat = {
		agent: 'coat the boards thinly with the form release agent.',
		oil: 'you chose oil to keep concrete off the boards: use a thin film of clean form oil, never used motor oil (see the cautions).',
		none: 'you chose no release coat: wet the boards before the pour and strip them with care.'
	}[m.forms.release];
	add(digDay + 1, 'forms', `Set the form boards and stakes to the level-line table; ${coat}`);
	add(digDay + 1, 'base', 'Spread the base and compact it in lifts; fit the isolation strip against the house.');
	if (m.reinforcement === 'mesh' || m.reinforcement === 'rebar')
		add(digDay + 1, 'reinforcement', 'Lay the reinforcement on chairs so it ends up within the slab, not on the ground.');
	pours.forEach((p, i) => {
		const day = first0 + offsets[i];
		const name = `${m.sections[p.section].name}${pours.some((q) => q.section === p.section && q.part > 0) ? `, part ${p.part + 1}` : ''}`;
		if (p.part > 0) add(day, `bulkhead-${i}`, 'Take off the bulkhead at the cold joint from the last pour; oil its edge and leave the joint straight.');
		else if (i > 0) add(day, `bulkhead-${i}`, 'Take off the bulkhead at the cold joint before this pour.');
		add(day, `pour-${i}`, `Pour ${name}: ${p.bags} bags — mix, place and strike off.`);
		for (const f of finishing(m, jointDepthIn)) add(day, `${f.id}-${i}`, f.text);
		add(day, `cure-${i}`, curingStep(m));
	});
	for (const s of stones) if (s.planDay !== null) add(s.planDay, s.id, `${s.title} (${s.rule}).`);
	const curing = stones.find((s) => s.id === 'curing-done')?.day ?? CURING[m.cement];
	const date = m.pourDate ? datesFrom(m.pourDate) : null;
	const list = mapList(
		[...days.entries()].sort((a, b) => a[0] - b[0]),
		([day, tasks]) => ({
			day,
			date: date ? date(day - first0) : undefined,
			tasks
		})
	);
	return {
		days: list,
		pourDays: mapList(pours, (p, i) => ({
			section: p.section,
			part: p.part,
			bags: p.bags,
			day: first0 + offsets[i],
			date: date ? date(offsets[i]) : undefined
		})),
		curingDays: curing,
		locateDay: 1,
		digDay
	};
}
