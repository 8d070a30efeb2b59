// Properties that must hold for any slab: volume scales with thickness and area, moving or turning
// the outline changes nothing, splitting a rectangle into two pours keeps the total, and the answer
// to any plan inside the schema's limits stays within its stated size (time is the bench's job).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planInside } from './bounds.arbitraries';
import { toRoundedJson } from './format';
import { computePlan, estimate, type PlanInput, type PlanResult } from './index';
import { MAX_PRACTICAL_PARTS } from './mixing';
import { answerBytesBound, LIMITS } from './schema';
import { ELL, largestPlan, rect } from './test-plans';

const RUNS = { numRuns: 40 };
// Up to 27 ft a side, so twice that stays inside the 3000 ft² limit.
const size = fc.double({ min: 4, max: 27, noNaN: true });
const plan = (outline: [number, number][], over: Partial<PlanInput> = {}): PlanInput => ({ units: 'imperial', sections: [{ outline }], ...over }) as PlanInput;
const close = (a: number, b: number, rel = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(a)));

describe('volume is linear in thickness and area', () => {
	it('doubles with the thickness', () => {
		fc.assert(
			fc.property(size, size, fc.double({ min: 3, max: 6, noNaN: true }), (w, h, t) => {
				const one = computePlan(plan(rect(0, 0, w, h), { thickness: t }));
				const two = computePlan(plan(rect(0, 0, w, h), { thickness: 2 * t }));
				close(two.volume.net.cubicMeters, 2 * one.volume.net.cubicMeters);
			}),
			RUNS
		);
	});

	it('scales with the area', () => {
		fc.assert(
			fc.property(size, size, fc.double({ min: 0.5, max: 2, noNaN: true }), (w, h, k) => {
				const one = computePlan(plan(rect(0, 0, w, h)));
				const big = computePlan(plan(rect(0, 0, k * w, k * h)));
				close(big.area.squareMeters, k * k * one.area.squareMeters);
				close(big.volume.net.cubicMeters, k * k * one.volume.net.cubicMeters);
			}),
			RUNS
		);
	});
});

/** The numbers a person would act on, to compare two plans of the same slab. */
function quantities(r: PlanResult) {
	return {
		area: r.area.squareMeters,
		perimeter: r.area.perimeter.meters,
		order: r.volume.order.cubicMeters,
		trench: r.volume.thickenedEdges.cubicMeters,
		bags: r.bags.map((b) => b.count),
		readyMix: r.readyMix.order,
		stakes: r.forms.stakes.count,
		screws: r.forms.screws,
		boards: r.forms.buy.map((b) => [b.stock.meters, b.count]),
		formLength: r.forms.formLength.meters,
		panels: r.joints.sections.map((s) => s.panels),
		joints: r.joints.totalLength.meters,
		elevations: r.elevations.vertices.map((v) => v.elevation.millimeters),
		levelLine: r.elevations.stakes.map((s) => s.belowLevelLine.millimeters).sort((a, b) => a - b),
		minutes: r.mixing.sections.map((s) => s.totalMinutes),
		cautions: r.cautions.map((c) => c.id)
	};
}

function expectSame(a: ReturnType<typeof quantities>, b: ReturnType<typeof quantities>) {
	for (const key of Object.keys(a) as (keyof typeof a)[]) {
		const [x, y] = [JSON.stringify(a[key]), JSON.stringify(b[key])];
		if (x === y) continue;
		const flat = (v: unknown): unknown[] => (Array.isArray(v) ? v.flatMap(flat) : [v]);
		const [fx, fy] = [flat(a[key]), flat(b[key])];
		expect(fy.length, key).toBe(fx.length);
		fx.forEach((v, i) => (typeof v === 'number' ? close(fy[i] as number, v, 1e-7) : expect(fy[i], key).toBe(v)));
	}
}

describe('moving or turning the outline changes no quantity', () => {
	const shapes = fc.oneof(
		fc.tuple(size, size).map(([w, h]) => rect(0, 0, w, h)),
		fc.double({ min: 0.5, max: 1.5, noNaN: true }).map((k) => ELL.map(([x, y]): [number, number] => [x * k, y * k]))
	);
	const move = fc.record({
		angle: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
		dx: fc.double({ min: -200, max: 200, noNaN: true }),
		dy: fc.double({ min: -200, max: 200, noNaN: true })
	});

	it('holds for rectangles and Ls, with thickened edges and a cross fall', () => {
		fc.assert(
			fc.property(shapes, move, (outline, { angle, dx, dy }) => {
				const [c, s] = [Math.cos(angle), Math.sin(angle)];
				const moved = outline.map(([x, y]): [number, number] => [c * x - s * y + dx, s * x + c * y + dy]);
				const over: Partial<PlanInput> = {
					slope: { fall: { value: 2, unit: 'percent' }, crossFall: { value: 0.5, unit: 'percent' } },
					thickenedEdge: { edges: 'free' }
				};
				expectSame(quantities(computePlan(plan(outline, over))), quantities(computePlan(plan(moved, over))));
			}),
			RUNS
		);
	});
});

