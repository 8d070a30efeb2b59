import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import {
	dailyMeans,
	foldRecords,
	futureTemp,
	loggedFirstPourDate,
	loggedForecast,
	loggedPourDates,
	pourRecordSchema,
	pourRecordsBody,
	type PourLog,
	type PourRecord
} from './pour-log';
import { modelOf, rect } from './test-plans';

// A 3 × 3 m pad planned at 20 °C every day, type I cement.
const input = {
	units: 'metric' as const,
	sections: [{ outline: rect(0, 0, 3, 3) }],
	houseEdge: null,
	conditions: { airTemp: 20, humidity: 50, wind: 5, pourDate: '2027-03-01' }
};

const T = Date.UTC(2027, 2, 1, 8, 0);
const rec = (r: Record<string, unknown>, i: number) => ({ key: `rec-${String(i).padStart(4, '0')}`, at: T + i * 60_000, tz: 0, ...r }) as PourRecord;

/** A week of 0 °C nights and 10 °C days logged from the pour day: a 5 °C daily mean. */
const coldWeek = Array.from({ length: 7 }, (_, d) => ({ kind: 'temp', date: `2027-03-0${d + 1}`, unit: 'C', low: 0, high: 10 }));

describe('as logged: a cold week behind the planned timeline', () => {
	const planned = computePlan(input);
	const { m } = modelOf(input);
	// Each day's temperatures logged that evening.
	const log = foldRecords([
		rec({ kind: 'start', pour: 0 }, 0),
		rec({ kind: 'batch', pour: 0 }, 1),
		...coldWeek.map((t, i) => ({ ...rec(t, 10 + i), at: Date.UTC(2027, 2, 1 + i, 20) }))
	]);
	const f = loggedForecast(m, log, [0])!;

	it('counts the days from the logged pour day, with the logged daily means', () => {
		expect(f.pourDate).toBe('2027-03-01');
		expect(f.loggedDays).toBe(7);
		expect(f.temps[0]).toEqual({ date: '2027-03-01', celsius: 5, logged: true });
		expect(f.temps[7]).toEqual({ date: '2027-03-08', celsius: 20, logged: false }); // the plan's forecast after the week
	});

	it('is behind by the equivalent age the maturity method gives', () => {
		// ASTM C1074 equivalent age, Arrhenius form, Q = 5000 K, reference 20 °C:
		// a day at 5 °C counts exp[−5000 (1/278.15 − 1/293.15)] = 0.39860 day, so after 7 days
		// tₑ = 2.7902 days against 7 at 20 °C. ACI 209R-92 Eq. 2-1, type I (a = 4, b = 0.85):
		// planned 7 / (4 + 0.85·7) = 70.35 %; logged 2.7902 / (4 + 0.85·2.7902) = 43.79 %.
		expect(planned.strength[6].equivalentAgeDays).toBeCloseTo(7, 6);
		expect(f.strength[6].equivalentAgeDays).toBeCloseTo(2.7902, 4);
		expect(planned.strength[6].percent).toBeCloseTo(70.35, 2);
		expect(f.strength[6].percent).toBeCloseTo(43.79, 2);
		expect(planned.strength[6].percent - f.strength[6].percent).toBeCloseTo(26.56, 2);
		expect(f.strength[6].date).toBe('2027-03-08');
	});

	it('moves the milestones by the days the cold week costs', () => {
		const day = (list: { id: string; day: number | null }[], id: string) => list.find((s) => s.id === id)!.day;
		// Forms off at 1 equivalent day: 2 × 0.3986 = 0.797 < 1, 3 × 0.3986 = 1.196 → day 3 (planned 1).
		expect([day(planned.milestones, 'forms-off'), day(f.milestones, 'forms-off')]).toEqual([1, 3]);
		// Walk at 2: 5 × 0.3986 = 1.993 < 2 → day 6 (planned 2).
		expect([day(planned.milestones, 'walk'), day(f.milestones, 'walk')]).toEqual([2, 6]);
		// Furniture at 3: 2.790 after the week, + 1 on day 8 at 20 °C → day 8 (planned 3).
		expect([day(planned.milestones, 'furniture'), day(f.milestones, 'furniture')]).toEqual([3, 8]);
		// End of curing: 7 equivalent days (ACI 318-19 §26.5.3.1) or 70 % (tₑ = 6.914): 2.790 + 5 = 7.79 → day 12 (planned 7).
		expect([day(planned.milestones, 'curing-done'), day(f.milestones, 'curing-done')]).toEqual([7, 12]);
		expect(f.milestones.find((s) => s.id === 'walk')!.date).toBe('2027-03-07');
	});
});

