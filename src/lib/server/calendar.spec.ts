import ical from 'node-ical';
import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { cornerEll } from '$lib/plan/test-plans';
import type { PlanInput } from '$lib/plan';
import type { PourRecord } from '$lib/plan/pour-log';
import { planAsLogged } from '$lib/plan/reminders';
import { addDays } from '$lib/plan/schedule';
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

const parse = (text: string) => Object.values(ical.sync.parseICS(text)).filter((c): c is ical.VEvent => c.type === 'VEVENT');
const calendar = (input: PlanInput, records: PourRecord[] = []) =>
	planCalendar({ id: '6b0f1c1e-8d4a-4a4e-9f57-2d6a3c1b7e01', name: 'Shed pads', dated: planAsLogged(input, records)!, url: 'http://stakeline.test/plans/x' });

describe('plan.ics', () => {
	const result = computePlan(split);
	const text = calendar(split)!;
	const events = parse(text);

	it('parses, with a pour event on each pour day of the plan', () => {
		expect(result.schedule.pourDays.length).toBe(2);
		const pours = events.filter((e) => /: Pour /.test(e.summary));
		expect(pours.map((e) => ymd(e.start))).toEqual(result.schedule.pourDays.map((p) => p.date));
		expect(pours.map((e) => e.summary)).toEqual(result.schedule.pourDays.map((p) => expect.stringContaining(`(${p.bags} bags)`)));
		expect(pours[0].summary).toBe(`Shed pads: Pour Front pad (${result.schedule.pourDays[0].bags} bags)`);
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

	it('says in each entry that its dates count from the planned first pour', () => {
		for (const e of events) expect(e.description).toContain('Dates counted from the planned first pour, Fri, May 14, 2027.');
	});

	it('is not written for a plan without a pour date', () => {
		expect(calendar(cornerEll)).toBeNull();
	});
});

describe('plan.ics after a pour is logged', () => {
	// Records as the pour page makes them: the device's local date of 08:00 UTC with offset 0.
	const rec = (r: Record<string, unknown>, date: string, i: number) =>
		({ key: `key-${String(i).padStart(4, '0')}`, at: Date.parse(`${date}T08:00:00Z`) + i * 60_000, tz: 0, ...r }) as PourRecord;
	const planned = parse(calendar(split)!);
	// The crew started the front pad three days late (planned 2027-05-14).
	const late = [rec({ kind: 'start', pour: 0 }, '2027-05-17', 0), rec({ kind: 'batch', pour: 0 }, '2027-05-17', 1)];
	const text = calendar(split, late)!;
	const events = parse(text);
	const start = (es: ical.VEvent[], uid: string) => ymd(es.find((e) => e.uid === uid)!.start);

	it('moves the pours and milestones to the logged first-pour day, as the curing reminders do', () => {
		const pourUid = '6b0f1c1e-8d4a-4a4e-9f57-2d6a3c1b7e01-pour-0@stakeline';
		expect(start(planned, pourUid)).toBe('2027-05-14');
		expect(start(events, pourUid)).toBe('2027-05-17');
		// The same pour and milestone entries (same ids, so a calendar updates them), each three days
		// later; the work before the pour is counted back from the logged day again.
		const after = (es: ical.VEvent[]) => es.filter((e) => /-(pour|milestone)-/.test(e.uid));
		expect(after(events).map((e) => e.uid)).toEqual(after(planned).map((e) => e.uid));
		for (const e of after(planned)) expect(start(events, e.uid), e.uid).toBe(addDays(ymd(e.start), 3));
		for (const e of events.filter((x) => x.uid.includes('-day-'))) expect(ymd(e.start) < '2027-05-17', e.uid).toBe(true);
		// The reminders count from the same day, and each milestone entry falls on a reminder day.
		const reminders = planAsLogged(split, late)!;
		expect(reminders.pourDate).toBe('2027-05-17');
		for (const m of reminders.result.milestones) expect(start(events, `6b0f1c1e-8d4a-4a4e-9f57-2d6a3c1b7e01-milestone-${m.id}@stakeline`)).toBe(m.date);
	});

	it('says the dates count from the logged day, and what was planned', () => {
		for (const e of events)
			expect(e.description).toContain('Dates counted from the first pour as logged on the pour page, Mon, May 17, 2027 (planned for Fri, May 14, 2027).');
	});

	it('is written for a plan without a planned date once a pour is logged, and says so', () => {
		const undated = { ...split, conditions: { airTemp: 60 } } as PlanInput;
		expect(calendar(undated)).toBeNull();
		const logged = parse(calendar(undated, late)!);
		expect(ymd(logged.find((e) => e.summary.includes(': Pour '))!.start)).toBe('2027-05-17');
		expect(logged[0].description).toContain('Mon, May 17, 2027 (the plan had no date)');
	});

	it('ignores notes and temperatures: only a started pour moves the dates', () => {
		const notes = [
			rec({ kind: 'note', text: 'rain' }, '2027-05-17', 0),
			rec({ kind: 'temp', date: '2027-05-17', unit: 'F', low: 40, high: 55 }, '2027-05-17', 1)
		];
		expect(parse(calendar(split, notes)!).map((e) => [e.uid, ymd(e.start)])).toEqual(planned.map((e) => [e.uid, ymd(e.start)]));
	});
});
