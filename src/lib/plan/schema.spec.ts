import { describe, expect, it } from 'vitest';
import { parsePlanInput, planInputJsonSchema } from './schema';

const square = [[0, 0], [10, 0], [10, 10], [0, 10]];
const base = { units: 'imperial', sections: [{ outline: square }] };

const errorsOf = (input: unknown) => {
	const r = parsePlanInput(input);
	if (r.ok) throw new Error('expected errors');
	return r.errors;
};

describe('defaults', () => {
	it('fills every optional field for an imperial plan', () => {
		const r = parsePlanInput(base);
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		const p = r.plan;
		expect(p.thickness).toBe(4); // common practice; IRC R506.1 minimum 3½ in
		expect(p.base.depth).toBe(4); // IRC R506.2.2
		expect(p.base.bulking).toBe(1.2); // common practice, 1.15–1.30
		expect(p.slope.fall).toEqual({ value: 2, unit: 'percent' }); // IRC R401.3
		expect(p.wastePercent).toBe(10); // common practice, 5–10 %
		expect(p.forms.stakeSpacing).toBe(3); // common practice, 3–4 ft
		expect(p.forms.stockLengths).toEqual([8, 10, 12, 16]); // usual stock lengths, ft
		expect(p.crew.handMixMinutes).toBe(8); // common practice, 5–8 min a bag
		expect(p.crew.workingMinutes).toBe(90); // common practice, 1½–2 h at 70 °F
		expect(p.bags.offered.map((b) => b.size)).toEqual([80, 60, 40]); // bag labels, common practice
		expect(p.milestones.vehiclePercent).toBe(70); // common practice
		expect(p.houseEdge).toEqual({ section: 0, edge: 0 });
	});

	it('uses metric defaults for a metric plan', () => {
		const r = parsePlanInput({ ...base, units: 'metric' });
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		expect(r.plan.thickness).toBe(100); // mm, common practice
		expect(r.plan.forms.stockLengths).toEqual([2.4, 3.0, 3.6, 4.8]); // usual metric stock, m
		expect(r.plan.base.depth).toBe(100); // mm, IRC R506.2.2 (4 in)
	});
});

describe('errors carry dotted paths', () => {
	it('names a bad unit system', () => {
		expect(errorsOf({ ...base, units: 'cubits' })[0].path).toBe('units');
	});

	it('names wrong types and unknown keys', () => {
		const errors = errorsOf({ ...base, thickness: 'four', colour: 'grey', sections: [{ outline: [[0, 0], ['1', 0], [1, 1]] }] });
		const paths = errors.map((e) => e.path);
		expect(paths).toContain('thickness');
		expect(paths).toContain('colour');
		expect(paths).toContain('sections.0.outline.1.0');
	});

	it('checks edge references against the outlines', () => {
		expect(errorsOf({ ...base, houseEdge: { section: 0, edge: 7 } })[0].path).toBe('houseEdge.edge');
		expect(errorsOf({ ...base, slope: { highEdge: { section: 2, edge: 0 } } })[0].path).toBe('slope.highEdge.section');
	});

	it('checks fields that depend on each other', () => {
		expect(errorsOf({ ...base, forms: { lumber: 'custom' } })[0].path).toBe('forms.customDepth');
		expect(errorsOf({ ...base, fill: { volume: 1, shareOfTrench: 0.1, largestPiece: 3 } })[0].path).toBe('fill');
		expect(errorsOf({ ...base, bags: { planSize: 50 } })[0].path).toBe('bags.planSize');
	});

	it('bounds slopes and coordinates', () => {
		expect(errorsOf({ ...base, slope: { fall: { value: 30, unit: 'percent' } } })[0].path).toBe('slope.fall.value');
		expect(errorsOf({ ...base, sections: [{ outline: [[0, 0], [10, 0], [5000, 10]] }] })[0].path).toBe('sections.0.outline.2');
	});

	it('rejects invalid geometry at the outline', () => {
		const bow = [[0, 0], [10, 0], [2, 8], [8, 10]];
		expect(errorsOf({ ...base, sections: [{ outline: bow }] })[0].path).toBe('sections.0.outline');
		const overlap = errorsOf({ ...base, sections: [{ outline: square }, { outline: [[5, 5], [15, 5], [15, 15], [5, 15]] }] });
		expect(overlap[0].path).toBe('sections.1.outline');
	});
});

describe('JSON Schema', () => {
	it('publishes both unit systems with their defaults', () => {
		const s = planInputJsonSchema() as { oneOf: { properties: Record<string, { default?: unknown }> }[] };
		expect(s.oneOf).toHaveLength(2);
		expect(s.oneOf[0].properties.thickness.default).toBe(4); // in, common practice
		expect(s.oneOf[1].properties.thickness.default).toBe(100); // mm, common practice
		expect(JSON.stringify(s)).toContain('"maximum":1000'); // coordinate bound, ft
	});
});
