import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import { curingReminders, curingRemindersFor, MAX_MOIST_DAYS, plannedCuringReminders } from './reminders';
import type { PourRecord } from './pour-log';
import { strengthRatio } from './strength';
import { addDays } from './schedule';
import { cornerEll } from './test-plans';
import type { PlanInput } from './schema';

/** The corner slab at a constant temperature (°F), with a curing method and loads. */
const at = (airTemp: number, more: Partial<PlanInput> = {}): PlanInput => ({ ...cornerEll, conditions: { airTemp }, ...more });
const ids = (days: ReturnType<typeof curingReminders>, id: string) => days.filter((d) => d.items.some((i) => i.id === id)).map((d) => d.day);

describe('curing reminders', () => {
	it('at 68 °F (20 °C) follow calendar age: moist days until 70 % of strength, then the milestones on their days', () => {
		const days = curingReminders(at(68), '2027-06-01');
		// At the reference temperature equivalent age is calendar age (ASTM C1074). ACI 209R-92 Eq. 2-1,
		// type I: t / (4 + 0.85 t) ≥ 0.70 first on day 7 (6.9 days), before ACI 318's 7 days.
		const seventy = [...Array(30).keys()].find((t) => strengthRatio(t, 'typeI') >= 0.7);
		expect(seventy).toBe(7);
		expect(ids(days, 'curing-done')).toEqual([seventy]);
		expect(ids(days, 'moist')).toEqual([1, 2, 3, 4, 5, 6]);
		// Default milestones: forms off at 1 day, walk at 2, furniture at 3 days of equivalent age.
		expect(ids(days, 'forms-off')).toEqual([1]);
		expect(ids(days, 'walk')).toEqual([2]);
		expect(ids(days, 'furniture')).toEqual([3]);
		expect(ids(days, 'vehicles')).toEqual([]);
		expect(days.map((d) => d.date)).toEqual(days.map((d) => addDays('2027-06-01', d.day)));
	});

	it('put each milestone on the date the plan shows for it', () => {
		const input = at(55, { loads: { vehicles: true } } as Partial<PlanInput>);
		const days = curingReminders(input, '2027-04-10');
		const plan = computePlan({ ...input, conditions: { ...input.conditions, pourDate: '2027-04-10' } });
		for (const m of plan.milestones) {
			expect(m.date).toBeTruthy();
			expect(days.find((d) => d.date === m.date)?.items.map((i) => i.id)).toContain(m.id);
		}
		expect(ids(days, 'vehicles')).toHaveLength(1);
	});

	it('move with the pour date, day for day', () => {
		const a = curingReminders(at(60), '2027-05-03');
		const b = curingReminders(at(60), '2027-05-10');
		expect(b.map((d) => d.date)).toEqual(a.map((d) => addDays(d.date, 7)));
		expect(b.map((d) => d.items.map((i) => i.id))).toEqual(a.map((d) => d.items.map((i) => i.id)));
	});

	it('take longer in the cold, with at most MAX_MOIST_DAYS moist reminders and a freeze-safe day', () => {
		const warm = curingReminders(at(68), '2027-11-01');
		const cold = curingReminders(at(41, { conditions: { airTemp: 41, airLow: 30 } } as Partial<PlanInput>), '2027-11-01');
		expect(ids(cold, 'walk')[0]).toBeGreaterThan(ids(warm, 'walk')[0]);
		expect(ids(cold, 'moist').length).toBeLessThanOrEqual(MAX_MOIST_DAYS);
		expect(ids(cold, 'moist').length).toBeGreaterThan(ids(warm, 'moist').length);
		const plan = computePlan({ ...cornerEll, conditions: { airTemp: 41, airLow: 30, pourDate: '2027-11-01' } });
		expect(plan.weather.cold).toBe(true);
		const p = plan.weather.pours[0];
		expect(cold.find((d) => d.items.some((i) => i.id === 'freeze-safe'))?.date).toBe(addDays(p.date!, p.freezeSafeDay!));
		expect(ids(warm, 'freeze-safe')).toEqual([]);
	});

	it('ask for no daily wetting under a curing compound', () => {
		const days = curingReminders(at(68, { curing: { method: 'compound' } } as Partial<PlanInput>), '2027-06-01');
		expect(ids(days, 'moist')).toEqual([]);
		expect(ids(days, 'curing-done')).toHaveLength(1);
	});

	it('need a pour date: a plan without one has none planned', () => {
		expect(plannedCuringReminders(at(68))).toEqual({ pourDate: null, days: [] });
		const dated = plannedCuringReminders({ ...cornerEll, conditions: { airTemp: 68, pourDate: '2027-06-01' } });
		expect(dated.pourDate).toBe('2027-06-01');
		expect(dated.days).toEqual(curingReminders(at(68), '2027-06-01'));
	});

	it('never show a user "from memory"', () => {
		const text = JSON.stringify(curingReminders(at(41, { loads: { vehicles: true } } as Partial<PlanInput>), '2027-11-01'));
		expect(text).not.toMatch(/from memory/i);
	});
});

