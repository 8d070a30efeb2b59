import { describe, expect, it } from 'vitest';
import { computePlan, type Caution } from '$lib/plan';
import demo from '../../../fixtures/demo-plans.json';
import { diyPricing, planFigures } from '$lib/plan-figures';
import { smallPatio } from '$lib/plan/test-plans';
import { diyTotal, figureRows, milestoneRows, overDiy, sortCautions, stakeIntro, stakeRows, summaryItems } from './rows';

const [patio, , shedPad] = demo.plans.map((p) => computePlan(p.input));

describe('rows from a computed plan', () => {
	it('summary carries the engine volumes and every bag option', () => {
		const items = summaryItems(patio);
		const value = (label: string) => items.find((i) => i.label === label)?.value;
		// 14 × 12 ft at 4 in = 56 ft³ = 2.07 yd³; +8 % waste = 60.48 ft³ = 2.24 yd³ (1 yd³ = 27 ft³)
		expect(value('Concrete in place')).toBe('2.07 yd³ (56 ft³)');
		expect(value('Concrete to order')).toBe('2.24 yd³ (60.5 ft³)');
		expect(value('Area')).toBe('168 ft²');
		for (const b of patio.bags) expect(value(`${b.size} lb bags`)).toMatch(new RegExp(`^${b.count} bags`));
	});

	it('names the cheaper option only when both prices exist', () => {
		const items = summaryItems(patio);
		expect(items.find((i) => i.label === 'Costs less')?.value).toMatch(/^Ready-mix: \$491\.25 against \$646\.40/);
		const unpriced = { ...patio, cost: { cheaper: null } };
		expect(summaryItems(unpriced).some((i) => i.label === 'Costs less')).toBe(false);
	});

	it('stake rows: one per stake, the high stake flagged, zero below the line at the high stake', () => {
		const rows = stakeRows(patio);
		expect(rows.map((r) => r.id)).toEqual(patio.elevations.stakes.map((s) => s.id));
		const high = rows.filter((r) => r.high);
		expect(high.map((r) => r.id)).toEqual([patio.elevations.highStake]);
		expect(high[0].belowLine).toBe('0 in');
		// ¼ in/ft fall over 12 ft = 3 in (ACI 302.1R ¼ in/ft): the far stakes sit 3 in below the line
		expect(rows.find((r) => r.position === '14 ft 0 in, 12 ft 0 in')?.belowLine).toBe('3 in');
		// Positions read as a tape does, never decimal feet: 7.2760 ft = 7 ft 3.3125 in = 7 ft 3 5/16 in.
		for (const r of rows) expect(r.position).toMatch(/^(\d+ ft )?\d+( \d+\/\d+)? in, (\d+ ft )?\d+( \d+\/\d+)? in$/);
		const odd = stakeRows({ ...patio, elevations: { ...patio.elevations, stakes: [{ ...patio.elevations.stakes[0], x: 7 + 3.3125 / 12, y: -0.5 }] } });
		expect(odd[0].position).toBe('7 ft 3 5/16 in, −6 in');
		const metric = stakeRows({ ...patio, units: 'metric', elevations: { ...patio.elevations, stakes: [{ ...patio.elevations.stakes[0], x: 2.2154, y: 0 }] } });
		expect(metric[0].position).toBe('2.215 m, 0.000 m');
		expect(stakeIntro(patio)).toContain('mark it 1½ in below the kitchen door sill');
	});

	it('milestones carry the strength on their day from the timeline', () => {
		for (const m of milestoneRows(patio)) {
			const day = patio.strength.find((d) => d.day === m.day);
			expect(m.percent).toBe(day?.percent);
		}
	});

	it('cautions: the deferral apart, the rest most severe first', () => {
		const c = (id: string, severity: Caution['severity']): Caution => ({ id, severity, title: id, reason: '', action: '', source: '' });
		const sorted = sortCautions([c('local-codes', 'info'), c('a', 'info'), c('b', 'warning'), c('c', 'danger'), c('d', 'warning')]);
		expect(sorted.deferral?.id).toBe('local-codes');
		expect(sorted.rest.map((x) => x.id)).toEqual(['c', 'b', 'd', 'a']);
	});
});

