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
		const counts = m.bags.offered.map((b) => bagOption(b, [order], m).count);
		// 88 / 0.60 = 146.7, 88 / 0.45 = 195.6, 88 / 0.30 = 293.3 (bag-label yields, common practice)
		expect(counts).toEqual([147, 196, 294]);
	});

	it('gives dry mass, water, trips and cost', () => {
		const b = bagOption(m.bags.offered[0], [order], m);
		expect(b.dryMass.pounds).toBeCloseTo(11760, 6); // 147 × 80
		expect(b.water.liters).toBeCloseTo(426.7397, 3); // 11760 lb × 0.4536 × 0.08 (from memory: ~3 qt a bag)
		expect(b.water.gallons).toBeCloseTo(112.7327, 3); // ÷ 3.785411784 L/gal
		// Whole bags per load: ⌊1000 / 80⌋ = 12, so ⌈147 / 12⌉ = 13 loads, not ⌈11760 / 1000⌉ = 12
		// (payload 1000 lb for a half-ton pickup, from memory; bags are whole)
		expect(b.bagsPerTrip).toBe(12);
		expect(b.trips).toBe(13);
		expect(b.cost).toBeCloseTo(955.5, 9); // 147 × 6.50
		expect(b.planned).toBe(true);
	});

	it('rounds ready-mix up to the increment and prices it', () => {
		const r = readyMix(order, m);
		expect(r.order).toBeCloseTo(3.5, 12); // 88 / 27 = 3.26 yd³ → next 0.25 (from memory)
		expect(r.shortLoad).toBe(false);
		expect(r.cost).toBeCloseTo(630, 9); // 3.5 × 180
		const c = compareCost(
			m.bags.offered.map((b) => bagOption(b, [order], m)),
			r
		);
		expect(c.cheaper).toBe('readyMix');
	});

	it('hauls 86 bags of 80 lb in 8 loads of at most 12', () => {
		// 86 × 0.60 ft³ = 51.6 ft³: exactly 86 bags (bag-label yield, common practice)
		const b = bagOption(m.bags.offered[0], [86 * 0.6 * FT3], m);
		expect(b.count).toBe(86);
		expect(b.trips).toBe(8); // ⌈86 / ⌊1000 / 80⌋⌉ = ⌈86 / 12⌉ = 8; by mass 6880 / 1000 would say 7
	});

	it('rounds each pour to whole bags and buys their sum', () => {
		// Two pours of 44 ft³: 44 / 0.60 = 73.3 → 74 each, 148 bought (one order of 88 ft³ would say 147)
		expect(bagOption(m.bags.offered[0], [44 * FT3, 44 * FT3], m).count).toBe(148);
	});

	it('compares bags and ready-mix with the same forms, base and tools in both', () => {
		const r = readyMix(order, m);
		const items = [
			{ id: 'concrete-bags', cost: 955.5 },
			{ id: 'water', cost: 0 },
			{ id: 'gravel', cost: 177.78 },
			{ id: 'tools', cost: 120 },
			{ id: 'stakes' }
		];
		const c = compareCost([bagOption(m.bags.offered[0], [order], m)], r, { items });
		expect(c.sharedCost).toBeCloseTo(297.78, 9); // 177.78 + 120: everything but the concrete and water
		expect(c.bagTotal).toBeCloseTo(955.5 + 297.78, 9);
		expect(c.readyMixTotal).toBeCloseTo(630 + 297.78, 9); // 3.5 yd³ × $180 + the same shared lines
		expect(c.unpriced).toEqual(['stakes']);
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
