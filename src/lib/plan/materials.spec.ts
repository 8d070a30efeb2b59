import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import { rect } from './test-plans';

const priced = computePlan({
	units: 'imperial',
	sections: [{ outline: rect(0, 0, 20, 12) }],
	bags: { offered: [{ size: 80, price: 6.5 }] },
	prices: { gravel: 50, lumber: 1, stake: 1.5, screw: 0.1, releaseAgent: 12, isolationStrip: 1, curingCover: 0.1 }
});
const item = (id: string) => priced.materials.items.find((i) => i.id === id)!;

describe('materials list', () => {
	it('lists concrete, base, boards, stakes and screws with quantities', () => {
		expect(item('concrete-bags').quantity).toBe(147); // 88 ft³ / 0.60 ft³ (bag labels, common practice)
		expect(item('gravel').quantity).toBeCloseTo(3.5556, 4); // 240 ft² × 4 in × 1.2 / 27 (IRC R506.2.2; bulking common practice)
		expect(item('board-16').quantity).toBe(2);
		expect(item('stakes').quantity).toBe(17);
		expect(item('screws').quantity).toBe(40);
		expect(item('isolation-strip').quantity).toBeCloseTo(20, 9); // along the 20 ft house edge
		expect(item('curing-cover').quantity).toBeCloseTo(240, 9); // the slab area, ft²
	});

	it('prices what has a price and totals it', () => {
		expect(item('board-16').cost).toBeCloseTo(32, 9); // 2 × 16 ft × $1/ft
		expect(item('gravel').cost).toBeCloseTo(177.7778, 4); // 3.5556 yd³ × $50
		// 955.5 bags + 177.78 gravel + 56 boards (2 × 16 + 2 × 12 ft) + 25.5 stakes + 4 screws + 12 + 20 + 24
		expect(priced.materials.diyTotal.amount).toBeCloseTo(955.5 + 177.7778 + 56 + 25.5 + 4 + 12 + 20 + 24, 3);
		expect(priced.materials.diyTotal.complete).toBe(true);
	});

	it('lists what still needs a price', () => {
		const plain = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }] });
		expect(plain.materials.diyTotal.complete).toBe(false);
		expect(plain.materials.diyTotal.unpriced).toContain('concrete-bags');
	});

	it('names the tools, with a water-fed saw when joints are sawn', () => {
		const sawn = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], joints: { method: 'saw' } });
		expect(sawn.materials.tools.map((t) => t.id)).toContain('saw'); // OSHA 29 CFR 1926.1153
		expect(priced.materials.tools.map((t) => t.id)).toContain('groover');
		expect(priced.materials.tools.find((t) => t.id === 'screed')!.name).toMatch(/13 ft/); // 12 ft span + 1 ft, common practice
	});
});
