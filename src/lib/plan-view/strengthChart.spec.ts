import { describe, expect, it } from 'vitest';
import type { MilestoneRow } from './rows';
import { labelRows, strengthChartGeometry } from './strengthChart';

// A made-up series: day d at 3.5·d percent, so day 30 reaches 105 %.
const days = (n: number, perDay = 3.5) => Array.from({ length: n }, (_, i) => ({ day: i + 1, percent: (i + 1) * perDay }));
const stone = (id: string, day: number | null, percent?: number): MilestoneRow => ({ id, title: id, day, when: '', percent, rule: '', source: '' });

describe('the strength chart geometry both the page and the PDF draw', () => {
	it('runs the day axis to the charted days in weeks', () => {
		const c = strengthChartGeometry(days(20, 2), []);
		expect(c.x.max).toBe(20);
		expect(c.x.ticks).toEqual([0, 7, 14]);
		expect(c.points.at(-1)).toEqual({ day: 20, percent: 40 });
	});

	it('keeps the percent axis at 100 until the line passes it, then grows it in 25 % steps', () => {
		expect(strengthChartGeometry(days(28, 2), []).y).toMatchObject({ max: 100, ticks: [0, 25, 50, 75, 100] });
		const warm = strengthChartGeometry(days(30), []); // 105 % on day 30
		expect(warm.y.max).toBe(125);
		expect(warm.y.ticks).toEqual([0, 25, 50, 75, 100, 125]);
	});

	it('pins each charted milestone by its number in the list, and shares a line between milestones on one day', () => {
		const c = strengthChartGeometry(days(14), [stone('forms', 1, 3.5), stone('walk', 2, 7), stone('furniture', 2, 7), stone('drive', null), stone('late', 40)]);
		expect(c.pins).toEqual([
			{ day: 1, percent: 3.5, n: 1 },
			{ day: 2, percent: 7, n: 2 },
			{ day: 2, percent: 7, n: 3 }
		]);
		expect(c.lines).toEqual([
			{ day: 1, label: '1' },
			{ day: 2, label: '2·3' }
		]);
	});
});

describe('labelRows', () => {
	const lines = (...days: number[]) => days.map((day, i) => ({ day, label: String(i + 1) }));
	// A 28-day chart: a day is about 11 px of a 300 px phone plot, 36 px of a 1,000 px one.
	it('lifts a label that would touch the one before it, on a phone', () => {
		// Milestones on days 1, 2 and 3: each next one a row up, then back down once there is room.
		expect(labelRows(lines(1, 2, 3, 7, 14), 28, 300)).toEqual([0, 1, 0, 0, 0]);
	});
	it('keeps every label in the first row when the plot is wide', () => {
		expect(labelRows(lines(1, 2, 3, 7, 14), 28, 1000)).toEqual([0, 0, 0, 0, 0]);
	});
	it('gives a wider label ("1·2") more room', () => {
		const wide = [
			{ day: 1, label: '1·2' },
			{ day: 2, label: '3' }
		];
		expect(labelRows(wide, 28, 300)).toEqual([0, 1]);
		expect(labelRows(wide, 28, 600)).toEqual([0, 0]);
	});
	it('uses a third row when two lifted labels would touch too', () => {
		expect(labelRows(lines(1, 1.5, 2), 28, 300)).toEqual([0, 1, 2]);
	});
});
