import { describe, expect, it } from 'vitest';
import { computeForms, cutBoards, formFit, runStakes, splitRun, type Run } from './lumber';
import { modelOf, rect } from './test-plans';

const IN = 0.0254;
const FT = 0.3048;

describe('board depth against slab thickness', () => {
	it('notes a 2x4 under a 4 in slab as shallow', () => {
		const f = formFit(3.5 * IN, 4 * IN); // 2x4 is 3½ in deep, DOC PS 20
		expect(f.fit).toBe('shallow');
		expect(f.difference.inches).toBeCloseTo(0.5, 12); // 4 − 3½
	});

	it('notes a 2x6 on a 100 mm slab as deep', () => {
		const f = formFit(5.5 * IN, 0.1); // 2x6 is 5½ in = 139.7 mm, DOC PS 20
		expect(f.fit).toBe('deep');
		expect(f.difference.millimeters).toBeCloseTo(39.7, 9); // 139.7 − 100
	});

	it('calls a 2x4 on a 3½ in slab flush', () => {
		expect(formFit(3.5 * IN, 3.5 * IN).fit).toBe('flush'); // DOC PS 20
	});
});

describe('cut list', () => {
	it('splits a run longer than the longest board into equal pieces', () => {
		expect(splitRun(20.125, 16)).toEqual([10.0625, 10.0625]);
		expect(splitRun(12, 16)).toEqual([12]);
	});

	it('packs pieces first-fit decreasing into stock boards', () => {
		// 7 opens an 8, 5 opens another 8, 3 goes in the second's offcut (no kerf here).
		const boards = cutBoards(
			[
				{ run: 'a', length: 3 },
				{ run: 'b', length: 7 },
				{ run: 'c', length: 5 }
			],
			[8, 12],
			0
		);
		expect(boards.map((b) => b.stock)).toEqual([8, 8]);
		expect(boards.map((b) => b.left)).toEqual([1, 0]);
	});
});

describe('stakes', () => {
	it('stakes a 12 ft run every 3 ft and at both ends', () => {
		const run: Run = { id: 'R1', kind: 'outer', section: 0, edge: 0, from: [0, 0], to: [12 * FT, 0], length: 12 * FT, formed: true };
		const s = runStakes(run, [], 3 * FT); // common practice, every 3–4 ft and at corners
		expect(s.map((p) => p.at[0] / FT)).toEqual([0, 3, 6, 9, 12].map((x) => expect.closeTo(x, 9)));
	});

	it('puts one stake at a shared corner wherever the corner falls against the 1 mm lookup cells', () => {
		// The same 20 × 12 ft pad moved so its corners land within float noise of a 1 mm cell border
		// (3.0005 m, 1.0005 m): the count must not change with where the pad sits.
		const count = (dx: number, dy: number) => {
			const { m, layout } = modelOf({ units: 'imperial', sections: [{ outline: rect(dx, dy, 20, 12) }] });
			return computeForms(m, layout).forms.stakes.count;
		};
		expect(count(3.0005 / FT, 1.0005 / FT)).toBe(count(0, 0));
		expect(count(-2.9995 / FT, 0.0005 / FT)).toBe(count(0, 0));
	});

	it('counts boards, stakes and screws for a rectangle against the house', () => {
		const { m, layout } = modelOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }] });
		const { forms } = computeForms(m, layout);
		// Formed runs 12, 20, 12 ft (the house edge takes an isolation strip). Two corners, each lapped by
		// one board's 1½ in (DOC PS 20): the 20 ft run takes one (20.125 ft needs two boards either way:
		// two 10.0625 pieces and a splice), the last 12 ft run the other; the first 12 ft run butts, so a
		// 12 ft board does.
		// Stakes: 5 + 9 + 5 − 2 shared corners = 17 (common practice: every 3 ft, corners, splices).
		expect(forms.stakes.count).toBe(17);
		// Fixings 5 + (9 + 1 at the splice) + 5 = 20 × 2 screws, 1 splice cleat × 4, 2 corners × 2 (from memory).
		expect(forms.cleats).toBe(1);
		expect(forms.corners).toBe(2);
		expect(forms.screws).toBe(20 * 2 + 4 + 2 * 2);
		// 12.125 → a 16 (its offcut takes the 0.6 m cleat); 12 → a 12; 10.0625 × 2 → two 12s.
		expect(forms.buy.map((b) => [Math.round(b.stock.feet), b.count])).toEqual([
			[12, 3],
			[16, 1]
		]);
		expect(forms.isolationStrip.feet).toBeCloseTo(20, 9);
		expect(forms.formLength.feet).toBeCloseTo(44, 9); // 12 + 20 + 12
	});

	it('moves a corner lap off a run that a stock board would just cover', () => {
		// A freestanding 16 × 10 ft pad: a 16 ft side plus 1½ in would need a splice, so both 10 ft sides
		// lap at both their ends (10.25 ft, a 12 ft board) and the 16 ft sides take whole 16 ft boards.
		const { m, layout } = modelOf({ units: 'imperial', houseEdge: null, sections: [{ outline: rect(0, 0, 16, 10) }] });
		const { forms } = computeForms(m, layout);
		expect(forms.cleats).toBe(0);
		expect(forms.corners).toBe(4);
		expect(forms.buy.map((b) => [Math.round(b.stock.feet), b.count])).toEqual([
			[12, 2],
			[16, 2]
		]);
		expect(forms.cutList.flatMap((c) => c.cuts.map((x) => x.length.feet)).sort((a, b) => a - b)).toEqual(
			[10.25, 10.25, 16, 16].map((x) => expect.closeTo(x, 9))
		);
	});

	it('adds a bulkhead at a cold joint', () => {
		const { m, layout } = modelOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 10, 12) }, { outline: rect(10, 0, 10, 12) }] });
		const { forms } = computeForms(m, layout);
		const bulkheads = forms.runs.filter((r) => r.kind === 'bulkhead');
		expect(bulkheads).toHaveLength(1);
		expect(bulkheads[0].length.feet).toBeCloseTo(12, 9);
	});
});
