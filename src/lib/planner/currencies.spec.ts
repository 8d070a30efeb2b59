import { describe, expect, it } from 'vitest';
import { parsePlanInput } from '$lib/plan';
import { CURRENCY_CODES, currencyOptions } from './currencies';

describe('currencies offered', () => {
	it('every code offered is one the schema accepts (ISO 4217, formattable here)', () => {
		for (const currency of CURRENCY_CODES) {
			const r = parsePlanInput({
				units: 'imperial',
				currency,
				sections: [
					{
						outline: [
							[0, 0],
							[4, 0],
							[4, 4]
						]
					}
				]
			});
			expect(r.ok, currency).toBe(true);
		}
	});

	it('names each code and keeps a plan’s own code that is not listed', () => {
		expect(currencyOptions('USD').find((o) => o.code === 'USD')?.label).toBe('USD — US Dollar');
		expect(currencyOptions('XAF').map((o) => o.code)).toContain('XAF');
		expect(currencyOptions('EUR').filter((o) => o.code === 'EUR')).toHaveLength(1);
	});
});
