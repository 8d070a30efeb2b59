// Worked examples through computePlan: a rectangle, an L with a notch, two sections with a cold
// joint, and the same slab described in imperial and metric.

import { describe, expect, it } from 'vitest';
import { PlanInputError, computePlan, estimate, type PlanInput } from './index';
import { cornerEll, rect } from './test-plans';

describe('a 20 × 12 ft rectangle, 4 in thick', () => {
	const r = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }] });

	it('gives area, perimeter and volume in both systems', () => {
		expect(r.area.squareFeet).toBeCloseTo(240, 9); // 20 × 12
		expect(r.area.squareMeters).toBeCloseTo(22.2967, 4); // 240 × 0.3048²
		expect(r.area.perimeter.feet).toBeCloseTo(64, 9);
		expect(r.volume.net.cubicFeet).toBeCloseTo(80, 9); // 240 × 4/12
		expect(r.volume.net.cubicYards).toBeCloseTo(2.963, 3); // 80 / 27
		expect(r.volume.order.cubicYards).toBeCloseTo(3.2593, 4); // × 1.10 waste, common practice 5–10 %
	});

	it('returns every part of the plan', () => {
		expect(r.bags[0]).toMatchObject({ size: 80, unit: 'lb', count: 147 }); // 88 / 0.60 (bag labels)
		expect(r.joints.maxSpacing.feet).toBeCloseTo(12, 9); // 36 × 4 in, ACI 302.1R
		// Day 7 at 70 °F = 21.11 °C: factor exp[−5000 (1/294.26 − 1/293.15)] = 1.06652 (ASTM C1074),
		// tₑ = 7.46565 days → 7.46565 / (4 + 0.85 × 7.46565) = 72.161 % (ACI 209R-92 Eq. 2-1)
		expect(r.strength[6]).toMatchObject({ day: 7, percent: expect.closeTo(72.161, 3) });
		expect(r.cautions[0].id).toBe('local-codes');
		expect(r.schedule.pourDays).toHaveLength(1);
	});
});

describe('an L-shaped patio with a notch around a house corner', () => {
	const r = computePlan(cornerEll);

	it('measures the L', () => {
		expect(r.area.squareFeet).toBeCloseTo(384, 9); // 24 × 18 − 8 × 6
		expect(r.area.perimeter.feet).toBeCloseTo(84, 9); // 16 + 18 + 24 + 12 + 8 + 6
		expect(r.volume.net.cubicFeet).toBeCloseTo(128, 9); // 384 × 4/12
	});

	it('drains both wall edges and forms only the free edges', () => {
		expect(r.elevations.houseEdges.every((h) => h.meetsIrc)).toBe(true); // IRC R401.3, 2 % each way
		expect(r.forms.isolationStrip.feet).toBeCloseTo(14, 9); // 8 + 6 ft along the walls
		expect(r.forms.formLength.feet).toBeCloseTo(70, 9); // 16 + 18 + 24 + 12
		expect(r.cautions.map((c) => c.id)).not.toContain('water-toward-foundation');
	});

	it('warns when the cross fall runs back toward the second wall', () => {
		const back = computePlan({ ...cornerEll, slope: { fall: { value: 2, unit: 'percent' }, crossFall: { value: -1, unit: 'percent' } } });
		expect(back.cautions.map((c) => c.id)).toContain('water-toward-foundation'); // IRC R401.3
	});
});

describe('two sections with a cold joint', () => {
	const r = computePlan({
		units: 'imperial',
		sections: [{ outline: rect(0, 0, 10, 12) }, { outline: rect(10, 0, 10, 12) }],
		conditions: { airTemp: 70, pourDate: '2027-06-01' }
	});

	it('keeps the volume of the whole and finds the joint', () => {
		expect(r.volume.net.cubicFeet).toBeCloseTo(80, 9); // 2 × 120 ft² × 4/12
		expect(r.geometry.coldJoints).toHaveLength(1);
		expect(r.geometry.coldJoints[0].length.feet).toBeCloseTo(12, 9);
		expect(r.area.perimeter.feet).toBeCloseTo(64, 9); // the shared edge is not outside
	});

	it('pours on two days with a bulkhead between', () => {
		expect(r.schedule.pourDays.map((p) => p.date)).toEqual(['2027-06-01', '2027-06-02']); // forms off after ~24 h, common practice
		expect(r.forms.runs.filter((x) => x.kind === 'bulkhead')).toHaveLength(1);
		expect(r.mixing.sections).toHaveLength(2);
	});
});