describe('records', () => {
	it('keeps one of each key and drops undone batches', () => {
		const a = rec({ kind: 'batch', pour: 0 }, 1);
		const b = rec({ kind: 'batch', pour: 0 }, 2);
		const log = foldRecords([a, a, b, rec({ kind: 'undo', pour: 0, of: b.key }, 3), rec({ kind: 'bags', pour: 0, bags: 12 }, 4)]);
		expect(log.pours.get(0)!.batches).toEqual([a.at]);
		expect(log.pours.get(0)!.bagsUsed).toBe(12);
	});

	it('drops a start and a "placing done" taken back, so a pour started by mistake dates nothing', () => {
		const start = rec({ kind: 'start', pour: 0 }, 1);
		const taken = foldRecords([start, rec({ kind: 'undo', pour: 0, of: start.key }, 2)]);
		expect(taken.pours.get(0)).toBeUndefined();
		const { m } = modelOf(input);
		expect(loggedForecast(m, taken, [0])).toBeNull();
		// Started again later: that start counts.
		const again = rec({ kind: 'start', pour: 0 }, 3);
		expect(foldRecords([start, rec({ kind: 'undo', pour: 0, of: start.key }, 2), again]).pours.get(0)).toMatchObject({
			startedAt: again.at,
			startKeys: [again.key]
		});
		const batch = rec({ kind: 'batch', pour: 0 }, 4);
		const end = rec({ kind: 'end', pour: 0 }, 5);
		expect(foldRecords([again, batch, end]).pours.get(0)).toMatchObject({ endedAt: end.at, endKeys: [end.key] });
		const reopened = foldRecords([again, batch, end, rec({ kind: 'undo', pour: 0, of: end.key }, 6)]).pours.get(0)!;
		expect(reopened.endedAt).toBeUndefined();
		expect(reopened.batches).toEqual([batch.at]);
	});

	it('takes the low/high mean over the readings of a day, and readings otherwise', () => {
		const means = dailyMeans([
			rec({ kind: 'temp', date: '2027-03-01', unit: 'F', reading: 50 }, 1) as never,
			rec({ kind: 'temp', date: '2027-03-01', unit: 'C', low: 2, high: 12 }, 2) as never,
			rec({ kind: 'temp', date: '2027-03-02', unit: 'C', reading: 4, time: '06:00' }, 3) as never,
			rec({ kind: 'temp', date: '2027-03-02', unit: 'F', reading: 50, time: '15:00' }, 4) as never
		]);
		expect(means.get('2027-03-01')).toBe(7);
		expect(means.get('2027-03-02')).toBe(7); // (4 + 10) / 2
	});

	it('says each limit in its error', () => {
		const msg = (r: unknown) => {
			const p = pourRecordSchema.safeParse(r);
			return p.success ? '' : p.error.issues.map((i) => i.message).join(' | ');
		};
		expect(msg(rec({ kind: 'note', text: 'x'.repeat(1001) }, 1))).toMatch(/at most 1000 characters/);
		expect(msg(rec({ kind: 'temp', date: '2027-03-01', unit: 'C', reading: 70 }, 1))).toMatch(/between -40 and 60 °C/);
		expect(msg(rec({ kind: 'temp', date: '2027-03-01', unit: 'C', low: 5 }, 1))).toMatch(/low and high, or one reading/);
		expect(msg(rec({ kind: 'temp', date: '2027-03-01', unit: 'C', low: 9, high: 5 }, 1))).toMatch(/low cannot be above/);
		expect(msg(rec({ kind: 'bags', pour: 0, bags: 9999 }, 1))).toMatch(/at most 5000/);
		expect(msg(rec({ kind: 'batch', pour: 50 }, 1))).toMatch(/at most 50 pours/);
		expect(msg({ ...rec({ kind: 'batch', pour: 0 }, 1), key: 'short' })).toMatch(/8 to 100/);
		expect(msg(rec({ kind: 'temp', date: '2027-03-01', unit: 'F', reading: 60 }, 1))).toBe('');
		const many = Array.from({ length: 51 }, (_, i) => rec({ kind: 'batch', pour: 0 }, i));
		const body = pourRecordsBody.safeParse({ records: many });
		expect(body.success ? '' : body.error.issues[0].message).toBe('Send at most 50 records at a time.');
	});
});

