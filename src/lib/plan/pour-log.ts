// The pour log: what the crew records on the day (start, each batch, end, bags used, air
// temperatures, notes) as a list of records, each with its own idempotency key so a record sent
// twice (a retry, a queue replayed after an outage) is stored once. One zod schema serves the pour
// page, the records endpoint and the engine. From the logged temperatures the strength timeline and
// milestones are worked out again by the engine's maturity code (ASTM C1074 equivalent age).

import { z } from 'zod';
import type { PlanResult } from './index';
import type { Model } from './model';
import { airTempOn, toModel } from './model';
import type { ParseResult } from './schema';
import { addDays, ageSeries, milestones, type Milestone } from './schedule';
import { strengthTimeline, type StrengthDay } from './strength';
import { times } from './util';

/** Limits, each one said in its error. */
export const POUR_LOG_LIMITS = {
	/** Records in one request. */
	perRequest: 50,
	/** Records a plan can hold in all (a 150-batch pour with temperatures and notes fits easily). */
	perPlan: 2000,
	noteChars: 1000,
	pours: 50,
	bags: 5000,
	/** Air temperature range accepted, °C / °F. */
	celsius: [-40, 60],
	fahrenheit: [-40, 140]
} as const;

const L = POUR_LOG_LIMITS;
export const RECORD_KEY = /^[A-Za-z0-9_.:-]{8,100}$/;

const key = z.string().regex(RECORD_KEY, 'Each record needs a key of 8 to 100 letters, digits or _ . : - characters.');
/** Epoch milliseconds, years 2000–2100. */
const at = z
	.number()
	.int('The time must be whole milliseconds.')
	.min(946684800000, 'The time must be after the year 2000.')
	.max(4102444800000, 'The time must be before the year 2100.');
/** The device's offset from UTC in minutes (Date#getTimezoneOffset), for the local date. */
const tz = z
	.number()
	.int()
	.min(-840, 'The time-zone offset must be between −840 and 840 minutes.')
	.max(840, 'The time-zone offset must be between −840 and 840 minutes.');
const pour = z
	.number()
	.int('The pour must be a whole number.')
	.min(0, 'The pour number must be 0 or more.')
	.max(L.pours - 1, `A plan has at most ${L.pours} pours.`);
const base = { key, at, tz };
const isoDate = z.iso.date('The date must be YYYY-MM-DD.');
const temp = z.number('Type each temperature as a number, such as 48 or 48.5.').finite('Type each temperature as a number, such as 48 or 48.5.');

export const pourRecordSchema = z
	.discriminatedUnion('kind', [
		z.object({ kind: z.literal('start'), ...base, pour }),
		z.object({ kind: z.literal('batch'), ...base, pour }),
		/** Takes back one start, batch or end tapped by mistake: `of` is that record's key. */
		z.object({ kind: z.literal('undo'), ...base, pour, of: key }),
		z.object({ kind: z.literal('end'), ...base, pour }),
		z.object({
			kind: z.literal('bags'),
			...base,
			pour,
			bags: z.number().int('Bags used must be a whole number.').min(0, 'Bags used cannot be negative.').max(L.bags, `Bags used can be at most ${L.bags}.`)
		}),
		/** The day's low and high, or one reading at a time of day. */
		z.object({
			kind: z.literal('temp'),
			...base,
			date: isoDate,
			unit: z.enum(['C', 'F'], 'The unit must be C or F.'),
			low: temp.optional(),
			high: temp.optional(),
			reading: temp.optional(),
			time: z
				.string()
				.regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'The time must be HH:MM.')
				.optional()
		}),
		z.object({
			kind: z.literal('note'),
			...base,
			text: z.string().trim().min(1, 'A note cannot be empty.').max(L.noteChars, `A note can be at most ${L.noteChars} characters.`)
		})
	])
	.superRefine((r, ctx) => {
		if (r.kind !== 'temp') return;
		const [lo, hi] = r.unit === 'C' ? L.celsius : L.fahrenheit;
		const range = `Air temperatures must be between ${lo} and ${hi} °${r.unit}.`;
		for (const k of ['low', 'high', 'reading'] as const) {
			const v = r[k];
			if (v !== undefined && (v < lo || v > hi)) ctx.addIssue({ code: 'custom', path: [k], message: range });
		}
		const pair = r.low !== undefined && r.high !== undefined;
		if (pair === (r.reading !== undefined) || (!pair && (r.low !== undefined || r.high !== undefined)))
			ctx.addIssue({ code: 'custom', path: ['reading'], message: 'Give either the day’s low and high, or one reading.' });
		if (pair && r.low! > r.high!) ctx.addIssue({ code: 'custom', path: ['low'], message: 'The low cannot be above the high.' });
		// A day not yet begun has no temperature to log; counted as logged, a guess would move the forecast.
		// (Refinements run even when a field failed: a time or offset that is not a date is said above.)
		const now = new Date(r.at - r.tz * 60_000);
		if (Number.isNaN(now.getTime()) || typeof r.date !== 'string') return;
		const today = now.toISOString().slice(0, 10);
		if (r.date > today) ctx.addIssue({ code: 'custom', path: ['date'], message: futureTempMessage(today) });
	});

