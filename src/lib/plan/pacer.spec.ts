import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import { workingMinutes } from './mixing';
import { pace, pacerPours, type PacerPour } from './pacer';
import { rect } from './test-plans';

// Working time: the engine's workingMinutes — the given time at 70 °F (90 min default), halving
// every 20 °F warmer, held between ¼× and 2× (mixing.ts: common practice, 1½–2 h at 70 °F, about
// half at 90 °F; no published source). The pacer takes it from the plan, not from its own formula.

/** A 10 × 10 ft pad, 4 in, two people mixing by hand, at a given air temperature (°F). */
function padAt(tempF: number) {
	return computePlan({
		units: 'imperial',
		sections: [{ outline: rect(0, 0, 10, 10) }],
		houseEdge: null,
		crew: { people: 2, method: 'hand' },
		conditions: { airTemp: tempF, humidity: 50, wind: 5, pourDate: '2027-05-10' }
	});
}

const T0 = Date.UTC(2027, 4, 10, 8, 0, 0);
const at = (min: number) => T0 + min * 60_000;
/** Batch times every `gap` minutes from the first batch at minute 0. */
const every = (gap: number, count: number) => Array.from({ length: count }, (_, i) => at(i * gap));

describe('pacer at 70 °F and at 90 °F', () => {
	const warm = pacerPours(padAt(70))[0];
	const hot = pacerPours(padAt(90))[0];

	it('takes the working time and bags from the plan', () => {
		const r = padAt(70);
		expect(warm.bags).toBe(r.mixing.sections[0].bags);
		expect(warm.workingMinutes).toBeCloseTo(workingMinutes(90, ((70 - 32) * 5) / 9), 6); // 90 min
		expect(hot.workingMinutes).toBeCloseTo(workingMinutes(90, ((90 - 32) * 5) / 9), 6); // 45 min
		expect(hot.workingMinutes).toBeCloseTo(warm.workingMinutes / 2, 6);
		expect(warm.bagsPerBatch).toBe(1); // by hand, one bag at a time
		expect(warm.finishing.map((f) => f.id)).toEqual(['screed', 'bleed', 'edge', 'tool', 'broom']);
		// Finishing windows shrink with the same factor as the working time.
		expect(hot.finishing.find((f) => f.id === 'bleed')!.window!.to).toBe(60);
		expect(warm.finishing.find((f) => f.id === 'bleed')!.window!.to).toBe(120);
	});

	function scenario(p: PacerPour, label: string) {
		const placeBy = p.workingMinutes - p.finishMinutes;
		const even = placeBy / p.bags; // minutes a bag at the even pace

		it(`${label}: ahead when bags go in faster than the even pace`, () => {
			const gap = even / 2;
			const s = pace(p, { startedAt: at(-5), batches: every(gap, 4) }, at(3 * gap));
			expect(s.status).toBe('placing');
			expect(s.bagsDone).toBe(4);
			expect(s.bagsLeft).toBe(p.bags - 4);
			expect(s.aheadBy!).toBeCloseTo(4 * even - 3 * gap, 6);
			expect(s.aheadBy!).toBeGreaterThan(0);
			expect(s.minutesPerBag).toBeCloseTo(gap, 6);
			expect(s.canFinish).toBe(true);
		});

		it(`${label}: behind, yet able to finish, at a little under the even pace`, () => {
			// Two bags in, the second one 1.2 even-minutes after the first; then now = just after.
			const s = pace(p, { startedAt: at(0), batches: [at(0), at(even * 0.9)] }, at(even * 2.5));
			expect(s.aheadBy!).toBeCloseTo(2 * even - 2.5 * even, 6);
			expect(s.aheadBy!).toBeLessThan(0);
			expect(s.projectedEnd!).toBeCloseTo(2.5 * even + (p.bags - 2) * 0.9 * even, 6);
			expect(s.canFinish).toBe(s.projectedEnd! <= placeBy);
			expect(s.canFinish).toBe(true);
		});

		it(`${label}: cannot finish at twice the even time a bag, and says how many still fit`, () => {
			const gap = even * 2;
			const s = pace(p, { startedAt: at(0), batches: every(gap, 3) }, at(2 * gap));
			expect(s.canFinish).toBe(false);
			// Room left: bags·even − 4·even; a bag takes 2·even: ⌊(bags − 4) / 2⌋ more fit.
			expect(s.bagsThatFit).toBe(Math.floor((p.bags - 4) / 2));
			expect(s.bagsThatFit).toBeLessThan(s.bagsLeft);
			expect(p.fallback.kind).toBe('bulkhead');
		});

		it(`${label}: past the working time with bags left nothing more fits`, () => {
			const s = pace(p, { startedAt: at(0), batches: [at(0)] }, at(placeBy + 1));
			expect(s.canFinish).toBe(false);
			expect(s.bagsThatFit).toBe(0);
		});
	}
	scenario(warm, '70 °F');
	scenario(hot, '90 °F');

	it('the same batches at the same times are on pace at 70 °F and cannot finish at 90 °F', () => {
		const gap = (warm.workingMinutes - warm.finishMinutes) / warm.bags; // the even pace at 70 °F
		const tally = { startedAt: at(0), batches: every(gap, 3) };
		expect(pace(warm, tally, at(2 * gap)).canFinish).toBe(true);
		expect(pace(hot, tally, at(2 * gap)).canFinish).toBe(false);
	});

	it('before any batch: not started, then started; done when every bag is in', () => {
		expect(pace(warm, { batches: [] }, at(0)).status).toBe('not-started');
		expect(pace(warm, { startedAt: at(0), batches: [] }, at(0)).status).toBe('started');
		const all = every(1, warm.batches);
		const s = pace(warm, { startedAt: at(0), batches: all }, at(warm.batches + 5));
		expect(s.status).toBe('placed');
		expect(s.bagsLeft).toBe(0);
		expect(s.placedAt).toBe(all[all.length - 1]);
		// A batch logged after "now" (a clock step back) is not counted.
		expect(pace(warm, { startedAt: at(0), batches: [at(0), at(10)] }, at(5)).batches).toBe(1);
	});
});

describe('fallback of a split section', () => {
	it('is the cold-joint line when the plan split the section', () => {
		// 12 × 10 ft, three people with a drum, 120 min working time: 74 bags, 30 a pour (as index.spec).
		const r = computePlan({
			units: 'imperial',
			sections: [{ outline: rect(0, 0, 12, 10) }],
			crew: { people: 3, method: 'drum', workingMinutes: 120 },
			conditions: { airTemp: 70 }
		});
		const pours = pacerPours(r);
		expect(r.mixing.sections[0].split?.coldJoints.length).toBeGreaterThan(0);
		expect(pours.length).toBe(r.mixing.sections[0].split!.parts);
		expect(pours[0].fallback.kind).toBe('cold-joint');
		expect(pours[1].name).toMatch(/part 2/);
		expect(pours.reduce((a, p) => a + p.bags, 0)).toBe(r.mixing.sections[0].bags);
	});
});
