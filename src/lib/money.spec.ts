import { describe, expect, it } from 'vitest';
import { formatMoney, toCents } from './money';

describe('formatMoney', () => {
	it('formats cents in the currency, with its minor digits (ISO 4217)', () => {
		expect(formatMoney(toCents(646.4000000000001))).toBe('$646.40');
		expect(formatMoney(168_320, 'USD')).toBe('$1,683.20');
		expect(formatMoney(168_320, 'EUR')).toBe('€1,683.20');
		expect(formatMoney(1200, 'CAD')).toBe('CA$12.00');
		expect(formatMoney(310_000)).toBe('$3,100.00');
		expect(formatMoney(toCents(1500), 'JPY')).toBe('¥1,500'); // the yen has no minor unit
	});

	it('leaves off zero cents only when asked, for prices quoted in a sentence', () => {
		expect(formatMoney(3900, 'USD', { wholeWhenEven: true })).toBe('$39');
		expect(formatMoney(650, 'USD', { wholeWhenEven: true })).toBe('$6.50');
		expect(formatMoney(123_400, 'USD', { wholeWhenEven: true })).toBe('$1,234');
		expect(formatMoney(3900)).toBe('$39.00'); // the same currency without the option keeps its cents
	});
});
