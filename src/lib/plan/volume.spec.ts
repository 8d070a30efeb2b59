import { describe, expect, it } from 'vitest';
import { PlanInputError } from './geometry';
import { ELL, modelOf, rect } from './test-plans';
import { computeVolume, interiorAngle, thickenedEdges, trenchArea } from './volume';

const volumeOf = (input: Parameters<typeof modelOf>[0]) => {
	const { m, layout } = modelOf(input);
	return computeVolume(m, layout, thickenedEdges(m, layout));
};

describe('slab volume', () => {
	it('works out a 20 × 12 ft rectangle at 4 in', () => {
		const v = volumeOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], wastePercent: 10 });
		expect(v.slab.cubicFeet).toBeCloseTo(80, 9); // 240 ft² × 4/12 ft
		expect(v.slab.cubicYards).toBeCloseTo(2.96296, 5); // 80 / 27 (1 yd³ = 27 ft³)
		expect(v.slab.cubicMeters).toBeCloseTo(2.265348, 6); // 80 × 0.3048³
		expect(v.waste.cubicFeet).toBeCloseTo(8, 9); // 10 % waste, common practice 5–10 %
		expect(v.order.cubicFeet).toBeCloseTo(88, 9); // 80 + 8
	});

	it('works out the L with a notch', () => {
		const v = volumeOf({ units: 'imperial', sections: [{ outline: ELL }], thickness: 6 });
		expect(v.net.cubicFeet).toBeCloseTo(192, 9); // (432 − 48) ft² × 0.5 ft
	});

	it('adds base course, compacted and loose', () => {
		const v = volumeOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], base: { depth: 4, bulking: 1.25 } });
		expect(v.base.compacted.cubicFeet).toBeCloseTo(80, 9); // 240 ft² × 4 in, IRC R506.2.2
		expect(v.base.loose.cubicFeet).toBeCloseTo(100, 9); // × 1.25 bulking, common practice 1.15–1.30
	});
});

describe('thickened edges', () => {
	it('mitres the trench at the corners of a rectangle', () => {
		const v = volumeOf({
			units: 'imperial',
			houseEdge: null,
			sections: [{ outline: rect(0, 0, 20, 12) }],
			thickenedEdge: { edges: 'free', width: 8 }
		});
		// Ring area P·w − 4·w² = 64 × ⅔ − 4 × 4/9 = 40.889 ft²; × ⅓ ft extra depth (= thickness, common practice)
		expect(v.trenchArea.squareFeet).toBeCloseTo(40.8889, 4);
		expect(v.thickenedEdges.cubicFeet).toBeCloseTo(13.6296, 4);
	});

	it('leaves the house edge alone and squares its ends', () => {
		const v = volumeOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], thickenedEdge: { edges: 'free', width: 8 } });
		// U-shaped trench: 20 × ⅔ + 2 × (12 − ⅔) × ⅔ = 13.333 + 15.111 = 28.444 ft²
		expect(v.trenchArea.squareFeet).toBeCloseTo(28.4444, 4);
	});

	it('fills the corner at a re-entrant vertex', () => {
		const { m, layout } = modelOf({ units: 'imperial', houseEdge: null, sections: [{ outline: ELL }] });
		expect(interiorAngle(layout.sections[0], 5)).toBeCloseTo((3 * Math.PI) / 2, 12); // the notch corner
		// Ring of width w inside the L: 432 − (24 − 2w)(18 − 2w) = 84w − 4w²; w = ⅔ ft → 54.222 ft²
		const a = trenchArea(layout.sections[0], [true, true, true, true, true, true], 8 * 0.0254);
		expect(a / 0.3048 ** 2).toBeCloseTo(54.2222, 4);
		expect(m.thickened.width).toBeCloseTo(0.2032, 12); // 8 in default, from memory
	});

	it('takes chunk fill out of the trench', () => {
		const v = volumeOf({
			units: 'imperial',
			houseEdge: null,
			sections: [{ outline: rect(0, 0, 20, 12) }],
			thickenedEdge: { edges: 'free', width: 8 },
			fill: { shareOfTrench: 0.25, largestPiece: 3 }
		});
		expect(v.fill.cubicFeet).toBeCloseTo(3.4074, 4); // 13.6296 × 0.25
		expect(v.net.cubicFeet).toBeCloseTo(90.2222, 4); // 80 + 13.6296 − 3.4074
	});

	it('refuses fill when there is no trench', () => {
		expect(() => volumeOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], fill: { volume: 1, largestPiece: 3 } })).toThrow(PlanInputError);
	});
});