describe('a pour too big for the crew', () => {
	// 12 × 10 ft at 4 in against the house: 40 ft³ + 10 % = 44 ft³ → 73.3, 74 bags in one go (bag labels).
	// Three people with a drum: 2 bags a 6 min batch (common practice), 30 min kept for finishing,
	// 120 min working time → ⌊(120 − 30) / 3⌋ = 30 bags a pour.
	const input: PlanInput = {
		units: 'imperial',
		sections: [{ outline: rect(0, 0, 12, 10) }],
		crew: { people: 3, method: 'drum', workingMinutes: 120 },
		conditions: { airTemp: 70 }
	};
	const r = computePlan(input);
	const whole = computePlan({ ...input, crew: { people: 3, method: 'drum', workingMinutes: 300 } }); // 74 × 3 + 30 = 252 min ≤ 300: one pour

	it('puts the cold joints on re-laid control joints', () => {
		// No joint needed at 12 ft (36 × 4 in, ACI 302.1R), so none to cut on: re-laid at most
		// 12 × 30 × 0.9 / 74 = 4.38 ft apart → 3 × 3 panels of 4 × 3.33 ft (aspect 1.2 ≤ 1.5, ACI 302.1R).
		const s = r.mixing.sections[0].split!;
		expect(s.relaid).toBe(true);
		expect(s.coldJoints.map((j) => j.from[0])).toEqual([expect.closeTo(4, 9), expect.closeTo(8, 9)]);
		// The lines at x = 4 and 8 are cold joints now; the control joints left run along at y = 3.33 and 6.67.
		expect(r.joints.sections[0].lines.map((l) => l.direction)).toEqual(['along', 'along']);
		expect(r.joints.totalLength.feet).toBeCloseTo(24, 9);
		expect(whole.joints.totalLength.feet).toBe(0);
	});

	it('pours each part on its own day, with bulkheads in the forms and stakes', () => {
		// Each third 14.667 ft³ → 24.4, 25 bags (bag labels), one day apart at 70 °F (forms off ~24 h, common practice).
		expect(r.schedule.pourDays.map((p) => [p.part, p.bags, p.day])).toEqual([
			[0, 25, 6],
			[1, 25, 7],
			[2, 25, 8]
		]);
		expect(r.forms.runs.filter((x) => x.kind === 'bulkhead').map((x) => x.length.feet)).toEqual([10, 10].map((x) => expect.closeTo(x, 9)));
		// Each 10 ft bulkhead: 4 gaps of 2.5 ft → 5 new stakes (every 3 ft at most, common practice): 13 + 10.
		expect(whole.forms.stakes.count).toBe(13);
		expect(r.forms.stakes.count).toBe(23);
		expect(r.schedule.days.find((d) => d.day === 7)!.tasks.map((t) => t.id)).toContain('bulkhead-1');
	});

	it('buys what it pours, one rounding rule everywhere', () => {
		// 3 × 25 = 75 bags bought and poured (not 74: each pour is whole bags).
		expect(r.bags[0].count).toBe(75);
		expect(r.mixing.sections[0].bags).toBe(75);
		expect(r.mixing.totalBags).toBe(75);
		expect(r.materials.items.find((i) => i.id === 'concrete-bags')!.quantity).toBe(75);
		expect(r.schedule.pourDays.reduce((a, p) => a + p.bags, 0)).toBe(75);
		expect(whole.bags[0].count).toBe(74);
	});
});

describe('two sections poured apart', () => {
	it('buys the sum of the sections, 74 + 74', () => {
		const r = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 10, 12) }, { outline: rect(10, 0, 10, 12) }] });
		// Each 40 ft³ + 10 % = 44 ft³ → 73.3, 74 bags; one 88 ft³ order would have said 147 (bag labels).
		expect(r.mixing.sections.map((s) => s.bags)).toEqual([74, 74]);
		expect(r.bags[0].count).toBe(148);
		expect(r.materials.items.find((i) => i.id === 'concrete-bags')!.quantity).toBe(148);
	});
});

