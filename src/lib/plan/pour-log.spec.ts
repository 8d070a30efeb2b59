import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import { dailyMeans, foldRecords, loggedForecast, pourRecordSchema, pourRecordsBody, type PourRecord } from './pour-log';
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
	const log = foldRecords([rec({ kind: 'start', pour: 0 }, 0), rec({ kind: 'batch', pour: 0 }, 1), ...coldWeek.map((t, i) => rec(t, 10 + i))]);
	const f = loggedForecast(m, log, 0)!;

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
		expect(loggedForecast(m, taken, 0)).toBeNull();
		// Started again later: that start counts.
		const again = rec({ kind: 'start', pour: 0 }, 3);
		expect(foldRecords([start, rec({ kind: 'undo', pour: 0, of: start.key }, 2), again]).pours.get(0)).toMatchObject({
			startedAt: again.at,
			startKeys: [again.key]
		});
		const batch = rec({ kind: 'batch', pour: 0 }, 4);
		const end = rec({ kind: 'end', pour: 0 }, 5);
		expect(foldRecords([again, batch, end]).pours.get(0)).toMatchObject({ endedAt: end.at, endKey: end.key });
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
