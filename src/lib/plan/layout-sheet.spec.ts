import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import { layoutSheet, tapeLength } from './layout-sheet';
import { rect } from './test-plans';

describe('tapeLength', () => {
	it('reads feet and inches to the sixteenth, and metres to the millimetre', () => {
		expect(tapeLength({ feet: 4, meters: 0 }, 'imperial')).toBe('4 ft 0 in');
		expect(tapeLength({ feet: 0.5, meters: 0 }, 'imperial')).toBe('6 in');
		expect(tapeLength({ feet: 1 + 1 / 12 + 1 / 192, meters: 0 }, 'imperial')).toBe('1 ft 1 1/16 in');
		expect(tapeLength({ feet: 2 + 4 / 192, meters: 0 }, 'imperial')).toBe('2 ft 1/4 in');
		expect(tapeLength({ feet: 0, meters: 1.2346 }, 'metric')).toBe('1.235 m');
		expect(tapeLength({ feet: 0, meters: 5 }, 'metric')).toBe('5.000 m');
	});
});

describe('layout sheet', () => {
	it('gives the diagonals of a 14 × 10 ft slab by Pythagoras: 17 ft 2 7/16 in', () => {
		const sheet = layoutSheet(computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 14, 10) }] }));
		// Pythagoras: √(14² + 10²) = √296 = 17.2047 ft = 17 ft 2.456 in → 2 7/16 in to the sixteenth.
		const [d] = sheet.diagonals;
		expect(tapeLength(d.first.length, 'imperial')).toBe('17 ft 2 7/16 in');
		expect(tapeLength(d.second.length, 'imperial')).toBe('17 ft 2 7/16 in');
		expect([d.first.from, d.first.to, d.second.from, d.second.to]).toEqual(['A', 'C', 'B', 'D']);
		expect(d.square).toBe(true);
	});

	it('gives the diagonals of a 4 × 3 m slab by Pythagoras: 5.000 m', () => {
		const sheet = layoutSheet(computePlan({ units: 'metric', sections: [{ outline: rect(0, 0, 4, 3) }] }));
		expect(tapeLength(sheet.diagonals[0].first.length, 'metric')).toBe('5.000 m'); // Pythagoras: √(4² + 3²) = 5
	});

	it('checks the first corner with 6-8-10 ft when both edges are long enough, 3-4-5 m in metric', () => {
		const imp = layoutSheet(computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 14, 10) }] }));
		expect(imp.start.corner).toBe('A'); // the house edge A–B starts at A
		// Pythagoras: 6² + 8² = 10²; the 8 runs along the longer edge A–B (14 ft).
		expect(imp.squareCheck).toMatchObject({ corner: 'A', edges: ['A–B', 'D–A'], ratio: '6-8-10 ft' });
		expect(imp.squareCheck!.legA.feet).toBeCloseTo(8, 9);
		expect(imp.squareCheck!.legB.feet).toBeCloseTo(6, 9);
		expect(imp.squareCheck!.diagonal.feet).toBeCloseTo(10, 9);
		const met = layoutSheet(computePlan({ units: 'metric', sections: [{ outline: rect(0, 0, 4, 3) }] }));
		expect(met.squareCheck).toMatchObject({ ratio: '3-4-5 m' });
		expect(met.squareCheck!.diagonal.meters).toBeCloseTo(5, 9); // 3² + 4² = 5²
		const small = layoutSheet(computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 5, 4) }] }));
		expect(small.squareCheck).toMatchObject({ ratio: '3-4-5 ft' }); // 8 ft does not fit on a 5 ft edge
	});

	it('does not call a corner square when it is not, and gives its check by the law of cosines', () => {
		// A parallelogram leaning 2 ft over 8 ft: the corner at A is atan(8/2) ≈ 76°.
		const sheet = layoutSheet(
			computePlan({
				units: 'imperial',
				sections: [
					{
						outline: [
							[0, 0],
							[12, 0],
							[14, 8],
							[2, 8]
						]
					}
				]
			})
		);
		const c = sheet.squareCheck!;
		expect(c.ratio).toBeNull();
		expect(c.angle).toBeCloseTo((Math.atan2(8, 2) * 180) / Math.PI, 6); // angle between +x and (2, 8)
		// Law of cosines with legs 8 (along A–B) and 6 (along D–A): c² = 64 + 36 − 96·cos A, cos A = 2/√68.
		expect(c.diagonal.feet).toBeCloseTo(Math.sqrt(100 - 96 * (2 / Math.sqrt(68))), 9);
		expect(sheet.diagonals[0].square).toBe(false);
	});

	it('measures each stake along its board from the corner where the board starts', () => {
		const r = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 12, 8) }], houseEdge: null, forms: { stakeSpacing: 4 } });
		const sheet = layoutSheet(r);
		// Edge A–B is 12 ft: one 16 ft board (12 ft + 1½ in lap), stakes every 4 ft (common practice 3–4 ft).
		const onR1 = sheet.stakes.filter((s) => s.board === 'R1');
		expect(onR1.map((s) => [s.from, s.along, tapeLength(s.distance, 'imperial')])).toEqual([
			['A', 'A–B', '0 in'],
			['A', 'A–B', '4 ft 0 in'],
			['A', 'A–B', '8 ft 0 in'],
			['A', 'A–B', '12 ft 0 in']
		]);
		expect(sheet.boards[0]).toMatchObject({ id: 'R1', edge: 'A–B', kind: 'outer' });
		// Ids and order follow the stake-mark table.
		expect(sheet.stakes.map((s) => s.id)).toEqual(r.elevations.stakes.map((s) => s.id));
	});

	it('prefixes corners with the section number when the plan has several pours', () => {
		const r = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 10, 10) }, { outline: rect(10, 0, 10, 10) }] });
		const sheet = layoutSheet(r);
		expect(sheet.corners.map((c) => c.label)).toEqual(['1A', '1B', '1C', '1D', '2A', '2B', '2C', '2D']);
		expect(sheet.boards.some((b) => b.kind === 'bulkhead')).toBe(true);
	});
});