// These are the engine's own sums turned into text, not trade figures: no published source applies.
describe('the DIY total, one wording for every view', () => {
	const names = (ids: string[]) => ids.map((id) => patio.materials.items.find((i) => i.id === id)!.name);
	const diyRow = (r: Parameters<typeof summaryItems>[0]) => summaryItems(r).find((i) => i.label === 'Do-it-yourself total');

	it('none priced: says so (with where to price it for the homeowner), and nothing is compared with it', () => {
		const bare = computePlan(smallPatio());
		// Sanity: the engine sums no price to 0, which must not be shown as a cost.
		expect(bare.materials.diyTotal.amount).toBe(0);
		const owner = diyTotal(diyPricing(bare.materials), 'homeowner');
		expect(owner).toEqual({ cents: null, value: 'Not priced', note: "add prices in the planner's Crew step", detail: "add prices in the planner's Crew step" });
		expect(diyTotal(diyPricing(bare.materials), 'contractor')).toEqual({ cents: null, value: 'Not priced', note: undefined, detail: undefined });
		expect(overDiy(420_000, owner)).toBeUndefined();
		expect(diyRow(bare)?.value).toBe('Not priced');
		const f = planFigures(smallPatio(), bare);
		expect(Object.fromEntries(figureRows(f, 'homeowner'))['Materials if done yourself']).toBe("Not priced — add prices in the planner's Crew step");
		expect(Object.fromEntries(figureRows(f, 'contractor'))['Materials if done yourself']).toBe('Not priced');
		for (const rows of [figureRows(f, 'homeowner'), figureRows(f, 'contractor')]) expect(rows.flat().join(' ')).not.toContain('$');
	});

	it('some priced: the sum of the priced lines, said to be only that, with the lines left out named', () => {
		// The back patio prices everything but fiber, soil hauling and tools (lind-back-patio/materials.json).
		expect(patio.materials.diyTotal.unpriced).toEqual(['fiber', 'haul-soil', 'tools']);
		const t = diyTotal(diyPricing(patio.materials), 'homeowner');
		// 890.4178 in the engine's snapshot, to the cent
		expect(t).toMatchObject({ cents: 89_042, value: '$890.42', note: 'sum of the priced items only' });
		expect(t?.detail).toBe(`sum of the priced items only; no price for: ${names(['fiber', 'haul-soil', 'tools']).join('; ')}`);
		expect(diyTotal(diyPricing(patio.materials), 'contractor')).toEqual(t);
		// $4,200.00 − $890.42
		expect(overDiy(420_000, t)).toBe('+$3,309.58');
		expect(overDiy(50_000, t)).toBe('−$390.42');
		expect(diyRow(patio)).toMatchObject({ value: '$890.42', note: t?.detail });
		expect(Object.fromEntries(figureRows(planFigures(demo.plans[0].input, patio), 'contractor'))['Materials if done yourself']).toBe(`$890.42 (${t?.detail})`);
		expect(diyTotal(diyPricing(shedPad.materials), 'homeowner')?.detail).toContain('Form stakes');
	});

	it('all priced: the total alone', () => {
		const input = { ...demo.plans[0].input, prices: { ...demo.plans[0].input.prices, fiber: 9, haulSoil: 60, tools: 150 } };
		const whole = computePlan(input);
		expect(whole.materials.diyTotal.complete).toBe(true);
		const t = diyTotal(diyPricing(whole.materials), 'homeowner');
		expect(t).toEqual({ cents: Math.round(whole.materials.diyTotal.amount * 100), value: expect.stringMatching(/^\$[\d,]+\.\d\d$/) });
		expect(diyRow(whole)).toEqual({ label: 'Do-it-yourself total', value: t?.value, note: undefined });
		expect(Object.fromEntries(figureRows(planFigures(input, whole), 'homeowner'))['Materials if done yourself']).toBe(t?.value);
	});

	it('a frozen copy without its items: a zero, incomplete total is not priced; a non-zero one is', () => {
		const only = (amount: number) => planFigures({}, { materials: { diyTotal: { amount, complete: false, unpriced: ['gravel'] } } });
		expect(only(0).materials?.diyTotal).toEqual({ amount: 0, complete: false, priced: false, unpriced: ['gravel'] });
		expect(figureRows(only(0), 'contractor')).toEqual([['Materials if done yourself', 'Not priced']]);
		expect(figureRows(only(755.2), 'contractor')).toEqual([['Materials if done yourself', '$755.20 (sum of the priced items only; no price for: gravel)']]);
	});
});

describe('figures a lead keeps', () => {
	it('reads the same text as the plan page, and leaves out what an older copy lacks', () => {
		const rows = Object.fromEntries(figureRows(planFigures(demo.plans[0].input, patio), 'contractor'));
		// the patio: 14 × 12 ft = 168 ft², ordered 2.24 yd³ as the summary above
		expect(rows['Area']).toBe('168 ft²');
		expect(rows['Concrete to order']).toBe('2.24 yd³');
		expect(rows['Bags']).toContain(`${patio.bags[0].count} × ${patio.bags[0].size} ${patio.bags[0].unit}`);
		expect(Object.keys(Object.fromEntries(figureRows(planFigures(demo.plans[0].input, { area: patio.area }), 'contractor')))).toEqual(['Area']);
	});
});
