import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { convertPlan } from './convert';
import { starterInput } from './draft.svelte';
import { lShape } from './shapes';

describe('unit switch', () => {
	it('keeps the same physical slab: area and volume agree within rounding', () => {
		const imperial = { ...starterInput('imperial'), sections: [{ outline: lShape(16, 12, 6, 5) }] };
		const metric = convertPlan(imperial, 'metric');
		expect(metric.units).toBe('metric');
		expect(metric.thickness).toBe(102); // 4 in × 25.4 mm/in = 101.6 → 102 mm (NIST SP 811 App. B, exact inch)
		expect(metric.sections[0].outline[1]).toEqual([4.8768, 0]); // 16 ft × 0.3048 m/ft = 4.8768 m (exact foot, 1959 agreement)
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
});
