import { describe, expect, it } from 'vitest';
import { CURING, FIRST_POUR_DAY, addDays, ageSeries, buildSchedule, milestones, pourOffsets } from './schedule';
import { modelOf, rect } from './test-plans';
import type { PlanInput } from './schema';

const twoHalves = (airTemp: number): PlanInput => ({
	units: 'metric',
	sections: [{ outline: rect(0, 0, 2, 2) }, { outline: rect(2, 0, 2, 2) }],
	houseEdge: null,
	conditions: { airTemp }
});

describe('pour days', () => {
	it('pours the next section a day later at 20 °C', () => {
		const { m, layout } = modelOf(twoHalves(20));
		expect(pourOffsets(m, layout.coldJoints, () => 20)).toEqual([0, 1]); // 1 day equivalent age, common practice ~24 h
	});

	it('waits longer in the cold before pulling the bulkhead', () => {
		const { m, layout } = modelOf(twoHalves(5));
		// At 5 °C a day counts exp[−5000 (1/278.15 − 1/293.15)] = 0.3986 (ASTM C1074): 3 days to reach 1.
		expect(pourOffsets(m, layout.coldJoints, () => 5)).toEqual([0, 3]);
	});
});

describe('milestones', () => {
	it('follows the equivalent age at 20 °C for Type I', () => {
		const { m } = modelOf(twoHalves(20));
		const ms = milestones(m, ageSeries(0, () => 20), 0);
		const day = (id: string) => ms.find((x) => x.id === id)!.day;
		expect(day('forms-off')).toBe(1); // common practice, ~24 h
		expect(day('walk')).toBe(2); // common practice, 24–48 h
		expect(day('vehicles')).toBe(7); // 70 % at 7 days: 7 / 9.95 = 70.4 % vs 6 / 9.1 = 65.9 % (ACI 209R-92)
		expect(day('curing-done')).toBe(7); // ACI 308R / ACI 318 §26.5.3, ≥ 7 days
		expect(CURING.typeI).toBe(7); // ACI 318 §26.5.3
	});

	it('keeps curing past 3 days for Type III until 70 %', () => {
		const { m } = modelOf({ ...twoHalves(20), mix: { cement: 'typeIII' } });
		const ms = milestones(m, ageSeries(0, () => 20), 0);
		// t / (2.3 + 0.92 t) ≥ 0.7 → t ≥ 1.61 / 0.356 = 4.52 → day 5 (ACI 209R-92; ACI 308R)
		expect(ms.find((x) => x.id === 'curing-done')!.day).toBe(5);
		expect(CURING.typeIII).toBe(3); // ACI 318 §26.5.3, high early
	});
});

describe('the day plan', () => {
	it('dates the days from the first pour', () => {
		expect(addDays('2027-02-27', 2)).toBe('2027-03-01'); // Gregorian calendar
		expect(addDays('2028-02-28', 1)).toBe('2028-02-29'); // 2028 is a leap year
		expect(addDays('2027-01-01', -1)).toBe('2026-12-31');
		const { m } = modelOf({ ...twoHalves(20), conditions: { airTemp: 20, pourDate: '2027-06-01' } });
		const s = buildSchedule(m, [0, 1], [30, 30], milestones(m, ageSeries(1, () => 20), 1));
		expect(s.pourDays).toEqual([
			{ section: 0, day: FIRST_POUR_DAY, date: '2027-06-01' },
			{ section: 1, day: FIRST_POUR_DAY + 1, date: '2027-06-02' }
		]);
		expect(s.days[0].tasks[0].id).toBe('locate'); // FCC 05-59: call 811 before digging
		expect(s.days.find((d) => d.day === 4)!.tasks.map((t) => t.id)).toContain('bulkhead-1');
	});
});
