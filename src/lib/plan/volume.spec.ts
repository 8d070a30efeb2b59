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

	it('adds base course, compacted and loose, past the forms', () => {
		const v = volumeOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], base: { depth: 4, bulking: 1.25, overhang: 6 } });
		// 240 ft² + 6 in past the 12 + 20 + 12 ft of forms (not along the house; corner squares left out)
		// = 262 ft² × 4 in (IRC R506.2.2; the overhang is common practice)
		expect(v.base.area.squareFeet).toBeCloseTo(262, 9);
		expect(v.base.compacted.cubicFeet).toBeCloseTo(87.3333, 4);
		expect(v.base.loose.cubicFeet).toBeCloseTo(109.1667, 4); // × 1.25 bulking, common practice 1.15–1.30
		// 87.333 / 27 yd³ × 1.4 short tons/yd³ (common practice 1.4–1.5) = 4.5284 short tons
		expect(v.base.weight.shortTons).toBeCloseTo(4.5284, 4);
	});

	it('digs the slab, its base and the strip past the forms, and counts the loads', () => {
		const v = volumeOf({ units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }], base: { depth: 4, overhang: 6 } });
		// (240 + 22) ft² × 4 in of slab depth + 87.333 ft³ of base = 174.667 ft³ = 6.4691 yd³
		expect(v.dig.volume.cubicFeet).toBeCloseTo(174.6667, 4);
		// × 1.35 short tons/yd³ (from memory) = 8.7333 t = 17 467 lb → ⌈17 467 / 1000 lb payload⌉ = 18 loads
		expect(v.dig.weight.shortTons).toBeCloseTo(8.7333, 4);
		expect(v.dig.loads).toBe(18);
	});

	it('lays no base under the thickened edges', () => {
		const v = volumeOf({ units: 'imperial', houseEdge: null, sections: [{ outline: rect(0, 0, 20, 12) }], thickenedEdge: { edges: 'free', width: 8 } });
		// 240 − 40.889 ft² of trench (every edge thickened, so no strip past the forms) = 199.111 ft² × 4 in
		// (common practice, no published source: the thickened edge bears on undisturbed soil)
		expect(v.base.area.squareFeet).toBeCloseTo(199.1111, 4);
		expect(v.base.compacted.cubicFeet).toBeCloseTo(66.3704, 4);
		expect(v.base.note).toMatch(/No base under the thickened edges/);
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

	it('takes half the profile, less the mitres, for a tapered edge', () => {
		const v = volumeOf({
			units: 'imperial',
			houseEdge: null,
			sections: [{ outline: rect(0, 0, 20, 12) }],
			thickenedEdge: { edges: 'free', width: 8, profile: 'tapered' }
		});
		// Triangle w·d/2 = ⅔ × ⅓ / 2 = 0.11111 ft² swept along its centroid line, w/3 in from the outside:
		// 64 − 8 × (⅔)/3 = 62.2222 ft → 6.9136 ft³ (Pappus), against 13.6296 ft³ rectangular.
		expect(v.thickenedEdges.cubicFeet).toBeCloseTo(6.9136, 4);
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
