import { describe, expect, it } from 'vitest';
import { fullResult, planFigures } from './plan-figures';

describe('planFigures', () => {
	it('reads the documented fields and the unit system', () => {
		const f = planFigures(
			{ units: 'metric', sections: [] },
			{
				area: { squareFeet: 120, squareMeters: 11.148 },
				volume: { net: { cubicFeet: 40, cubicYards: 1.48, cubicMeters: 1.13 }, order: { cubicFeet: 44, cubicYards: 1.63, cubicMeters: 1.25 } },
				bags: [{ size: 80, unit: 'lb', count: 67 }],
				joints: { maxSpacing: { feet: 8, meters: 2.4384 }, depth: { inches: 1, millimeters: 25.4 } },
				materials: { items: [], diyTotal: { amount: 755.2, complete: false, unpriced: ['gravel'] } },
				cautions: [{ id: 'wet-cement', title: 'Wet cement burns skin', source: 'common practice' }],
				somethingElse: { ignored: true }
			}
		);
		expect(f.units).toBe('metric');
		expect(f.area?.squareMeters).toBe(11.148);
		expect(f.volume?.order?.cubicYards).toBe(1.63);
		expect(f.bags?.[0].count).toBe(67);
		expect(f.cautions?.map((c) => c.id)).toEqual(['wet-cement']);
		expect(f.joints?.maxSpacing.feet).toBe(8);
		// A copy with no items left: a non-zero total can only come from priced lines.
		expect(f.materials?.diyTotal).toEqual({ amount: 755.2, complete: false, priced: true, unpriced: ['gravel'] });
		expect(f).not.toHaveProperty('somethingElse');
	});

	it('leaves out what is missing or malformed instead of failing', () => {
		const f = planFigures(null, {
			area: { squareFeet: 'big' },
			volume: { net: { cubicFeet: 1, cubicYards: 2, cubicMeters: 3 } },
			bags: 'many',
			joints: { maxSpacing: 2.4 }
		});
		expect(f.units).toBe('imperial');
		expect(f.area).toBeUndefined();
		expect(f.bags).toBeUndefined();
		expect(f.joints).toBeUndefined();
		expect(f.volume?.net?.cubicMeters).toBe(3);
		expect(planFigures({ units: 'lunar' }, 'not an object')).toEqual({ units: 'imperial' });
	});
});

describe('fullResult', () => {
	it('passes an engine result whole and refuses a partial one', async () => {
		const { computePlan } = await import('$lib/plan');
		const demo = (await import('../../fixtures/demo-plans.json')).default.plans[0];
		const r = JSON.parse(JSON.stringify(computePlan(demo.input as never)));
		expect(fullResult(r)).toBe(r);
		const { schedule: _s, ...partial } = r;
		expect(fullResult(partial)).toBeNull();
		expect(fullResult({ area: {} })).toBeNull();
		expect(fullResult(null)).toBeNull();
	});
});
