import { describe, expect, it } from 'vitest';
import { bagOption, compareCost, readyMix } from './bags';
import { modelOf, rect } from './test-plans';

const FT3 = 0.3048 ** 3;

describe('bags for an 88 ft³ order', () => {
	const { m } = modelOf({
		units: 'imperial',
		sections: [{ outline: rect(0, 0, 20, 12) }],
		bags: { offered: [{ size: 80, price: 6.5 }, { size: 60 }, { size: 40 }] },
		readyMix: { price: 180 }
	});
	const order = 88 * FT3;

	it('rounds each offered size up', () => {
		const counts = m.bags.offered.map((b) => bagOption(b, order, m).count);
		// 88 / 0.60 = 146.7, 88 / 0.45 = 195.6, 88 / 0.30 = 293.3 (bag-label yields, common practice)
		expect(counts).toEqual([147, 196, 294]);
	});

	it('gives dry mass, water, trips and cost', () => {
		const b = bagOption(m.bags.offered[0], order, m);
		expect(b.dryMass.pounds).toBeCloseTo(11760, 6); // 147 × 80
		expect(b.water.liters).toBeCloseTo(426.7397, 3); // 11760 lb × 0.4536 × 0.08 (from memory: ~3 qt a bag)
		expect(b.water.gallons).toBeCloseTo(112.7327, 3); // ÷ 3.785411784 L/gal
		expect(b.trips).toBe(12); // 11760 lb / 1000 lb payload
		expect(b.cost).toBeCloseTo(955.5, 9); // 147 × 6.50
		expect(b.planned).toBe(true);
	});

	it('rounds ready-mix up to the increment and prices it', () => {
		const r = readyMix(order, m);
		expect(r.order).toBeCloseTo(3.5, 12); // 88 / 27 = 3.26 yd³ → next 0.25 (from memory)
		expect(r.shortLoad).toBe(false);
		expect(r.cost).toBeCloseTo(630, 9); // 3.5 × 180
		const c = compareCost(m.bags.offered.map((b) => bagOption(b, order, m)), r);
		expect(c.cheaper).toBe('readyMix');
	});
});

describe('a short load', () => {
	it('notes an order under the minimum and adds the fee', () => {
		const { m } = modelOf({
			units: 'imperial',
			sections: [{ outline: rect(0, 0, 10, 10) }],
			readyMix: { price: 185, increment: 0.25, minimum: 3, shortLoadFee: 75 }
		});
		const r = readyMix(2.2 * 27 * FT3, m);
		expect(r.order).toBeCloseTo(2.25, 12); // 2.2 → 2.25 yd³
		expect(r.shortLoad).toBe(true);
		expect(r.cost).toBeCloseTo(491.25, 9); // 2.25 × 185 + 75
		expect(r.note).toMatch(/minimum/);
	});
});
