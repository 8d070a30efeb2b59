import { describe, expect, it } from 'vitest';
import { computePlan, type Caution } from '$lib/plan';
import { area, mass, small, temperature } from '$lib/plan/units';
import demo from '../../../../fixtures/demo-plans.json';
import {
	diyTotal,
	formatArea,
	formatDate,
	formatElevation,
	formatMass,
	formatMinutes,
	formatMoney,
	readerLocale,
	plural,
	strengthNote,
	formatQuantity,
	formatTemperature,
	milestoneRows,
	sortCautions,
	stakeIntro,
	stakeRows,
	summaryItems
} from './format';

const [patio, , shedPad] = demo.plans.map((p) => computePlan(p.input));

describe('unit text', () => {
	it('areas in the plan unit', () => {
		expect(formatArea(area(10), 'metric')).toBe('10 m²');
		// 10 m² / 0.3048² = 107.639… ft² (NIST SP 811 App. B, 1 ft = 0.3048 m)
		expect(formatArea(area(10), 'imperial')).toBe('107.6 ft²');
	});

	it('signed heights: a sign only when something is left after rounding', () => {
		expect(formatElevation(small(-0.0381), 'imperial')).toBe('−1½ in'); // 38.1 mm = 1½ in exactly (1 in = 25.4 mm)
		expect(formatElevation(small(0.0095), 'imperial')).toBe('+⅜ in'); // 9.5 mm = 0.374 in → nearest ⅛
		expect(formatElevation(small(-0.0002), 'imperial')).toBe('0 in');
		expect(formatElevation(small(-0.0114), 'metric')).toBe('−11 mm');
		expect(formatElevation(small(0.0004), 'metric')).toBe('0 mm');
	});

	it('masses and temperatures in the plan unit', () => {
		expect(formatMass(mass(23), 'imperial')).toBe('51 lb'); // 23 kg / 0.45359237 = 50.7 lb (NIST SP 811)
		expect(formatMass(mass(36.2874), 'metric')).toBe('36.3 kg');
		expect(formatTemperature(temperature(25), 'imperial')).toBe('77 °F');
		expect(formatTemperature(temperature(7.6), 'metric')).toBe('8 °C');
	});

	it('minutes read like a clock', () => {
		expect(formatMinutes(45.4)).toBe('45 min');
		expect(formatMinutes(120)).toBe('2 h');
		expect(formatMinutes(306)).toBe('5 h 6 min');
		expect(formatMinutes(-267.8)).toBe('4 h 28 min');
	});

	it('money, quantities and dates', () => {
		expect(formatMoney(646.4000000000001)).toBe('$646.40');
		expect(formatMoney(1683.2, 'USD')).toBe('$1,683.20');
		expect(formatMoney(1683.2, 'EUR')).toBe('€1,683.20');
		expect(formatMoney(12, 'CAD')).toBe('CA$12.00');
		expect(formatMoney(1500, 'JPY')).toBe('¥1,500'); // ISO 4217: the yen has no minor unit
		expect(formatQuantity(13.999999999999998, 'ft')).toBe('14 ft');
		expect(formatQuantity(2.4888, 'yd³')).toBe('2.49 yd³');
		expect(formatQuantity(77.4558, 'gal')).toBe('77.5 gal');
		expect(formatQuantity(0, 'per your layout')).toBe('per your layout');
		expect(formatDate('2027-05-15')).toBe('Sat, May 15, 2027');
		expect(formatDate('2027-05-15', 'en-GB')).toBe('Sat, 15 May 2027');
		expect(formatDate('2027-05-15', 'de-DE')).toBe('Sa., 15. Mai 2027');
		expect(readerLocale('de-DE,de;q=0.9,en;q=0.8')).toBe('de-DE');
		expect(readerLocale('x-!!, en-GB;q=0.5')).toBe('en-GB');
		expect(readerLocale(null)).toBe('en-US');
	});
});

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

describe('small words', () => {
	it('counts one board, not one boards', () => {
		expect(plural(1, 'board')).toBe('1 board');
		expect(plural(3, 'board')).toBe('3 boards');
	});

	it('explains a strength curve past 100 % and says nothing below it', () => {
		// ACI 209R-92 Eq. 2-1, moist-cured Type I: 28 / (4.0 + 0.85 × 28) = 1.0072 → 100.7 % at day 28.
		expect(strengthNote([{ percent: 70 }, { percent: 100.7 }])).toMatch(/ACI 209R-92.*100\.7 %/);
		expect(strengthNote([{ percent: 70 }, { percent: 99 }])).toBeUndefined();
	});
});
