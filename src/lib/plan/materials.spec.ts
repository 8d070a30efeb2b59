import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import type { PlanInput } from './schema';
import { rect } from './test-plans';

const patio: PlanInput = { units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }] };
const priced = computePlan({
	...patio,
	bags: { offered: [{ size: 80, price: 6.5 }] },
	prices: { gravel: 50, lumber: 1, stake: 1.5, screw: 0.1, releaseAgent: 12, isolationStrip: 1, curingCover: 0.1, tools: 120, haulSoil: 40 }
});
const itemOf = (r: ReturnType<typeof computePlan>, id: string) => r.materials.items.find((i) => i.id === id)!;
const item = (id: string) => itemOf(priced, id);

describe('materials list', () => {
	it('lists concrete, base, boards, stakes and screws with quantities', () => {
		expect(item('concrete-bags').quantity).toBe(147); // 88 ft³ / 0.60 ft³ (bag labels, common practice)
		// (240 + 22 ft² past the forms) × 4 in × 1.2 / 27 = 3.8815 yd³ (IRC R506.2.2; bulking and overhang common practice)
		expect(item('gravel').quantity).toBeCloseTo(3.8815, 4);
		expect(item('stakes').quantity).toBe(17);
		expect(item('screws').quantity).toBe(48); // 40 at stakes, 4 on the splice cleat, 4 at two corners
		expect(item('isolation-strip').quantity).toBeCloseTo(20, 9); // along the 20 ft house edge
		expect(item('curing-cover').quantity).toBeCloseTo(240, 9); // the slab area, ft²
		expect(item('haul-soil').quantity).toBe(18); // 174.667 ft³ × 1.35 t/yd³ at 1000 lb a load
	});

	it('prices every line and totals it', () => {
		expect(item('gravel').cost).toBeCloseTo(194.0741, 4); // 3.8815 yd³ × $50
		// boards 3 × 12 + 16 ft at $1, 17 × 1.50 stakes, 48 × 0.10 screws, one container $12, 20 ft × $1 strip,
		// 240 ft² × $0.10 cover, $120 tools, 18 loads × $40
		const expected = 955.5 + 194.0741 + 52 + 25.5 + 4.8 + 12 + 20 + 24 + 120 + 720;
		expect(priced.materials.diyTotal.amount).toBeCloseTo(expected, 3);
		expect(priced.materials.diyTotal.complete).toBe(true);
		// Tap water has no price: shown "—" like any unpriced line, yet the total stays complete.
		expect(item('water').cost).toBeUndefined();
		expect(priced.materials.diyTotal.unpriced).not.toContain('water');
		// The same basis for ready-mix: everything but the bags and the water.
		expect(priced.cost.sharedCost).toBeCloseTo(expected - 955.5, 3);
	});

	it('lists what still needs a price, rebar and fiber included', () => {
		const plain = computePlan({ ...patio, reinforcement: 'rebar' });
		expect(plain.materials.diyTotal.complete).toBe(false);
		expect(plain.materials.diyTotal.unpriced).toEqual(expect.arrayContaining(['concrete-bags', 'rebar', 'chairs', 'tools']));
		expect(computePlan({ ...patio, reinforcement: 'fiber' }).materials.diyTotal.unpriced).toContain('fiber');
	});

	it('counts welded wire sheets with their laps, and chairs', () => {
		const r = computePlan({ ...patio, reinforcement: 'mesh' });
		// 5 × 10 ft sheets lapped 6 + 2 in = ⅔ ft (common practice): (5 − ⅔)(10 − ⅔) = 40.444 ft² each → ⌈240 / 40.444⌉ = 6
		expect(itemOf(r, 'mesh').quantity).toBe(6);
		// Chairs on a 3 ft grid (WRI: supports at most 3 ft apart): ⌈240 / 9⌉ = 27
		expect(itemOf(r, 'chairs').quantity).toBe(27);
	});

	it('counts a rebar grid with edge cover and stock lengths', () => {
		const r = computePlan({ ...patio, reinforcement: 'rebar' });
		// 18 in both ways, 3 in in from the edges (from memory): 14 bars of 11.5 ft across and 8 of 19.5 ft along;
		// none passes the 20 ft stock, so no laps: 161 + 156 = 317 ft → ⌈317 / 20⌉ = 16 bars to buy.
		expect(itemOf(r, 'rebar').quantity).toBe(16);
		expect(itemOf(r, 'rebar').note).toMatch(/22 runs/);
		expect(itemOf(r, 'rebar').note).toMatch(/317 ft/);
	});

	it('doses fiber per bag', () => {
		// 1.5 lb/yd³ (from memory) × 0.6/27 yd³ a bag = 0.0333 lb (0.53 oz) × 147 bags = 4.9 lb
		expect(itemOf(computePlan({ ...patio, reinforcement: 'fiber' }), 'fiber').quantity).toBeCloseTo(4.9, 9);
		// As the label gives it: 0.5 oz a bag × 147 = 73.5 oz = 4.594 lb
		const label = computePlan({ ...patio, reinforcement: 'fiber', reinforcing: { fiberPerBag: 0.5 } });
		expect(itemOf(label, 'fiber').quantity).toBeCloseTo(4.59375, 9);
	});

	it('sizes curing compound by coverage and release agent by form face', () => {
		const r = computePlan({ ...patio, curing: { method: 'compound' } });
		// 240 ft² / 200 ft² per gal (the ASTM C156 test rate for C309 compounds; the label rules) = 1.2 gal
		expect(itemOf(r, 'curing-compound').quantity).toBeCloseTo(1.2, 9);
		expect(r.materials.items.map((i) => i.id)).not.toContain('curing-cover');
		// 44 ft of 2x4 (3½ in, DOC PS 20) = 12.83 ft² of face: about 0.03 gal at 400 ft²/gal (from memory) → 1 container
		expect(item('release-agent').quantity).toBe(1);
		expect(item('release-agent').note).toMatch(/13 ft²/);
	});

	it('names the tools, with a water-fed saw when joints are sawn', () => {
		const sawn = computePlan({ ...patio, joints: { method: 'saw' } });
		expect(sawn.materials.tools.map((t) => t.id)).toContain('saw'); // OSHA 29 CFR 1926.1153
		expect(priced.materials.tools.map((t) => t.id)).toContain('groover');
	});

	it('sizes the screed to span the side forms when the house side has no form', () => {
		// The 20 ft house edge is poured against an isolation strip: the board rides the two 12 ft side forms,
		// so it spans 20 ft + 1 ft (common practice), or a screed rail goes along the house.
		const screed = priced.materials.tools.find((t) => t.id === 'screed')!;
		expect(screed.name).toMatch(/21 ft/);
		expect(screed.why).toMatch(/screed rail/);
		// Formed along the house: the shorter 12 ft span + 1 ft.
		const formed = computePlan({ ...patio, houseEdgeFormed: true }).materials.tools.find((t) => t.id === 'screed')!;
		expect(formed.name).toMatch(/13 ft/);
	});

	it('asks for a metric level in a metric plan', () => {
		const metric = computePlan({ units: 'metric', sections: [{ outline: rect(0, 0, 6, 4) }] });
		expect(metric.materials.tools.find((t) => t.id === 'line-level')!.name).toMatch(/1\.2 m level/);
	});
});
