import { describe, expect, it } from 'vitest';
import { computePlan, parsePlanInput } from './index';
import { rect } from './test-plans';

describe('currency of the prices', () => {
	const base = { units: 'imperial' as const, sections: [{ outline: rect(0, 0, 10, 10) }] };

	it('defaults to USD and carries the ISO 4217 code into the result', () => {
		expect(computePlan(base).currency).toBe('USD');
		expect(computePlan({ ...base, currency: 'cad' }).currency).toBe('CAD');
	});

	it('refuses a code that is not ISO 4217, saying what to enter', () => {
		const r = parsePlanInput({ ...base, currency: 'XYZQ' });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.errors).toEqual([{ path: 'currency', message: expect.stringMatching(/three-letter currency code/) }]);
	});
});
