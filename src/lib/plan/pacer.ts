// Pour-day pacer: for each pour of the plan, the batches mixed so far against the working time the
// engine gives at that day's temperature, the pace that still leaves time to screed and finish, the
// fallback when the rest cannot be placed in time, and the finishing steps with their windows.
// Pure: the clock ("now") and the logged batch times are passed in.

import type { PlanResult } from './index';
import { workingMinutes } from './mixing';

export interface FinishStep {
	id: string;
	text: string;
	/** Minutes after the last batch is placed when the step is due to start and end; null: as you go. */
	window: { from: number; to: number } | null;
}

export interface PacerPour {
	/** Index in the day plan's list of pours. */
	index: number;
	section: number;
	part: number;
	name: string;
	bags: number;
	/** Bags mixed in one batch: the drum's load, or one bag at a time by hand. */
	bagsPerBatch: number;
	batches: number;
	/** The crew's planned minutes per bag, mixing and placing (the engine's crew time). */
	minutesPerBag: number;
	/** Working time at the pour day's temperature (the engine's workingMinutes). */
	workingMinutes: number;
	/** Minutes kept after the last batch to screed, float, edge and joint. */
	finishMinutes: number;
	temperatureC: number;
	/** The day plan's day number of this pour (0 for the first pour day). */
	day: number;
	date?: string;
	fallback: { kind: 'cold-joint' | 'bulkhead'; text: string };
	finishing: FinishStep[];
}

/**
 * Windows for the finishing steps at 70 °F, in minutes after the last batch, scaled with the
 * temperature by the same factor as the working time. Bleed water, edging, tooling and brooming:
 * common practice, no published source (from memory). Saw-cutting: 4–12 h after placing with a
 * conventional saw (ACI 302.1R-15), not scaled.
 */
const WINDOWS_AT_70F: Record<string, { from: number; to: number; scaled: boolean } | null> = {
	screed: null,
	bleed: { from: 30, to: 120, scaled: true },
	edge: { from: 60, to: 180, scaled: true },
	tool: { from: 60, to: 180, scaled: true },
	'saw-window': { from: 240, to: 720, scaled: false },
	broom: { from: 90, to: 240, scaled: true }
};

/** The pours of a computed plan, as the pacer uses them. */
export function pacerPours(r: PlanResult): PacerPour[] {
	const tasks = new Map(r.schedule.days.flatMap((d) => d.tasks.map((t) => [t.id, t.text] as const)));
	return r.schedule.pourDays.map((p, index) => {
		const s = r.mixing.sections[p.section];
		const split = s.split && s.split.coldJoints.length > 0;
		const name = `${r.geometry.sections[p.section]?.name ?? `Section ${p.section + 1}`}${split ? `, part ${p.part + 1}` : ''}`;
		const bagsPerBatch = r.mixing.method === 'drum' && s.batches ? Math.max(1, Math.ceil(s.bags / s.batches)) : 1;
		const minutesPerBag = s.bags ? s.totalMinutes / s.bags : 0;
		const factor = workingMinutes(1, s.temperature.celsius);
		const finishing: FinishStep[] = [];
		for (const [id, w] of Object.entries(WINDOWS_AT_70F)) {
			const text = tasks.get(`${id}-${index}`);
			if (!text) continue;
			const k = w?.scaled ? factor : 1;
			finishing.push({ id, text, window: w ? { from: Math.round(w.from * k), to: Math.round(w.to * k) } : null });
		}
		return {
			index,
			section: p.section,
			part: p.part,
			name,
			bags: p.bags,
			bagsPerBatch,
			batches: Math.ceil(p.bags / bagsPerBatch),
			minutesPerBag,
			workingMinutes: s.workingMinutes,
			finishMinutes: s.finishMinutes,
			temperatureC: s.temperature.celsius,
			day: p.day,
			date: p.date,
			fallback: split
				? {
						kind: 'cold-joint',
						text: 'Stop short at a control-joint line before this part’s cold joint, set a bulkhead board there on stakes, and finish what is placed; pour the rest with the next part.'
					}
				: {
						kind: 'bulkhead',
						text: 'Stop placing at the nearest control-joint line you can fill to, set a bulkhead board there on stakes, and finish what is placed; the rest is a separate pour once this one has set.'
					},
			finishing
		};
	});
}