/** The rule for a temperature's date, with the logger's own today in it. */
export const futureTempMessage = (today: string) => `A temperature can be logged for today or an earlier day, not a later one (today here is ${today}).`;

/**
 * The server's own check of a temperature's date: not after today where the device is, taken in
 * the record's own offset at the server's clock. Offsets run from −14 to +14 hours, so this allows
 * at most the day a time-zone difference gives, and refuses a device clock set days ahead.
 */
export function futureTemp(records: readonly PourRecord[], now = Date.now()): { path: string; message: string } | null {
	for (const [i, r] of records.entries()) {
		if (r.kind !== 'temp') continue;
		const today = localDate({ at: now, tz: r.tz });
		if (r.date > today) return { path: `records.${i}.date`, message: futureTempMessage(today) };
	}
	return null;
}

export const pourRecordsBody = z.object({
	records: z.array(pourRecordSchema).min(1, 'Send at least one record.').max(L.perRequest, `Send at most ${L.perRequest} records at a time.`)
});

export type PourRecord = z.infer<typeof pourRecordSchema>;
export type TempRecord = Extract<PourRecord, { kind: 'temp' }>;

/** The device-local calendar date of a record. */
export const localDate = (r: Pick<PourRecord, 'at' | 'tz'>) => new Date(r.at - r.tz * 60_000).toISOString().slice(0, 10);

export const toCelsius = (v: number, unit: 'C' | 'F') => (unit === 'C' ? v : ((v - 32) * 5) / 9);

export interface PourLogEntry {
	pour: number;
	/** The first start still counted. */
	startedAt?: number;
	/** Keys of the starts still counted (two devices may each have started the pour). */
	startKeys: string[];
	/** Times of the batches still counted (undone ones left out), in order. */
	batches: number[];
	batchKeys: string[];
	/** The first "Placing done" still standing: pressed after a batch, and no batch after it. */
	endedAt?: number;
	/** Keys of the "Placing done" records standing (two devices may each have pressed it). */
	endKeys: string[];
	bagsUsed?: number;
	/** Local date of the first batch, else of the start. */
	date?: string;
}

export interface PourLog {
	pours: Map<number, PourLogEntry>;
	temps: TempRecord[];
	notes: Extract<PourRecord, { kind: 'note' }>[];
}

/** Kinds an undo can take back: the one-tap records of a pour (a new bags record replaces the last). */
const UNDOABLE = new Set<PourRecord['kind']>(['start', 'batch', 'end']);

/**
 * Folds records into the log. The answer depends only on the set of records, never on the order
 * they arrived in: duplicates by key are dropped (the first kept), the rest are taken in time order.
 * Per pour, the rules a crew would expect (each pair is a row of the table in pour-log.spec.ts):
 * - an undo takes back the start, batch or "Placing done" it names, of its own pour; an undo naming
 *   nothing held, another pour's record, another kind of record or another undo changes nothing;
 * - a second start (another device) keeps the first start's time; taking back the start takes back all;
 * - "Placing done" before any batch is ignored (nothing is placed yet);
 * - a batch after "Placing done" means placing was not done: the pour is placing again until the
 *   next "Placing done" (taking that batch back makes the earlier one stand again);
 * - a second "Placing done" keeps the first one's time.
 */
