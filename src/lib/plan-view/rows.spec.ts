import { describe, expect, it } from 'vitest';
import { computePlan, type Caution } from '$lib/plan';
import demo from '../../../fixtures/demo-plans.json';
import { planFigures } from '$lib/plan-figures';
import { diyTotal, figureRows, milestoneRows, sortCautions, stakeIntro, stakeRows, summaryItems } from './rows';

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

	it('DIY total names what has no price, and is absent when nothing is priced', () => {
		expect(diyTotal(shedPad)?.note).toContain('Form stakes');
		const none = { materials: { ...patio.materials, items: patio.materials.items.map((i) => ({ ...i, cost: undefined })) } };
		expect(diyTotal(none)).toBeUndefined();
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

describe('figures a lead keeps', () => {
	it('reads the same text as the plan page, and leaves out what an older copy lacks', () => {
		const rows = Object.fromEntries(figureRows(planFigures(demo.plans[0].input, patio)));
		// the patio: 14 × 12 ft = 168 ft², ordered 2.24 yd³ as the summary above
		expect(rows['Area']).toBe('168 ft²');
		expect(rows['Concrete to order']).toBe('2.24 yd³');
		expect(rows['Bags']).toContain(`${patio.bags[0].count} × ${patio.bags[0].size} ${patio.bags[0].unit}`);
		expect(Object.keys(Object.fromEntries(figureRows(planFigures(demo.plans[0].input, { area: patio.area }))))).toEqual(['Area']);
	});
});
