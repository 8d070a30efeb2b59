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
		const boards = cutBoards([{ run: 'a', length: 3 }, { run: 'b', length: 7 }, { run: 'c', length: 5 }], [8, 12], 0);
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

	it('counts boards, stakes and screws for a rectangle against the house', () => {
		const { m, layout } = modelOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }] });
		const { forms } = computeForms(m, layout);
		// Formed runs 12, 20, 12 ft (the house edge takes an isolation strip). The 20 ft run plus a
		// 1½ in corner lap is 20.125 ft: two 10.0625 pieces with a splice stake between.
		// Stakes: 5 + 9 + 5 − 2 shared corners = 17 (common practice: every 3 ft, corners, splices).
		expect(forms.stakes.count).toBe(17);
		// Fixings: 5 + (9 + 1 at the splice) + 5 = 20; 2 screws each (from memory).
		expect(forms.screws).toBe(40);
		// 12.125 ft pieces need 16s; the 10.0625 pieces need 12s.
		expect(forms.buy.map((b) => [Math.round(b.stock.feet), b.count])).toEqual([[12, 2], [16, 2]]);
		expect(forms.isolationStrip.feet).toBeCloseTo(20, 9);
		expect(forms.formLength.feet).toBeCloseTo(44, 9); // 12 + 20 + 12
	});

	it('adds a bulkhead at a cold joint', () => {
		const { m, layout } = modelOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 10, 12) }, { outline: rect(10, 0, 10, 12) }] });
		const { forms } = computeForms(m, layout);
		const bulkheads = forms.runs.filter((r) => r.kind === 'bulkhead');
		expect(bulkheads).toHaveLength(1);
		expect(bulkheads[0].length.feet).toBeCloseTo(12, 9);
	});
});
