import { beforeAll, describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { convertPlan, convertPreset, switchUnits } from './convert';
import { detectPreset } from './presets';
import { completeInput, starterInput } from './draft.svelte';
import { lShape } from './shapes';
import { loadEngine } from './engine.svelte';

// The wizard loads the engine after its first paint; these specs use it loaded.
beforeAll(() => loadEngine());

describe('unit switch', () => {
	it('keeps the same physical slab: area and volume agree within rounding', () => {
		const imperial = { ...starterInput('imperial'), sections: [{ outline: lShape(16, 12, 6, 5) }] };
		const metric = convertPlan(imperial, 'metric');
		expect(metric.units).toBe('metric');
		expect(metric.thickness).toBe(102); // 4 in × 25.4 mm/in = 101.6 → 102 mm (NIST SP 811 App. B, exact inch)
		expect(metric.sections[0].outline[1]).toEqual([4.877, 0]); // 16 ft × 0.3048 m/ft = 4.8768 m (exact foot, 1959 agreement), to the mm
		const a = computePlan(imperial);
		const b = computePlan(metric);
		expect(b.area.squareFeet).toBeCloseTo(a.area.squareFeet, 0); // 162 ft² (16×12 − 6×5)
		expect(b.volume.slab.cubicFeet / a.volume.slab.cubicFeet).toBeCloseTo(1, 2);
	});

	it('round-trips back to imperial', () => {
		const back = convertPlan(convertPlan(starterInput('imperial'), 'metric'), 'imperial');
		expect(back.sections[0].outline[2]).toEqual([12, 10]);
		expect(back.thickness).toBeCloseTo(4, 1);
		expect(back.conditions.airTemp).toBeCloseTo(70, 0); // 70 °F → 21.1 °C → 70 °F
	});

	it('keeps a day without its own low empty', () => {
		const days = { ...starterInput('imperial'), conditions: { ...starterInput().conditions, airTemp: [50, 68], airLow: [null, 50] } };
		expect(convertPlan(days, 'metric').conditions.airLow).toEqual([null, 10]); // (50 − 32) × 5/9 = 10 °C
	});
});

/** Every number in a plan, with its path. */
function numbers(v: unknown, path = '', out: [string, number][] = []): [string, number][] {
	if (typeof v === 'number') out.push([path, v]);
	else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) numbers(x, path ? `${path}.${k}` : k, out);
	return out;
}
const decimals = (v: number) => (String(v).split('.')[1] ?? '').length;

describe('converted values read like typed ones', () => {
	it('metric lengths to the millimetre, imperial ones to the sixteenth of an inch, never float noise', () => {
		const typed = { ...starterInput('imperial'), sections: [{ outline: lShape(16, 10, 6, 4.5) }] };
		typed.forms.stakeSpacing = 3.5;
		const metric = convertPlan(typed, 'metric');
		for (const o of metric.sections[0].outline) for (const v of o) expect(decimals(v)).toBeLessThanOrEqual(3); // metres to the mm
		expect(metric.forms.stakeSpacing).toBe(1.067); // 3.5 ft × 0.3048 = 1.0668 m
		expect(metric.thickness).toBe(102); // whole mm
		// The shape fields read off the converted outline: 16 ft → 4.877 m, 10 ft → 3.048 m, 6 ft → 1.829 m, 4.5 ft → 1.372 m.
		expect(detectPreset(metric)).toMatchObject({ shape: 'l', length: 4.877, width: 3.048, notchLength: 1.829, notchWidth: 1.372 });
		for (const [path, v] of numbers(detectPreset(metric))) expect(decimals(v), path).toBeLessThanOrEqual(3);
		const back = convertPlan(metric, 'imperial');
		// Without the switch's memory too, values typed to the 1/16 in come back exactly (½ mm < 1/32 in).
		expect(back.sections).toEqual(typed.sections);
		expect(back.forms.stakeSpacing).toBe(3.5);
		expect(back.thickness).toBe(4);
		expect(back.gapToHouse).toBe(typed.gapToHouse);
		// A metric size shown in feet: 3.6 m = 141.73 in → 141 3/4 in = 11.8125 ft.
		const m = convertPlan(
			{
				...starterInput('metric'),
				sections: [
					{
						outline: [
							[0, 0],
							[3.6, 0],
							[3.6, 3],
							[0, 3]
						]
					}
				]
			},
			'imperial'
		);
		expect(m.sections[0].outline[1]).toEqual([11.8125, 0]);
		for (const [path, v] of numbers(m.sections)) expect(decimals(v), path).toBeLessThanOrEqual(4);
	});
});