describe('a temperature’s date', () => {
	const temp = (date: string, at: number, tz: number) => ({ kind: 'temp', key: 'temp-0001', at, tz, date, unit: 'C', low: 4, high: 14 });
	const msg = (r: unknown) => {
		const p = pourRecordSchema.safeParse(r);
		return p.success ? '' : p.error.issues.map((i) => i.message).join(' | ');
	};

	it('may be today or earlier on the logging device, in its own offset, not later', () => {
		const evening = Date.UTC(2027, 2, 1, 20); // 20:00 UTC on 1 March
		expect(msg(temp('2027-03-01', evening, 0))).toBe('');
		expect(msg(temp('2027-02-27', evening, 0))).toBe('');
		expect(msg(temp('2027-03-02', evening, 0))).toBe('A temperature can be logged for today or an earlier day, not a later one (today here is 2027-03-01).');
		// At UTC+10 (offset −600 min) it is already 06:00 on 2 March there: that day may be logged.
		expect(msg(temp('2027-03-02', evening, -600))).toBe('');
		expect(msg(temp('2027-03-03', evening, -600))).toMatch(/today here is 2027-03-02/);
		// At UTC−5, 03:00 UTC on 2 March is still 1 March: 2 March is tomorrow there.
		expect(msg(temp('2027-03-02', Date.UTC(2027, 2, 2, 3), 300))).toMatch(/today here is 2027-03-01/);
		// A time or offset that is no date is said as such; the date rule does not throw on it.
		expect(msg(temp('2027-03-01', 'soon' as never, 0))).toMatch(/^Invalid input: expected number/);
		expect(msg(temp('2027-03-01', 5e12, 0))).toBe('The time must be before the year 2100.');
		expect(msg(temp('2027-03-01', Date.UTC(2027, 2, 1), 'east' as never))).toMatch(/^Invalid input: expected number/);
	});

	it('is checked on the server against its own clock in the record’s offset, at most a time zone ahead', () => {
		const now = Date.UTC(2027, 2, 1, 20);
		const r = (date: string, tz: number) => temp(date, now, tz) as PourRecord;
		expect(futureTemp([r('2027-03-01', 0)], now)).toBeNull();
		// UTC+14, the furthest offset there is: 2 March there already, 3 March not yet.
		expect(futureTemp([r('2027-03-02', -840)], now)).toBeNull();
		expect(futureTemp([rec({ kind: 'note', text: 'x' }, 0), r('2027-03-03', -840)], now)).toEqual({
			path: 'records.1.date',
			message: 'A temperature can be logged for today or an earlier day, not a later one (today here is 2027-03-02).'
		});
		// A device whose clock runs a day ahead passes its own check but not the server's.
		expect(futureTemp([{ ...r('2027-03-02', 0), at: now + 86_400_000 }], now)?.message).toMatch(/today here is 2027-03-01/);
	});

	it('before the pour is kept but not counted, and the forecast says which days', () => {
		const { m } = modelOf(input);
		const log = foldRecords([
			rec({ kind: 'temp', date: '2027-02-27', unit: 'C', low: -5, high: 1 }, 0),
			rec({ kind: 'temp', date: '2027-02-28', unit: 'C', reading: 3 }, 1),
			rec({ kind: 'start', pour: 0 }, 2),
			rec({ kind: 'batch', pour: 0 }, 3),
			rec({ kind: 'temp', date: '2027-03-01', unit: 'C', low: 0, high: 10 }, 4)
		]);
		expect(log.temps).toHaveLength(3);
		const f = loggedForecast(m, log, [0])!;
		expect(f.pourDate).toBe('2027-03-01');
		expect(f.before).toEqual(['2027-02-27', '2027-02-28']);
		expect(f.loggedDays).toBe(1);
		expect(f.temps[0]).toEqual({ date: '2027-03-01', celsius: 5, logged: true });
		expect(f.earlierPours).toBe(false);
	});

	it('with two pours, counts from the last section: logged, or its planned day moved with the first while it is to come', () => {
		const { m } = modelOf(input);
		const day = 86_400_000;
		const first = [rec({ kind: 'start', pour: 0 }, 0), rec({ kind: 'batch', pour: 0 }, 1), rec({ kind: 'temp', date: '2027-03-01', unit: 'C', reading: 8 }, 2)];
		// Planned two days apart (day plan days 0 and 2); only the first section is placed, on 1 March.
		const one = loggedForecast(m, foldRecords(first), [0, 2])!;
		expect(one).toMatchObject({ pourDate: '2027-03-03', lastLogged: false, before: ['2027-03-01'], earlierPours: true });
		expect(loggedFirstPourDate(foldRecords(first), [0, 2])).toBe('2027-03-01');
		// The second section goes in four days later, not two: the count moves to its day, and the
		// curing reminders' first-pour date moves with it (they share loggedFirstPourDate).
		const both = foldRecords([
			...first,
			{ ...rec({ kind: 'start', pour: 1 }, 3), at: T + 4 * day },
			{ ...rec({ kind: 'batch', pour: 1 }, 4), at: T + 4 * day + 60_000 }
		]);
		expect(loggedPourDates(both)).toEqual(['2027-03-01', '2027-03-05']);
		expect(loggedForecast(m, both, [0, 2])).toMatchObject({ pourDate: '2027-03-05', lastLogged: true, earlierPours: true });
		expect(loggedFirstPourDate(both, [0, 2])).toBe('2027-03-03');
	});
});