describe('imperial and metric describe the same slab', () => {
	const FT = 0.3048;
	const imperial: PlanInput = {
		units: 'imperial',
		sections: [{ outline: rect(0, 0, 20, 12) }],
		gapToHouse: 0.5,
		reference: { below: 1.5 },
		thickness: 4,
		forms: { stakeSpacing: 3, stakeLength: 18, stockLengths: [8, 10, 12, 16] },
		thickenedEdge: { edges: 'free', width: 8, extraDepth: 4 },
		base: { depth: 4 },
		mix: { designStrength: 3000 },
		bags: { offered: [{ size: 80, yield: 0.6 }] },
		readyMix: { increment: 0.25, minimum: 1 },
		crew: { drumBatchMass: 160, payload: 1000 },
		conditions: { airTemp: [70, 50], humidity: 50, wind: 5 }
	};
	// Every number converted exactly (NIST SP 811 App. B): ft × 0.3048, in × 25.4, lb × 0.45359237.
	const metric: PlanInput = {
		units: 'metric',
		sections: [{ outline: rect(0, 0, 20 * FT, 12 * FT) }],
		gapToHouse: 12.7,
		reference: { below: 38.1 },
		thickness: 101.6,
		forms: { stakeSpacing: 3 * FT, stakeLength: 457.2, stockLengths: [8, 10, 12, 16].map((x) => x * FT) },
		thickenedEdge: { edges: 'free', width: 203.2, extraDepth: 101.6 },
		base: { depth: 101.6 },
		mix: { designStrength: 3000 * 0.00689475729 },
		bags: { offered: [{ size: 80 * 0.45359237, yield: 0.6 * FT ** 3 }] },
		readyMix: { increment: 0.25 * 27 * FT ** 3, minimum: 27 * FT ** 3 },
		crew: { drumBatchMass: 160 * 0.45359237, payload: 1000 * 0.45359237 },
		conditions: { airTemp: [(70 - 32) / 1.8, (50 - 32) / 1.8], humidity: 50, wind: 5 * 1.609344 }
	};
	const a = computePlan(imperial);
	const b = computePlan(metric);

	it('gives the same quantities', () => {
		expect(b.volume.order.cubicMeters).toBeCloseTo(a.volume.order.cubicMeters, 9);
		expect(b.volume.thickenedEdges.cubicFeet).toBeCloseTo(a.volume.thickenedEdges.cubicFeet, 9);
		expect(b.bags.map((x) => x.count)).toEqual(a.bags.map((x) => x.count));
		expect(b.readyMix.volume.cubicYards).toBeCloseTo(a.readyMix.volume.cubicYards, 9);
		expect(b.forms.stakes.count).toBe(a.forms.stakes.count);
		expect(b.forms.buy.map((x) => x.count)).toEqual(a.forms.buy.map((x) => x.count));
		expect(b.joints.totalLength.meters).toBeCloseTo(a.joints.totalLength.meters, 9);
	});

	it('gives the same elevations, strength and cautions', () => {
		expect(b.elevations.stakes.map((s) => s.belowLevelLine.millimeters)).toEqual(
			a.elevations.stakes.map((s) => expect.closeTo(s.belowLevelLine.millimeters, 6))
		);
		expect(b.strength.map((s) => s.percent)).toEqual(a.strength.map((s) => expect.closeTo(s.percent, 9)));
		expect(b.mixing.sections[0].totalMinutes).toBeCloseTo(a.mixing.sections[0].totalMinutes, 9);
		expect(b.weather.pours[0].evaporation.kgPerSquareMeterHour).toBeCloseTo(a.weather.pours[0].evaporation.kgPerSquareMeterHour, 9);
		expect(b.cautions.map((c) => c.id)).toEqual(a.cautions.map((c) => c.id));
	});
});

describe('bad input', () => {
	it('throws PlanInputError with paths, or returns them from estimate', () => {
		expect(() => computePlan({ units: 'imperial', sections: [] })).toThrow(PlanInputError);
		const e = estimate({ units: 'imperial', sections: [{ outline: rect(0, 0, 10, 10) }], fill: { volume: 1, largestPiece: 3 } });
		expect(e.ok).toBe(false);
		expect(!e.ok && e.errors[0].path).toBe('fill'); // found by the engine, not the schema
	});
});