describe('switching units in the wizard', () => {
	it('there and back returns every value exactly as typed, and keeps the bag count', () => {
		const typed = { ...starterInput('imperial'), thickness: 4, gapToHouse: 1, conditions: { ...starterInput().conditions, airTemp: 70, wind: 7 } };
		typed.bags.offered[0].price = 6.4;
		const there = switchUnits(typed, 'metric', null);
		expect(there.ok).toBe(true);
		if (!there.ok) return;
		expect(there.plan.thickness).toBe(102); // 4 × 25.4 = 101.6 mm, rounded
		const back = switchUnits(there.plan, 'imperial', there.memory);
		expect(back.ok).toBe(true);
		if (!back.ok) return;
		expect(back.plan).toEqual(completeInput(typed));
		expect(computePlan(back.plan).bags.map((b) => b.count)).toEqual(computePlan(typed).bags.map((b) => b.count));
	});

	it('an edit made in between is converted; the rest comes back as typed', () => {
		const typed = starterInput('imperial');
		const there = switchUnits(typed, 'metric', null);
		if (!there.ok) throw new Error('switch refused');
		const edited = { ...there.plan, thickness: 150 };
		const back = switchUnits(edited, 'imperial', there.memory);
		if (!back.ok) throw new Error('switch refused');
		expect(back.plan.thickness).toBe(5.875); // 150 mm ÷ 25.4 = 5.906 in → 5 7/8 in, the nearest 1/16 in
		expect(back.plan.gapToHouse).toBe(typed.gapToHouse);
		expect(back.plan.sections).toEqual(typed.sections);
	});

	it('refuses, saying why, while the plan has an error', () => {
		const bad = { ...starterInput('imperial'), thickness: null };
		const r = switchUnits(bad, 'metric', null);
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.reason).toMatch(/thickness/);
	});

	it('names the field in plain words, never an engine path', () => {
		const plan = starterInput('imperial');
		const bad = {
			...plan,
			sections: [
				{
					outline: [
						[0, 0],
						[12, 0],
						[0, 0],
						[12, 0]
					]
				}
			]
		};
		const r = switchUnits(bad, 'metric', null);
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.reason).toMatch(/^The units stay as they are until the outline of pour 1 is fixed: /);
		expect(r.reason).not.toMatch(/sections\.|\.\d|outline\./);
		const priced = { ...plan, bags: { ...plan.bags, offered: [plan.bags.offered[0], { ...plan.bags.offered[1], price: -1 }] } };
		const p = switchUnits(priced, 'metric', null);
		if (!p.ok) expect(p.reason).toMatch(/until the bag price \(bag size 2\) is fixed: Enter the bag price, 0–1,000,000 USD\./);
		else expect.unreachable('a negative price is refused');
	});
});

describe('the shape form in other units', () => {
	it('carries the typed sizes over, converted to the millimetre, when the outline is not the preset', () => {
		const p = { shape: 'l' as const, length: 14, width: 10, notchLength: 6, notchWidth: 4.5, house: 'side' as const };
		// 14 ft × 0.3048 = 4.2672 m, 10 ft = 3.048 m, 6 ft = 1.8288 m, 4.5 ft = 1.3716 m.
		expect(convertPreset(p, 'metric')).toEqual({ ...p, length: 4.267, width: 3.048, notchLength: 1.829, notchWidth: 1.372 });
		expect(convertPreset(convertPreset(p, 'metric'), 'imperial')).toEqual(p);
	});
});