/** What the device records for one pour: when Start was pressed and when each batch was added (ms). */
export interface PourTally {
	startedAt?: number;
	batches: number[];
}

export interface PaceState {
	status: 'not-started' | 'started' | 'placing' | 'placed';
	batches: number;
	bagsDone: number;
	bagsLeft: number;
	/** Minutes since the first batch (0 before it). */
	elapsed: number;
	/** Minutes from the first batch by which the last bag must be in: working time less finishing. */
	placeBy: number;
	/** Minutes ahead (+) or behind (−) the even pace that places the last bag at placeBy. */
	aheadBy: number | null;
	/** Minutes a bag takes: the crew's logged rate once two batches are in, else the plan's. */
	minutesPerBag: number;
	/** Minutes from the first batch when the last bag will be in at that rate. */
	projectedEnd: number | null;
	canFinish: boolean;
	/** Of the bags left, how many can still go in before placeBy at that rate. */
	bagsThatFit: number;
	/** Clock time (ms) of the last batch once every bag is in. */
	placedAt: number | null;
}

const MIN = 60_000;

/** The pacer's reading of one pour at `now` (ms). Batch times after `now` are ignored. */
export function pace(p: PacerPour, tally: PourTally, now: number): PaceState {
	const times = tally.batches.filter((t) => t <= now).sort((a, b) => a - b);
	const n = times.length;
	const bagsDone = Math.min(p.bags, n * p.bagsPerBatch);
	const bagsLeft = p.bags - bagsDone;
	const placeBy = Math.max(0, p.workingMinutes - p.finishMinutes);
	const first = times[0];
	const elapsed = n ? (now - first) / MIN : 0;
	// The crew's own rate from the gaps between batches, once there are two.
	const logged = n >= 2 ? (times[n - 1] - first) / MIN / ((n - 1) * p.bagsPerBatch) : null;
	const minutesPerBag = logged !== null && logged > 0 ? logged : p.minutesPerBag;
	const status: PaceState['status'] = !n ? (tally.startedAt === undefined ? 'not-started' : 'started') : bagsLeft > 0 ? 'placing' : 'placed';
	if (!n)
		return {
			status,
			batches: 0,
			bagsDone: 0,
			bagsLeft,
			elapsed: 0,
			placeBy,
			aheadBy: null,
			minutesPerBag,
			projectedEnd: p.bags * minutesPerBag,
			canFinish: p.bags * minutesPerBag <= placeBy + 1e-9,
			bagsThatFit: Math.min(bagsLeft, minutesPerBag ? Math.floor(placeBy / minutesPerBag + 1e-9) : bagsLeft),
			placedAt: null
		};
	// The even pace credits each bag with placeBy / bags minutes.
	const aheadBy = p.bags ? (bagsDone * placeBy) / p.bags - elapsed : 0;
	const projectedEnd = bagsLeft ? elapsed + bagsLeft * minutesPerBag : (times[n - 1] - first) / MIN;
	const room = placeBy - elapsed;
	return {
		status,
		batches: n,
		bagsDone,
		bagsLeft,
		elapsed,
		placeBy,
		aheadBy,
		minutesPerBag,
		projectedEnd,
		canFinish: bagsLeft === 0 || projectedEnd <= placeBy + 1e-9,
		bagsThatFit: bagsLeft === 0 ? 0 : room <= 0 ? 0 : Math.min(bagsLeft, minutesPerBag ? Math.floor(room / minutesPerBag + 1e-9) : bagsLeft),
		placedAt: bagsLeft === 0 ? times[n - 1] : null
	};
}

/** Whole minutes as "1 h 05 min" or "35 min". */
export function minutesText(min: number): string {
	const m = Math.round(Math.abs(min));
	return m >= 60 ? `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min` : `${m} min`;
}