describe('splitting a rectangle into two sections', () => {
	it('keeps the area, outer perimeter and volume', () => {
		fc.assert(
			fc.property(size, size, fc.double({ min: 0.2, max: 0.8, noNaN: true }), (w, h, share) => {
				const x = w * share;
				const whole = computePlan(plan(rect(0, 0, w, h)));
				const split = computePlan({
					units: 'imperial',
					sections: [{ outline: rect(0, 0, x, h) }, { outline: rect(x, 0, w - x, h) }]
				});
				close(split.area.squareMeters, whole.area.squareMeters);
				close(split.area.perimeter.meters, whole.area.perimeter.meters);
				close(split.volume.net.cubicMeters, whole.volume.net.cubicMeters);
				close(split.volume.order.cubicMeters, whole.volume.order.cubicMeters);
				expect(split.geometry.coldJoints).toHaveLength(1);
			}),
			RUNS
		);
	});
});

describe('the answer stays within its stated bound for any plan inside the limits', () => {
	it('grows at most linearly with stakes, corners and sections, and stays under 1 MB', () => {
		fc.assert(
			fc.property(planInside, (input) => {
				const r = estimate(input);
				if (!r.ok) {
					// The generator does not work out bag counts: only the bag limit may refuse its plans.
					for (const e of r.errors) expect(e.message).toMatch(/bags; the limit is 10,000/);
					return;
				}
				const bytes = Buffer.byteLength(toRoundedJson(r.plan));
				const corners = r.plan.geometry.sections.reduce((s, x) => s + x.outline.length, 0);
				const stakes = r.plan.elevations.stakes.length;
				// The schema counts stakes along the outline (one per spacing plus corners). A section too
				// big to pour at once is cut into at most MAX_PRACTICAL_PARTS pours, and a straight cut
				// through a polygon is at most half its perimeter, so the bulkheads add at most one more
				// outline's worth. // common practice, no published source (stake spacing); geometry
				expect(stakes).toBeLessThanOrEqual(LIMITS.stakes + corners + (MAX_PRACTICAL_PARTS - 1) * (LIMITS.stakes / 2 + corners));
				expect(bytes).toBeLessThanOrEqual(answerBytesBound(stakes, corners, r.plan.geometry.sections.length));
				expect(bytes).toBeLessThan(1_000_000);
			}),
			{ numRuns: 80 }
		);
		// Large plans take a while on a loaded machine; time itself is the bench's concern.
	}, 60_000);

	it('counts the bulkheads of split pours within the bound', () => {
		// Eight 15 × 14 ft sections, 2 in thick, stakes every foot, 10 lb bags for one person: each
		// section is poured in three parts, and the bulkhead stakes come on top of the outline's.
		const sections = Array.from({ length: 8 }, (_, i) => ({ outline: rect(15.034 * i, 0, 15.034, 14.001) }));
		const r = estimate({
			units: 'imperial',
			sections,
			houseEdge: null,
			thickness: 2,
			forms: { stakeSpacing: 1 },
			thickenedEdge: { edges: 'none' },
			bags: { offered: [{ size: 10 }] },
			crew: { method: 'hand', people: 1, workingMinutes: 123 },
			conditions: { airTemp: [32] }
		} as PlanInput);
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		expect(r.plan.mixing.sections.map((s) => s.split?.parts)).toEqual(Array(8).fill(3));
		const stakes = r.plan.elevations.stakes.length;
		expect(stakes).toBeGreaterThan(LIMITS.stakes); // the outline alone is 465 ft: the bulkheads add the rest
		expect(stakes).toBeLessThanOrEqual(LIMITS.stakes + 32 + (MAX_PRACTICAL_PARTS - 1) * (LIMITS.stakes / 2 + 32));
		expect(Buffer.byteLength(toRoundedJson(r.plan))).toBeLessThanOrEqual(answerBytesBound(stakes, 32, 8));
	});

	it('meets the bound at every limit at once', () => {
		// The largest plan: 3 sections of 100 corners, 600 stakes' worth of outline, the smallest bag.
		const r = estimate(largestPlan());
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		const bytes = Buffer.byteLength(toRoundedJson(r.plan));
		expect(bytes).toBeLessThanOrEqual(answerBytesBound(r.plan.elevations.stakes.length, 300, 3));
		expect(bytes).toBeLessThan(1_000_000);
	});

	it('does not grow with the bag count when a section would take thousands of pours', () => {
		// 40 × 50 ft of 10 lb bags (about 9,800) for one person with 10 min of working time and 7.5 min
		// to mix and place each bag (30 min per 80 lb each): a pour a bag.
		const r = estimate({
			units: 'imperial',
			sections: [{ outline: rect(0, 0, 50, 40) }],
			bags: { offered: [{ size: 10 }] },
			crew: { people: 1, method: 'hand', handMixMinutes: 30, placeMinutesPerBag: 30, workingMinutes: 10, finishMinutes: 0 }
		});
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		expect(r.plan.mixing.sections[0].split?.parts).toBeGreaterThan(9000);
		const bytes = Buffer.byteLength(toRoundedJson(r.plan));
		expect(bytes).toBeLessThanOrEqual(answerBytesBound(r.plan.elevations.stakes.length, 4, 1));
	});
});
