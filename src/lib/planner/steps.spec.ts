import { describe, expect, it } from 'vitest';
import { planInputSchema } from '$lib/plan/schema';
import { STEPS, stepFields } from './steps';

describe('wizard steps', () => {
	it('place every field of the plan schema in exactly one step', () => {
		const placed = STEPS.flatMap((s) => s.fields as readonly string[]);
		expect(new Set(placed).size).toBe(placed.length); // no field in two steps
		for (const units of planInputSchema.options) expect([...placed].sort()).toEqual(Object.keys(units.shape).sort());
	});

	it('give a step its own fields', () => {
		expect(stepFields('pitch')).toEqual(['slope']);
		expect(stepFields('review')).toEqual([]);
	});
});