export function foldRecords(records: readonly PourRecord[]): PourLog {
	const seen = new Set<string>();
	const list = records.filter((r) => !seen.has(r.key) && seen.add(r.key)).sort((a, b) => a.at - b.at || (a.key < b.key ? -1 : 1));
	const byKey = new Map(list.map((r) => [r.key, r]));
	const undone = new Set(
		list.flatMap((r) => {
			if (r.kind !== 'undo') return [];
			const target = byKey.get(r.of);
			return target && UNDOABLE.has(target.kind) && 'pour' in target && target.pour === r.pour ? [r.of] : [];
		})
	);
	const pours = new Map<number, PourLogEntry>();
	const entry = (p: number) => {
		if (!pours.has(p)) pours.set(p, { pour: p, startKeys: [], batches: [], batchKeys: [], endKeys: [] });
		return pours.get(p)!;
	};
	const log: PourLog = { pours, temps: [], notes: [] };
	for (const r of list) {
		if (undone.has(r.key)) continue;
		switch (r.kind) {
			case 'start': {
				const e = entry(r.pour);
				e.startedAt ??= r.at;
				e.startKeys.push(r.key);
				e.date ??= localDate(r);
				break;
			}
			case 'batch': {
				const e = entry(r.pour);
				if (!e.batches.length) e.date = localDate(r);
				e.batches.push(r.at);
				e.batchKeys.push(r.key);
				e.endedAt = undefined;
				e.endKeys = [];
				break;
			}
			case 'end': {
				const e = pours.get(r.pour);
				if (!e?.batches.length) break;
				e.endedAt ??= r.at;
				e.endKeys.push(r.key);
				break;
			}
			case 'bags':
				entry(r.pour).bagsUsed = r.bags;
				break;
			case 'temp':
				log.temps.push(r);
				break;
			case 'note':
				log.notes.push(r);
				break;
		}
	}
	return log;
}

/**
 * Daily mean air temperature, °C, by date: the mean of the latest low and high given for the day,
 * else the mean of that day's readings (the daily mean the engine's timeline takes).
 */
export function dailyMeans(temps: readonly TempRecord[]): Map<string, number> {
	const pairs = new Map<string, number>();
	const readings = new Map<string, number[]>();
	for (const t of temps) {
		if (t.low !== undefined && t.high !== undefined) pairs.set(t.date, (toCelsius(t.low, t.unit) + toCelsius(t.high, t.unit)) / 2);
		else if (t.reading !== undefined) readings.set(t.date, [...(readings.get(t.date) ?? []), toCelsius(t.reading, t.unit)]);
	}
	const out = new Map(pairs);
	for (const [d, rs] of readings) if (!out.has(d)) out.set(d, rs.reduce((a, b) => a + b, 0) / rs.length);
	return out;
}

export interface LoggedForecast {
	/** Local date of the last section's pour, the day the timeline counts from: logged, or planned while it is to come. */
	pourDate: string;
	/** Whether the last section's pour is logged (else pourDate is its planned day, moved with the pours logged). */
	lastLogged: boolean;
	strength: StrengthDay[];
	milestones: Milestone[];
	/** Days of the timeline's first four weeks whose temperature was logged (the rest: the plan's forecast). */
	loggedDays: number;
	/** Daily mean used for each day from the pour day on, °C, and whether it was logged. */
	temps: { date: string; celsius: number; logged: boolean }[];
	/** Days with a temperature logged before pourDate: kept, but not counted (the concrete was not placed yet). */
	before: string[];
	/** Whether a section was poured on a day before pourDate: then "before the pour" means before the last one. */
	earlierPours: boolean;
}

/** The pours the crew started or mixed a batch of, with their local dates. */
const started = (log: PourLog) => [...log.pours.values()].filter((p) => p.date && (p.batches.length || p.startedAt !== undefined));

/** Local dates of the pours started or mixed, earliest first, each once. */
export function loggedPourDates(log: PourLog): string[] {
	return [...new Set(started(log).map((p) => p.date!))].sort();
}

