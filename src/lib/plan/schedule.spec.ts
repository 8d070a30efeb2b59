import { describe, expect, it } from 'vitest';
import { FIRST_POUR_DAY, addDays, ageSeries, buildSchedule, firstPourDay, locateLead, milestones, pourOffsets, weekday } from './schedule';
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

	it('gives each part of a split section its own day behind its bulkhead', () => {
		const { m, layout } = modelOf({ ...twoHalves(5), sections: [{ outline: rect(0, 0, 4, 2) }] });
		// Three parts of one section at 5 °C: each waits 3 days for the part before (0.3986 a day, ASTM C1074).
		const pours = [0, 1, 2].map((part) => ({ section: 0, part }));
		expect(pourOffsets(m, layout.coldJoints, () => 5, pours)).toEqual([0, 3, 6]);
	});
});

describe('the utility locate', () => {
	it('calls at least 3 working days before digging', () => {
		// 1970-01-01 was a Thursday; 2027-06-01 is a Tuesday (Gregorian calendar).
		expect(weekday(0)).toBe(4);
		// Digging Sunday 30 May 2027: Fri 28, Thu 27, Wed 26 are the three working days → call Wed 26, 4 days ahead
		// (2–3 working days in most state one-call laws; 3 kept, common practice).
		expect(locateLead('2027-05-30')).toBe(4);
		// Digging Thursday 3 June: Wed, Tue, Mon → call Monday 31 May, 3 days ahead.
		expect(locateLead('2027-06-03')).toBe(3);
		// Digging Monday 7 June: Fri, Thu, Wed → call Wednesday 2 June, 5 days ahead over the weekend.
		expect(locateLead('2027-06-07')).toBe(5);
	});

	it('puts the call on day 1 and the first pour after digging and forms', () => {
		const { m } = modelOf({ ...twoHalves(20), conditions: { airTemp: 20, pourDate: '2027-06-01' } });
		// Pour Tue 1 June, forms Mon 31 May, dig Sun 30 May, call Wed 26 May: day 1 + 4 + 2 = day 7.
		expect(firstPourDay(m)).toBe(7);
		const s = buildSchedule(
			m,
			[
				{ section: 0, part: 0, bags: 30 },
				{ section: 1, part: 0, bags: 30 }
			],
			[0, 1],
			[]
		);
		expect(s.days[0]).toMatchObject({ day: 1, date: '2027-05-26' });
		expect(s.days[0].tasks[0].id).toBe('locate'); // FCC 05-59: call 811 before digging
		expect(s.digDay).toBe(5);
		expect(s.days.find((d) => d.day === 5)!.date).toBe('2027-05-30');
		const undated = modelOf(twoHalves(20)).m;
		expect(firstPourDay(undated)).toBe(FIRST_POUR_DAY); // no date: 3 days' notice, dig day 4, pour day 6
		expect(FIRST_POUR_DAY).toBe(6);
	});
});

describe('milestones', () => {
	it('follows the equivalent age at 20 °C for Type I', () => {
		const { m } = modelOf({ ...twoHalves(20), loads: { vehicles: true } });
		const ms = milestones(
			m,
			ageSeries(0, () => 20),
			0
		);
		const day = (id: string) => ms.find((x) => x.id === id)!.day;
		expect(day('forms-off')).toBe(1); // common practice, ~24 h
		expect(day('walk')).toBe(2); // common practice, 24–48 h
		expect(day('vehicles')).toBe(7); // 70 % at 7 days: 7 / 9.95 = 70.4 % vs 6 / 9.1 = 65.9 % (ACI 209R-92)
		expect(day('curing-done')).toBe(7); // ACI 318-19 §26.5.3.1, 7 days
	});

	it('dates driving on it only where the plan allows vehicles', () => {
		const { m } = modelOf(twoHalves(20));
		expect(
			milestones(
				m,
				ageSeries(0, () => 20),
				0
			).map((x) => x.id)
		).not.toContain('vehicles');
	});

	it('ends curing at 3 days for Type III, before it reaches 70 %', () => {
		const { m } = modelOf({ ...twoHalves(20), mix: { cement: 'typeIII' } });
		const ms = milestones(
			m,
			ageSeries(0, () => 20),
			0
		);
		// ACI 318-19 §26.5.3.1: 3 days for high-early; 70 % needs t / (2.3 + 0.92 t) ≥ 0.7 → t ≥ 4.52 (ACI 209R-92):
		// whichever comes first → day 3.
		expect(ms.find((x) => x.id === 'curing-done')!.day).toBe(3);
	});

	it('stretches the 7 days in cool weather', () => {
		const { m } = modelOf(twoHalves(10));
		// At 10 °C a day counts 0.547512 (ASTM C1074): 7 / 0.547512 = 12.8 → day 13; 70 % also needs 7 equivalent days.
		expect(
			milestones(
				m,
				ageSeries(0, () => 10),
				0
			).find((x) => x.id === 'curing-done')!.day
		).toBe(13);
	});
});

describe('the day plan', () => {
	it('dates the days from the first pour', () => {
		expect(addDays('2027-02-27', 2)).toBe('2027-03-01'); // Gregorian calendar
		expect(addDays('2028-02-28', 1)).toBe('2028-02-29'); // 2028 is a leap year
		expect(addDays('2027-01-01', -1)).toBe('2026-12-31');
		const { m } = modelOf({ ...twoHalves(20), conditions: { airTemp: 20, pourDate: '2027-06-01' } });
		const s = buildSchedule(
			m,
			[
				{ section: 0, part: 0, bags: 30 },
				{ section: 1, part: 0, bags: 30 }
			],
			[0, 1],
			milestones(
				m,
				ageSeries(1, () => 20),
				1
			)
		);
		expect(s.pourDays).toEqual([
			{ section: 0, part: 0, bags: 30, day: 7, date: '2027-06-01' },
			{ section: 1, part: 0, bags: 30, day: 8, date: '2027-06-02' }
		]);
		expect(s.days.find((d) => d.day === 8)!.tasks.map((t) => t.id)).toContain('bulkhead-1');
	});

	it('lists finishing and jointing with their windows, and the chosen curing', () => {
		const { m } = modelOf({ ...twoHalves(20), joints: { method: 'saw' }, curing: { method: 'compound' } });
		const s = buildSchedule(m, [{ section: 0, part: 0, bags: 10 }], [0], [], '1 in');
		const pour = s.days.find((d) => d.day === FIRST_POUR_DAY)!.tasks;
		expect(pour.map((t) => t.id.replace(/-\d+$/, ''))).toEqual(['pour', 'screed', 'bleed', 'edge', 'saw-window', 'broom', 'cure']);
		expect(pour.find((t) => t.id === 'saw-window-0')!.text).toMatch(/4–12 h/); // ACI 302.1R-15 as ACI states it
		expect(pour.find((t) => t.id === 'cure-0')!.text).toMatch(/ASTM C309/);
	});
});
