import { describe, expect, it } from 'vitest';
import { computePlan } from './index';
import { rect } from './test-plans';

describe('the slab block', () => {
	it('gives thickness, base and dig depths of a 4 in slab on 4 in of base', () => {
		const r = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], thickness: 4, base: { depth: 4 } });
		expect(r.slab.thickness.inches).toBeCloseTo(4, 9);
		expect(r.slab.base.inches).toBeCloseTo(4, 9); // IRC R506.2.2: 4 in of base where used
		expect(r.slab.digDepth.inches).toBeCloseTo(8, 9); // 4 in slab + 4 in base
		expect(r.slab.digDepth.millimeters).toBeCloseTo(203.2, 9); // 8 × 25.4 (NIST SP 811)
		expect(r.slab.thickenedDigDepth).toBeNull();
		expect(r.slab.trench).toBeNull();
		expect(r.slab.houseGap?.inches).toBeCloseTo(0.5, 9); // the input default
		// A 2x4 is 3½ in deep (DOC PS 20); its top, at finished height, stands the dig depth above the dug grade.
		expect(r.slab.board.depth.inches).toBeCloseTo(3.5, 9);
		expect(r.slab.board.aboveDugGrade.inches).toBeCloseTo(8, 9);
	});

	it('digs the thickened edges deeper by the trench depth and carries the typed trench and gap', () => {
		const r = computePlan({
			units: 'metric',
			sections: [{ outline: rect(0, 0, 6, 4) }],
			houseEdge: null,
			thickness: 100,
			base: { depth: 150 },
			thickenedEdge: { edges: 'free', width: 250, extraDepth: 120 }
		});
		expect(r.slab.digDepth.millimeters).toBeCloseTo(250, 9); // 100 + 150
		expect(r.slab.thickenedDigDepth?.millimeters).toBeCloseTo(220, 9); // 100 + 120: no base under the trench, as volume.ts lays it
		expect(r.volume.base.note).toMatch(/No base under the thickened edges/);
		expect(r.slab.trench).toMatchObject({ width: { millimeters: 250 }, depth: { millimeters: 120 } });
		expect(r.slab.houseGap).toBeNull(); // freestanding
		const gap = computePlan({ units: 'metric', sections: [{ outline: rect(0, 0, 6, 4) }], gapToHouse: 20 }).slab.houseGap;
		expect(gap?.millimeters).toBeCloseTo(20, 9);
	});

	it('states the finished surface as a plane: 2 % away from the house over 12 ft drops 2.88 in', () => {
		const r = computePlan({
			units: 'imperial',
			sections: [{ outline: rect(0, 0, 20, 12) }],
			slope: { fall: { value: 2, unit: 'percent' }, crossFall: { value: 0, unit: 'percent' } }
		});
		const { at, atHeight, down } = r.slab.surface;
		const heightFt = (p: [number, number]) => atHeight.inches / 12 - (down[0] * (p[0] - at[0]) + down[1] * (p[1] - at[1]));
		expect(heightFt([7, 0]) * 12).toBeCloseTo(0, 9); // along the house: the high edge
		expect(heightFt([7, 12]) * 12).toBeCloseTo(-2.88, 9); // 12 ft × 0.02 × 12 in/ft (IRC R401.3 2 %)
	});
});
