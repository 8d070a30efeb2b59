import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { rect } from '$lib/plan/test-plans';
import { pourTimes } from './pours';

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