describe('curing reminders from the pour log', () => {
	// Two halves poured a day apart (the day plan's spacing), planned for 2027-10-09.
	const twoPours: PlanInput = {
		units: 'metric',
		sections: [
			{
				name: 'West half',
				outline: [
					[0, 0],
					[1.8, 0],
					[1.8, 2.4],
					[0, 2.4]
				]
			},
			{
				name: 'East half',
				outline: [
					[1.8, 0],
					[3.6, 0],
					[3.6, 2.4],
					[1.8, 2.4]
				]
			}
		],
		houseEdge: null,
		conditions: { airTemp: 20, pourDate: '2027-10-09' }
	} as PlanInput;
	const planned = computePlan(twoPours);
	const offset = planned.schedule.pourDays[1].day - planned.schedule.pourDays[0].day;
	// Records as the pour page makes them: the device's local date of 08:00 UTC with offset 0.
	const rec = (r: Record<string, unknown>, date: string, i: number) =>
		({ key: `key-${String(i).padStart(4, '0')}`, at: Date.parse(`${date}T08:00:00Z`) + i * 60_000, tz: 0, ...r }) as PourRecord;

	it('count from the planned date while nothing is started, and not from notes or temperatures', () => {
		const r = curingRemindersFor(twoPours, [
			rec({ kind: 'note', text: 'rain' }, '2027-10-12', 0),
			rec({ kind: 'temp', date: '2027-10-12', unit: 'C', low: 2, high: 9 }, '2027-10-12', 1)
		]);
		expect(r).toEqual({ ...plannedCuringReminders(twoPours), logged: false, loggedLast: null });
		expect(r.pourDate).toBe('2027-10-09');
	});

	it('move to the day the first pour was logged as started', () => {
		const r = curingRemindersFor(twoPours, [rec({ kind: 'start', pour: 0 }, '2027-10-12', 0), rec({ kind: 'batch', pour: 0 }, '2027-10-12', 1)]);
		expect(r.logged).toBe(true);
		expect(r.pourDate).toBe('2027-10-12');
		// Three days later than planned, day for day.
		expect(r.days.map((d) => d.date)).toEqual(plannedCuringReminders(twoPours).days.map((d) => addDays(d.date, 3)));
		expect(r.days).toEqual(curingReminders(twoPours, '2027-10-12'));
	});

	it('take a later pour logged alone back by its planned offset from the first', () => {
		expect(offset).toBeGreaterThan(0);
		const r = curingRemindersFor(twoPours, [rec({ kind: 'start', pour: 1 }, '2027-10-20', 0)]);
		expect(r.pourDate).toBe(addDays('2027-10-20', -offset));
		expect(r.loggedLast).toBeNull(); // pour 1 is not the last of the day plan's pours
	});

	it('count from the last pour once it is logged, even when it went in later than the plan spaced it', () => {
		// The slab's milestones run from its youngest part: the last of the day plan's pours.
		const last = planned.schedule.pourDays.length - 1;
		const lastOffset = planned.schedule.pourDays[last].day - planned.schedule.pourDays[0].day;
		expect(last).toBeGreaterThan(0);
		const first = [rec({ kind: 'start', pour: 0 }, '2027-10-12', 0), rec({ kind: 'batch', pour: 0 }, '2027-10-12', 1)];
		expect(curingRemindersFor(twoPours, first)).toMatchObject({ pourDate: '2027-10-12', loggedLast: null });
		// The last pour goes in on 24 October, later than the plan's spacing from the 12th would put it.
		expect(addDays('2027-10-12', lastOffset) < '2027-10-24').toBe(true);
		const both = [...first, rec({ kind: 'start', pour: last }, '2027-10-24', 2), rec({ kind: 'batch', pour: last }, '2027-10-24', 3)];
		const r = curingRemindersFor(twoPours, both);
		expect(r).toMatchObject({ logged: true, loggedLast: '2027-10-24', pourDate: addDays('2027-10-24', -lastOffset) });
		expect(r.days).toEqual(curingReminders(twoPours, addDays('2027-10-24', -lastOffset)));
	});

	it('follow the first batch over the start tap, and go back to the plan when the only batch is taken back and nothing was started', () => {
		const started = curingRemindersFor(twoPours, [rec({ kind: 'start', pour: 0 }, '2027-10-11', 0), rec({ kind: 'batch', pour: 0 }, '2027-10-12', 1)]);
		expect(started.pourDate).toBe('2027-10-12');
		const undone = curingRemindersFor(twoPours, [
			rec({ kind: 'batch', pour: 0 }, '2027-10-12', 0),
			rec({ kind: 'undo', pour: 0, of: 'key-0000' }, '2027-10-12', 1)
		]);
		expect(undone).toEqual({ ...plannedCuringReminders(twoPours), logged: false, loggedLast: null });
	});

	it("come out the same from the plan's stored result as from computing it again (the plan page passes the stored one)", () => {
		const records = [rec({ kind: 'start', pour: 0 }, '2027-10-12', 0)];
		expect(curingRemindersFor(twoPours, [], planned)).toEqual(curingRemindersFor(twoPours, []));
		expect(curingRemindersFor(twoPours, records, planned)).toEqual(curingRemindersFor(twoPours, records));
		// The stored result is what is read: a plan with its pour days taken away has no reminder days.
		const noDays = { ...planned, schedule: { ...planned.schedule, pourDays: [] } };
		expect(curingRemindersFor(twoPours, [], noDays).days).toEqual([]);
	});

	it('work for a plan with no planned pour date once a pour is logged', () => {
		const undated = { ...twoPours, conditions: { airTemp: 20 } } as PlanInput;
		expect(curingRemindersFor(undated, []).pourDate).toBeNull();
		const r = curingRemindersFor(undated, [rec({ kind: 'start', pour: 0 }, '2027-10-12', 0)]);
		expect(r.pourDate).toBe('2027-10-12');
		expect(r.days.length).toBeGreaterThan(0);
	});
});