/**
 * The strength timeline and milestones again, from the last section's pour day and the logged
 * daily means; a day without a reading takes the plan's forecast for it (ASTM C1074 equivalent
 * age through the engine's equivalentAges/ageSeries, ACI 209R-92 Eq. 2-1 for the strength).
 * The count starts where the curing reminders and the calendar start it (loggedFirstPourDate):
 * the last planned pour's logged day, or, while it is still to come, its planned day moved with
 * the pours logged. `plannedDays`: the day plan's day number of each pour, so an unlogged day
 * reads the same forecast day the plan did.
 */
export function loggedForecast(m: Model, log: PourLog, plannedDays: readonly number[], days = 28): LoggedForecast | null {
	if (!plannedDays.length) plannedDays = [0];
	const pourDate = loggedCountFrom(log, plannedDays);
	if (!pourDate) return null;
	const plannedLast = plannedDays[lastPour(plannedDays)] - plannedDays[0];
	const lastLogged = started(log).some((p) => p.pour === lastPour(plannedDays));
	const means = dailyMeans(log.temps);
	const date = (i: number) => addDays(pourDate, i);
	const tempOn = (i: number) => means.get(date(i)) ?? airTempOn(m, plannedLast + i);
	const temps = times(days, (i) => ({ date: date(i), celsius: tempOn(i), logged: means.has(date(i)) }));
	const strength = strengthTimeline(
		temps.map((t) => t.celsius),
		m.cement,
		m.designStrengthMpa
	).map((d) => ({ ...d, date: date(d.day) }));
	// Counted from the last section's pour day: the same milestone rules on the logged equivalent ages.
	const stones = milestones({ ...m, pourDate }, ageSeries(0, tempOn), 0);
	const before = [...means.keys()].filter((d) => d < pourDate).sort();
	const earlierPours = loggedPourDates(log).some((d) => d < pourDate);
	return { pourDate, lastLogged, strength, milestones: stones, loggedDays: temps.filter((t) => t.logged).length, temps, before, earlierPours };
}

/**
 * The first pour's date as the log has it, for counting the curing days (`plannedDays`: the day
 * plan's day number of each pour). The slab's milestones count from its last section, so once the
 * last planned pour is logged its day sets the count, moved back by its planned offset from the
 * first; until then the lowest-numbered pour the crew started (or mixed a batch of) moves the whole
 * set, keeping the plan's spacing for the pours still to come. Null when nothing was started.
 */
export function loggedFirstPourDate(log: PourLog, plannedDays: readonly number[]): string | null {
	const pours = started(log)
		.filter((p) => p.pour < plannedDays.length)
		.sort((a, b) => a.pour - b.pour);
	const last = pours.find((p) => p.pour === lastPour(plannedDays)) ?? pours[0];
	if (!last?.date) return null;
	return addDays(last.date, -(plannedDays[last.pour] - plannedDays[0]));
}

/**
 * The day the slab's logged strength and milestones count from: the last planned pour's logged
 * day, or its planned day moved with the pours logged while it is still to come. Null when
 * nothing was started.
 */
export function loggedCountFrom(log: PourLog, plannedDays: readonly number[]): string | null {
	const first = loggedFirstPourDate(log, plannedDays);
	return first && addDays(first, plannedDays[lastPour(plannedDays)] - plannedDays[0]);
}

/**
 * The last planned pour's logged day when the plan has several pours and that one is logged: the
 * day every date then counts from (loggedFirstPourDate). Null otherwise.
 */
export function loggedLastPourDate(log: PourLog, plannedDays: readonly number[]): string | null {
	if (plannedDays.length < 2) return null;
	return started(log).find((p) => p.pour === lastPour(plannedDays))?.date ?? null;
}

/** The index of the pour planned last (the latest day; the higher number on a tie). */
const lastPour = (plannedDays: readonly number[]) => plannedDays.reduce((best, d, i) => (d >= plannedDays[best] ? i : best), 0);

/** loggedForecast for a saved plan: its input (parsed once by the caller), its computed result and its records. */
export function loggedForecastFor(parsed: ParseResult, result: Pick<PlanResult, 'schedule'>, records: readonly PourRecord[]): LoggedForecast | null {
	if (!records.length || !parsed.ok) return null;
	return loggedForecast(
		toModel(parsed.plan),
		foldRecords(records),
		result.schedule.pourDays.map((p) => p.day)
	);
}
