import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import { curingReminders, MAX_MOIST_DAYS, plannedCuringReminders } from './reminders';
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
