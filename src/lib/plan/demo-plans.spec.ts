// The demo plans the app ships with: every output item present and sane.

import { describe, expect, it } from 'vitest';
import demo from '../../../fixtures/demo-plans.json';
import { computePlan, type PlanInput, type PlanResult } from './index';

const plans = demo.plans.map((p) => ({ ...p, result: computePlan(p.input as PlanInput) }));
const byId = (id: string) => plans.find((p) => p.id === id)!.result;
const ids = (r: PlanResult) => r.cautions.map((c) => c.id);

describe.each(plans)('$id', ({ input, result: r }) => {
	const vertices = input.sections.reduce((n, s) => n + s.outline.length, 0);

	it('measures area and volume', () => {
		expect(r.area.squareFeet).toBeGreaterThan(0);
		expect(r.area.sections).toHaveLength(input.sections.length);
		expect(r.volume.net.cubicMeters).toBeGreaterThan(0);
		expect(r.volume.order.cubicMeters).toBeGreaterThanOrEqual(r.volume.net.cubicMeters);
		expect(r.volume.order.cubicYards).toBeCloseTo(r.volume.order.cubicFeet / 27, 9); // 1 yd³ = 27 ft³
	});

	it('lists forms, stakes and elevations', () => {
		expect(r.forms.buy.length).toBeGreaterThan(0);
		expect(r.forms.stakes.count).toBeGreaterThan(3);
		expect(r.elevations.vertices).toHaveLength(vertices);
	});

	it('prices bags and ready-mix', () => {
		expect(r.bags.length).toBe(input.bags.offered.length);
		for (const b of r.bags) expect(b.count * b.yield.cubicMeters).toBeGreaterThanOrEqual(r.volume.order.cubicMeters - 1e-9);
		expect(r.readyMix.volume.cubicMeters).toBeCloseTo(r.volume.order.cubicMeters, 9);
		expect(r.cost.cheaper).not.toBeNull();
	});

	it('plans mixing, joints, strength and the schedule', () => {
		expect(r.mixing.sections).toHaveLength(input.sections.length);
		for (const s of r.mixing.sections) expect(s.fits || s.split !== undefined).toBe(true);
		expect(r.joints.maxSpacing.meters).toBeGreaterThan(0);
		expect(r.joints.sections).toHaveLength(input.sections.length);
		expect(r.strength).toHaveLength(28);
		expect(r.strength.every((d, i) => i === 0 || d.percent > r.strength[i - 1].percent)).toBe(true);
		expect(r.milestones.every((m) => m.day !== null)).toBe(true);
		expect(r.schedule.pourDays.length).toBeGreaterThanOrEqual(input.sections.length);
		expect(r.schedule.pourDays.reduce((a, p) => a + p.bags, 0)).toBe(r.bags.find((b) => b.planned)!.count); // bought = poured
	});

	it('lists materials and cautions', () => {
		expect(r.materials.items.length).toBeGreaterThan(5);
		expect(r.materials.tools.length).toBeGreaterThan(5);
		expect(r.cautions[0].id).toBe('local-codes');
		expect(new Set(ids(r)).size).toBe(r.cautions.length);
	});
});

describe('what each demo shows', () => {
	it('the back patio is cheaper as a short load of ready-mix than as bags', () => {
		const r = byId('lind-back-patio');
		// 14 × 12 ft × 4 in = 56 ft³ + 8 % = 60.48 ft³ = 2.24 yd³ → 2.25 yd³ at the 0.25 increment,
		// under the 3 yd³ minimum: 2.25 × $185 + $75 = $491.25
		expect(r.volume.order.cubicFeet).toBeCloseTo(60.48, 9);
		expect(r.readyMix.order).toBeCloseTo(2.25, 12);
		expect(r.readyMix.cost).toBeCloseTo(491.25, 9);
		// ¼ in/ft over the 12 ft from the house: the far stakes sit 3 in below the level line
		expect(Math.max(...r.elevations.stakes.map((s) => s.belowLevelLine.inches))).toBeCloseTo(3, 9);
		expect(r.readyMix.shortLoad).toBe(true);
		expect(r.cost.cheaper).toBe('readyMix');
		expect(r.mixing.readyMixSuggested).toBe(true);
		expect(ids(r)).toContain('silica-saw');
	});

	it('the corner patio drains both walls and warns about oil and point loads', () => {
		const r = byId('wren-corner-patio');
		expect(r.elevations.houseEdges.every((h) => h.meetsIrc)).toBe(true); // IRC R401.3
		expect(ids(r)).toEqual(expect.arrayContaining(['form-release-oil', 'unreinforced-loads']));
		expect(r.cautions.find((c) => c.id === 'unreinforced-loads')!.severity).toBe('danger');
		expect(r.volume.thickenedEdges.cubicFeet).toBeGreaterThan(0);
	});

	it('the shed pad pours in two halves a few cold days apart', () => {
		const r = byId('castell-shed-pad');
		expect(r.geometry.coldJoints).toHaveLength(1);
		expect(r.schedule.pourDays[1].day - r.schedule.pourDays[0].day).toBeGreaterThan(1); // cold: the bulkhead waits
		expect(ids(r)).toEqual(expect.arrayContaining(['cold-weather', 'fill-near-surface']));
		expect(r.forms.fit).toBe('deep'); // 2x6 = 139.7 mm on 100 mm, DOC PS 20
		expect(r.mixing.fits).toBe(true);
	});
});
