import { describe, expect, it } from 'vitest';
import { airTempOn, defaultYieldM3, toModel } from './model';
import { parsePlanInput, type PlanInput } from './schema';

const model = (input: PlanInput) => {
	const r = parsePlanInput(input);
	if (!r.ok) throw new Error(JSON.stringify(r.errors));
	return toModel(r.plan);
};
const sections = [
	{
		outline: [
			[0, 0],
			[20, 0],
			[20, 12],
			[0, 12]
		] as [number, number][]
	}
];

describe('dressed lumber', () => {
	it('sets each nominal board at its PS 20 dry depth', () => {
		const depth = (lumber: '2x4' | '2x6' | '2x8' | '2x10' | '2x12') => model({ units: 'imperial', sections, forms: { lumber } }).forms.depth / 0.0254;
		// DOC PS 20 dressed dry sizes: 3½, 5½, 7¼, 9¼, 11¼ in
		expect(['2x4', '2x6', '2x8', '2x10', '2x12'].map((l) => depth(l as '2x4'))).toEqual([3.5, 5.5, 7.25, 9.25, 11.25].map((x) => expect.closeTo(x, 9)));
		expect(model({ units: 'imperial', sections }).forms.boardThickness / 0.0254).toBeCloseTo(1.5, 9); // DOC PS 20, nominal 2 in
	});
});

describe('conversion to SI', () => {
	it('converts an imperial plan', () => {
		const m = model({ units: 'imperial', sections, mix: { designStrength: 3000 } });
		expect(m.sections[0].outline[2][0]).toBeCloseTo(6.096, 12); // 20 ft × 0.3048
		expect(m.thickness).toBeCloseTo(0.1016, 12); // 4 in × 0.0254
		expect(m.forms.depth).toBeCloseTo(0.0889, 12); // 2x4 is 3½ in (DOC PS 20) × 0.0254
		expect(m.airTemps[0]).toBeCloseTo(21.1111, 4); // (70 − 32) × 5/9
		expect(m.designStrengthMpa).toBeCloseTo(20.684, 3); // 3000 psi × 0.00689476 MPa/psi (NIST SP 811)
		expect(m.thickened.extraDepth).toBeCloseTo(0.1016, 12); // defaults to the thickness, common practice
	});

	it('reads every slope unit as the same ratio', () => {
		expect(model({ units: 'imperial', sections, slope: { fall: { value: 0.25, unit: 'inPerFt' } } }).fall).toEqual({ ratio: 0.25 / 12 });
		expect(model({ units: 'metric', sections, slope: { fall: { value: 20, unit: 'mmPerM' } } }).fall).toEqual({ ratio: 0.02 });
		const drop = model({ units: 'imperial', sections, slope: { fall: { value: 3, unit: 'totalDrop' } } }).fall;
		expect('drop' in drop && drop.drop).toBeCloseTo(0.0762, 12); // 3 in × 0.0254
	});

	it('defaults bag yield from the bag-label ratio and plans with the largest bag', () => {
		// 80 lb → 0.60 ft³ = 0.6 × 0.3048³ m³ (common practice, bag labels)
		expect(defaultYieldM3(80 * 0.45359237)).toBeCloseTo(0.0169901, 7);
		const m = model({ units: 'imperial', sections });
		expect(m.bags.plan.size).toBe(80);
		expect(model({ units: 'imperial', sections, bags: { planSize: 40 } }).bags.plan.size).toBe(40);
	});

	it('holds the last temperature for later days', () => {
		const m = model({ units: 'metric', sections, conditions: { airTemp: [10, 12] } });
		expect([airTempOn(m, 0), airTempOn(m, 1), airTempOn(m, 9)]).toEqual([10, 12, 12]);
	});
});
