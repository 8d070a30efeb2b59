// The defaults through the engine: a plan given only its outline meets the published rules the
// defaults claim, worked by hand.

import { describe, expect, it } from 'vitest';
import { EXAMPLE_PRICES, computePlan, parsePlanInput, planInputJsonSchema } from './index';
import { rect } from './test-plans';

const plain = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }] });
const metric = computePlan({ units: 'metric', sections: [{ outline: rect(0, 0, 6, 4) }] });

describe('a plan given only its outline', () => {
	it('is thick enough and drains away from the house', () => {
		expect(plain.forms.thickness.inches).toBeGreaterThanOrEqual(3.5); // IRC R506.1
		expect(metric.forms.thickness.millimeters).toBeGreaterThanOrEqual(88.9); // IRC R506.1, 3½ in
		expect(plain.elevations.houseEdges[0].fallAway.percent).toBeCloseTo(2, 12); // IRC R401.3, ≥ 2 %
		// 12 ft × 2 % = 2.88 in of total drop (IRC R401.3)
		expect(plain.elevations.totalDrop.inches).toBeCloseTo(2.88, 9);
		expect(plain.cautions.map((c) => c.id)).not.toEqual(expect.arrayContaining(['thin-slab', 'drainage-2-percent']));
	});

	it('lays 4 in of base and orders 10 % over the net volume', () => {
		expect(plain.volume.base.depth.inches).toBeCloseTo(4, 12); // IRC R506.2.2
		expect(plain.volume.order.cubicFeet).toBeCloseTo(88, 9); // 80 ft³ + 10 % (common practice 5–10 %)
		// 88 ft³ / (80 lb per 0.60 ft³) = 146.7 → 147 bags (bag labels, common practice)
		expect(plain.bags[0].count).toBe(147);
	});

	it('checks strength against the moderate-weathering minimum and cures by the chosen method', () => {
		// 3000 psi meets IRC Table R402.2's moderate row; the caution then asks only for air entrainment.
		const ft = plain.cautions.find((c) => c.id === 'freeze-thaw')!;
		expect(ft.action).not.toMatch(/Raise/);
		expect(plain.materials.items.map((i) => i.id)).toContain('curing-cover');
	});

	it('still reads a plan stored before exposure, curing and reinforcing details existed', () => {
		const old = parsePlanInput({ units: 'imperial', sections: [{ outline: rect(0, 0, 10, 8) }], reinforcement: 'mesh', prices: { gravel: 40 } });
		expect(old.ok && [old.plan.exposure, old.plan.curing.method, old.plan.reinforcing.meshForm]).toEqual(['moderate', 'cover', 'sheet']);
	});
});

describe('example prices', () => {
	it('give an example for every price field, in both unit systems, and are never applied', () => {
		// The request schema's price fields, read from its JSON Schema (one branch per unit system).
		const schema = planInputJsonSchema() as { anyOf?: { properties: { prices: { properties: object } } }[]; oneOf?: typeof schema.anyOf };
		const branches = schema.anyOf ?? schema.oneOf ?? [];
		for (const [i, units] of (['imperial', 'metric'] as const).entries()) {
			const fields = Object.keys(branches[i].properties.prices.properties).sort();
			expect(Object.keys(EXAMPLE_PRICES[units]).sort()).toEqual(fields);
			// Strict parsing accepts them all as prices.
			expect(parsePlanInput({ units, sections: [{ outline: rect(0, 0, 4, 4) }], prices: { ...EXAMPLE_PRICES[units] } }).ok).toBe(true);
		}
		expect(plain.materials.diyTotal.amount).toBe(0); // nothing is priced unless the person enters it
	});
});