// The fold as a state machine: every (state, action) pair of one pour has a row below and its own
// test. A state is the records that lead to it; an action adds records (or resends or reorders them);
// the expected result is the fold's reading of pour 0, in words.
describe('the pour-log fold, state by action', () => {
	const hhmm = (ms: number) => new Date(ms).toISOString().slice(11, 16);
	/** Records timed on the pour morning, hh:mm UTC. */
	const at = (time: string) => Date.UTC(2027, 2, 1, Number(time.slice(0, 2)), Number(time.slice(3)));
	const r = (key: string, time: string, rest: Record<string, unknown>) => ({ key, at: at(time), tz: 0, ...rest }) as PourRecord;
	const start = r('start-0810', '08:10', { kind: 'start', pour: 0 });
	const batch1 = r('batch-0820', '08:20', { kind: 'batch', pour: 0 });
	const batch2 = r('batch-0830', '08:30', { kind: 'batch', pour: 0 });
	const end = r('end-0840', '08:40', { kind: 'end', pour: 0 });

	const STATES = {
		'not started': [],
		started: [start],
		placing: [start, batch1, batch2],
		'placing done': [start, batch1, batch2, end],
		// Batches with no start: the crew forgot Start, or it was taken back after the batches.
		'batches, no start': [batch1, batch2]
	} satisfies Record<string, PourRecord[]>;
	type State = keyof typeof STATES;

	/** An undo of each key, as the page's take-back buttons send it; with nothing to take back, one naming a key never logged. */
	const undo = (keys: string[], what: string) =>
		(keys.length ? keys : [`never-logged-${what}`]).map((of, i) => r(`undo-${what}-${i}`, '09:00', { kind: 'undo', pour: 0, of }));
	const ACTIONS = {
		start: () => [r('start-0900', '09:00', { kind: 'start', pour: 0 })],
		'+1 batch': () => [r('batch-0900', '09:00', { kind: 'batch', pour: 0 })],
		'placing done': () => [r('end-0900', '09:00', { kind: 'end', pour: 0 })],
		'take back the start': (log: PourLog) => undo(log.pours.get(0)?.startKeys ?? [], 'start'),
		'take back the last batch': (log: PourLog) => undo((log.pours.get(0)?.batchKeys ?? []).slice(-1), 'batch'),
		'take back "placing done"': (log: PourLog) => undo(log.pours.get(0)?.endKeys ?? [], 'end'),
		'bags used': () => [r('bags-0900', '09:00', { kind: 'bags', pour: 0, bags: 12 })],
		temperature: () => [r('temp-0900', '09:00', { kind: 'temp', date: '2027-03-01', unit: 'C', low: 4, high: 14 })],
		note: () => [r('note-0900', '09:00', { kind: 'note', text: 'Base damp.' })],
		// A retry whose answer was lost: the same key twice.
		'+1 batch sent twice': () => [r('batch-0900', '09:00', { kind: 'batch', pour: 0 }), r('batch-0900', '09:00', { kind: 'batch', pour: 0 })],
		// The whole queue replayed after an outage.
		'every record sent again': (_: PourLog, records: PourRecord[]) => records,
		// Another device's batch, timed between the two batches, arriving last.
		'a batch timed 08:25 arriving last': () => [r('batch-0825', '08:25', { kind: 'batch', pour: 0 })],
		// Another device's "Placing done", timed between the two batches, arriving last.
		'"placing done" timed 08:25 arriving last': () => [r('end-0825', '08:25', { kind: 'end', pour: 0 })],
		'the records arriving in reverse order': () => []
	} satisfies Record<string, (log: PourLog, records: PourRecord[]) => PourRecord[]>;
	type Action = keyof typeof ACTIONS;

	/** Pour 0 in words: its start, its batches, "placing done", and what else the log holds. */
	function reading(log: PourLog) {
		const e = log.pours.get(0);
		const n = (count: number, one: string) => (count ? `${count} ${one}${count > 1 ? 's' : ''}` : '');
		return [
			e?.startedAt === undefined ? 'not started' : `started ${hhmm(e.startedAt)}${e.startKeys.length > 1 ? ` (${e.startKeys.length} starts)` : ''}`,
			e?.batches.length ? `batches ${e.batches.map(hhmm).join(' ')}` : 'no batches',
			e?.endedAt === undefined ? '' : `placing done ${hhmm(e.endedAt)}${e.endKeys.length > 1 ? ` (${e.endKeys.length} presses)` : ''}`,
			e?.bagsUsed === undefined ? '' : `${e.bagsUsed} bags used`,
			n(log.temps.length, 'temperature'),
			n(log.notes.length, 'note')
		]
			.filter(Boolean)
			.join(', ');
	}

	const NS = 'not started, no batches';
	const ST = 'started 08:10, no batches';
	const PL = 'started 08:10, batches 08:20 08:30';
	const PD = `${PL}, placing done 08:40`;
	const BN = 'not started, batches 08:20 08:30';
	const TABLE: { state: State; action: Action; expected: string }[] = [
		{ state: 'not started', action: 'start', expected: 'started 09:00, no batches' },
		{ state: 'not started', action: '+1 batch', expected: 'not started, batches 09:00' },
		{ state: 'not started', action: 'placing done', expected: NS }, // nothing placed yet: ignored
		{ state: 'not started', action: 'take back the start', expected: NS }, // nothing to take back
		{ state: 'not started', action: 'take back the last batch', expected: NS },
		{ state: 'not started', action: 'take back "placing done"', expected: NS },
		{ state: 'not started', action: 'bags used', expected: `${NS}, 12 bags used` },
		{ state: 'not started', action: 'temperature', expected: `${NS}, 1 temperature` },
		{ state: 'not started', action: 'note', expected: `${NS}, 1 note` },
		{ state: 'not started', action: '+1 batch sent twice', expected: 'not started, batches 09:00' },
		{ state: 'not started', action: 'every record sent again', expected: NS },
		{ state: 'not started', action: 'a batch timed 08:25 arriving last', expected: 'not started, batches 08:25' },
		{ state: 'not started', action: '"placing done" timed 08:25 arriving last', expected: NS },
		{ state: 'not started', action: 'the records arriving in reverse order', expected: NS },

		{ state: 'started', action: 'start', expected: 'started 08:10 (2 starts), no batches' }, // a second device: the first time stands
		{ state: 'started', action: '+1 batch', expected: 'started 08:10, batches 09:00' },
		{ state: 'started', action: 'placing done', expected: ST }, // nothing placed yet: ignored
		{ state: 'started', action: 'take back the start', expected: NS },
		{ state: 'started', action: 'take back the last batch', expected: ST },
		{ state: 'started', action: 'take back "placing done"', expected: ST },
		{ state: 'started', action: 'bags used', expected: `${ST}, 12 bags used` },
		{ state: 'started', action: 'temperature', expected: `${ST}, 1 temperature` },
		{ state: 'started', action: 'note', expected: `${ST}, 1 note` },
		{ state: 'started', action: '+1 batch sent twice', expected: 'started 08:10, batches 09:00' },
		{ state: 'started', action: 'every record sent again', expected: ST },
		{ state: 'started', action: 'a batch timed 08:25 arriving last', expected: 'started 08:10, batches 08:25' },
		{ state: 'started', action: '"placing done" timed 08:25 arriving last', expected: ST },
		{ state: 'started', action: 'the records arriving in reverse order', expected: ST },

		{ state: 'placing', action: 'start', expected: 'started 08:10 (2 starts), batches 08:20 08:30' },
		{ state: 'placing', action: '+1 batch', expected: `${PL} 09:00` },
		{ state: 'placing', action: 'placing done', expected: `${PL}, placing done 09:00` },
		{ state: 'placing', action: 'take back the start', expected: BN }, // the batches still say the pour was placed
		{ state: 'placing', action: 'take back the last batch', expected: 'started 08:10, batches 08:20' },
		{ state: 'placing', action: 'take back "placing done"', expected: PL },
		{ state: 'placing', action: 'bags used', expected: `${PL}, 12 bags used` },
		{ state: 'placing', action: 'temperature', expected: `${PL}, 1 temperature` },
		{ state: 'placing', action: 'note', expected: `${PL}, 1 note` },
		{ state: 'placing', action: '+1 batch sent twice', expected: `${PL} 09:00` },
		{ state: 'placing', action: 'every record sent again', expected: PL },
		{ state: 'placing', action: 'a batch timed 08:25 arriving last', expected: 'started 08:10, batches 08:20 08:25 08:30' },
		{ state: 'placing', action: '"placing done" timed 08:25 arriving last', expected: PL }, // the 08:30 batch came after it
		{ state: 'placing', action: 'the records arriving in reverse order', expected: PL },

		{ state: 'placing done', action: 'start', expected: 'started 08:10 (2 starts), batches 08:20 08:30, placing done 08:40' },
		{ state: 'placing done', action: '+1 batch', expected: `${PL} 09:00` }, // placing was not done after all
		{ state: 'placing done', action: 'placing done', expected: `${PD} (2 presses)` }, // the first press stands
		{ state: 'placing done', action: 'take back the start', expected: `${BN}, placing done 08:40` },
		{ state: 'placing done', action: 'take back the last batch', expected: 'started 08:10, batches 08:20, placing done 08:40' },
		{ state: 'placing done', action: 'take back "placing done"', expected: PL },
		{ state: 'placing done', action: 'bags used', expected: `${PD}, 12 bags used` },
		{ state: 'placing done', action: 'temperature', expected: `${PD}, 1 temperature` },
		{ state: 'placing done', action: 'note', expected: `${PD}, 1 note` },
		{ state: 'placing done', action: '+1 batch sent twice', expected: `${PL} 09:00` },
		{ state: 'placing done', action: 'every record sent again', expected: PD },
		{ state: 'placing done', action: 'a batch timed 08:25 arriving last', expected: 'started 08:10, batches 08:20 08:25 08:30, placing done 08:40' },
		{ state: 'placing done', action: '"placing done" timed 08:25 arriving last', expected: PD }, // superseded by the 08:30 batch
		{ state: 'placing done', action: 'the records arriving in reverse order', expected: PD },

		{ state: 'batches, no start', action: 'start', expected: 'started 09:00, batches 08:20 08:30' }, // as pressed, on a device that had not seen the batches
		{ state: 'batches, no start', action: '+1 batch', expected: `${BN} 09:00` },
		{ state: 'batches, no start', action: 'placing done', expected: `${BN}, placing done 09:00` },
		{ state: 'batches, no start', action: 'take back the start', expected: BN },
		{ state: 'batches, no start', action: 'take back the last batch', expected: 'not started, batches 08:20' },
		{ state: 'batches, no start', action: 'take back "placing done"', expected: BN },
		{ state: 'batches, no start', action: 'bags used', expected: `${BN}, 12 bags used` },
		{ state: 'batches, no start', action: 'temperature', expected: `${BN}, 1 temperature` },
		{ state: 'batches, no start', action: 'note', expected: `${BN}, 1 note` },
		{ state: 'batches, no start', action: '+1 batch sent twice', expected: `${BN} 09:00` },
		{ state: 'batches, no start', action: 'every record sent again', expected: BN },
		{ state: 'batches, no start', action: 'a batch timed 08:25 arriving last', expected: 'not started, batches 08:20 08:25 08:30' },
		{ state: 'batches, no start', action: '"placing done" timed 08:25 arriving last', expected: BN },
		{ state: 'batches, no start', action: 'the records arriving in reverse order', expected: BN }
	];

	it('has one row for every state and action', () => {
		const pairs = TABLE.map((row) => `${row.state} × ${row.action}`);
		const all = Object.keys(STATES).flatMap((s) => Object.keys(ACTIONS).map((a) => `${s} × ${a}`));
		expect(new Set(pairs).size).toBe(pairs.length);
		expect([...pairs].sort()).toEqual([...all].sort());
	});

	it.each(TABLE)('$state, then $action', ({ state, action, expected }) => {
		const before: PourRecord[] = STATES[state];
		const added = ACTIONS[action](foldRecords(before), before);
		const sent = action === 'the records arriving in reverse order' ? [...before].reverse() : [...before, ...added];
		expect(reading(foldRecords(sent))).toBe(expected);
		// The same records in any order of arrival give the same reading.
		expect(reading(foldRecords([...sent].reverse()))).toBe(expected);
	});

	it('reads each state as its name says', () => {
		expect(Object.values(STATES).map((s) => reading(foldRecords(s)))).toEqual([NS, ST, PL, PD, BN]);
	});

	it('ignores an undo that names another pour’s record, a note, or another undo', () => {
		const other = r('batch-p1-0850', '08:50', { kind: 'batch', pour: 1 });
		const note = r('note-0850', '08:50', { kind: 'note', text: 'Forms checked.' });
		const undoBatch = r('undo-0900', '09:00', { kind: 'undo', pour: 0, of: batch2.key });
		const log = foldRecords([
			...STATES.placing,
			other,
			note,
			undoBatch,
			r('undo-0901', '09:01', { kind: 'undo', pour: 0, of: other.key }),
			r('undo-0902', '09:02', { kind: 'undo', pour: 0, of: note.key }),
			// An undo of the undo does not bring the batch back: the page never sends one, and a redo is a new batch.
			r('undo-0903', '09:03', { kind: 'undo', pour: 0, of: undoBatch.key })
		]);
		expect(reading(log)).toBe('started 08:10, batches 08:20, 1 note');
		expect(log.pours.get(1)!.batches).toEqual([other.at]);
	});
});
