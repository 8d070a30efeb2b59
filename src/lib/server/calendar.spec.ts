import ical from 'node-ical';
import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { cornerEll } from '$lib/plan/test-plans';
import type { PlanInput } from '$lib/plan';
import { planCalendar } from './calendar';

const split: PlanInput = {
	...cornerEll,
	sections: [
		{
			name: 'Front pad',
			outline: [
				[0, 0],
				[12, 0],
				[12, 10],
				[0, 10]
			]
		},
		{
			name: 'Back pad',
			outline: [
				[12, 0],
				[24, 0],
				[24, 10],
				[12, 10]
			]
		}
	],
	houseEdge: { section: 0, edge: 0 },
	otherHouseEdges: [],
	conditions: { airTemp: 60, pourDate: '2027-05-14' }
} as PlanInput;

// node-ical reads a DATE value as local midnight.
const ymd = (d: Date) => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;

describe('plan.ics', () => {
	const result = computePlan(split);
	const text = planCalendar({ id: '6b0f1c1e-8d4a-4a4e-9f57-2d6a3c1b7e01', name: 'Shed pads', result, url: 'http://stakeline.test/plans/x' })!;
	const events = Object.values(ical.sync.parseICS(text)).filter((c): c is ical.VEvent => c.type === 'VEVENT');

	it('parses, with a pour event on each pour day of the plan', () => {
		expect(result.schedule.pourDays.length).toBe(2);
		const pours = events.filter((e) => /: pour /.test(e.summary));
		expect(pours.map((e) => ymd(e.start))).toEqual(result.schedule.pourDays.map((p) => p.date));
		expect(pours.map((e) => e.summary)).toEqual(result.schedule.pourDays.map((p) => expect.stringContaining(`(${p.bags} bags)`)));
		expect(pours[0].summary).toContain('Front pad');
		expect(pours[1].summary).toContain('Back pad');
	});

	it('holds every milestone on its date, with its rule and source', () => {
		for (const m of result.milestones) {
			const e = events.find((x) => x.summary === `Shed pads: ${m.title}`);
			expect(e, m.id).toBeTruthy();
			expect(ymd(e!.start)).toBe(m.date);
			expect(e!.description).toContain(m.source);
		}
	});

	it('has the day plan before the pour: the locate call and the digging', () => {
		const locate = events.find((e) => e.summary.includes('utility locate'))!;
		const day1 = result.schedule.days.find((d) => d.day === 1)!;
		expect(ymd(locate.start)).toBe(day1.date);
		expect(events.some((e) => e.summary.includes('Lay out and dig'))).toBe(true);
	});

	it('makes each entry an all-day event of one day, with a stable id', () => {
		expect(text).toMatch(/DTSTART;VALUE=DATE:\d{8}/);
		expect(text).not.toMatch(/DTSTART:\d{8}T/);
		for (const e of events) {
			expect(e.datetype).toBe('date');
			expect(Math.round((e.end!.getTime() - e.start.getTime()) / 86_400_000)).toBe(1);
			expect(e.uid).toMatch(/^6b0f1c1e-8d4a-4a4e-9f57-2d6a3c1b7e01-[\w-]+@stakeline$/);
		}
		expect(new Set(events.map((e) => e.uid)).size).toBe(events.length);
	});

	it('is not written for a plan without a pour date', () => {
		expect(planCalendar({ id: 'x', name: 'Undated', result: computePlan(cornerEll), url: 'http://x' })).toBeNull();
	});
});
