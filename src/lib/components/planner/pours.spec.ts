import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { rect } from '$lib/plan/test-plans';
import { fixMessage, pourTimes } from './pours';

describe('mixing and placing in the results', () => {
	it('shows the longest pour, not the whole slab, once the slab is split into pours', () => {
		const one = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 12, 10) }], crew: { people: 2 } });
		const two = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 6, 10) }, { outline: rect(6, 0, 12, 10) }], crew: { people: 2 } });
		const a = pourTimes(one.mixing);
		const b = pourTimes(two.mixing);
		expect(a.pours).toBe(1);
		expect(b.pours).toBe(2);
		expect(b.longest).toBeLessThan(b.total * 0.75); // each pour is about half the slab
		expect(a.total).toBeCloseTo(one.mixing.sections[0].totalMinutes, 6);
		expect(b.longest).toBe(Math.max(...two.mixing.sections.map((s) => s.totalMinutes)));
		expect(b.badge).not.toMatch(/one pour/i);
		expect(b.badge).toMatch(two.mixing.fits ? /^2 pours fit$/ : /runs? too long/);
	});
});

describe('fixMessage', () => {
	it('names the steps that hold the marked fields, since the step on screen may hold none', () => {
		expect(fixMessage(1, ['Build-up'])).toBe('Fix the marked field in the Build-up step to see the numbers.');
		expect(fixMessage(5, ['Site'])).toBe('Fix the 5 marked fields in the Site step to see the numbers.');
		expect(fixMessage(3, ['Site', 'Pitch', 'Crew'])).toBe('Fix the 3 marked fields in the Site, Pitch and Crew steps to see the numbers.');
	});
	it('says only how many when no step holds them', () => {
		expect(fixMessage(2)).toBe('Fix the 2 marked fields to see the numbers.');
	});
});
