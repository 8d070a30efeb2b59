import { describe, expect, it } from 'vitest';
import type { SectionGrid } from './joints';
import { crewTime, cutsOnLines, splitSection, workingMinutes } from './mixing';
import type { BagOffer, Model } from './model';
import type { Frame } from './polygon';

const bag80: BagOffer = { size: 80, kg: 80 * 0.45359237, yieldM3: 0.6 * 0.3048 ** 3 };
const crew = (over: Partial<Model['crew']>): Model['crew'] => ({
	people: 2,
	method: 'hand',
	handMinutesPerKg: 8 / bag80.kg, // 8 min an 80 lb bag, common practice 5–8
	drumMinutesPerBatch: 6, // from memory
	drumBatchKg: 2 * bag80.kg, // two 80 lb bags, common practice
	placeMinutesPer80lb: 2, // from memory
	workingMinutesAt21C: 90, // common practice, 1½–2 h at 70 °F
	finishMinutes: 30,
	payloadKg: 453.6,
	...over
});
const identity: Frame = { origin: [0, 0], t: [1, 0], n: [0, 1] };

describe('working time', () => {
	it('halves from 70 °F to 90 °F', () => {
		expect(workingMinutes(90, ((70 - 32) * 5) / 9)).toBeCloseTo(90, 9); // common practice, 1½ h at 70 °F
		expect(workingMinutes(90, ((90 - 32) * 5) / 9)).toBeCloseTo(45, 9); // common practice, about half at 90 °F
		expect(workingMinutes(90, -5)).toBeCloseTo(180, 9); // held at 2× in the cold (engine choice)
	});
});

describe('crew time', () => {
	it('splits hand mixing across the people', () => {
		const t = crewTime(10, bag80, crew({}));
		expect(t.totalMinutes).toBeCloseTo(50, 9); // 10 × (8 + 2) / 2 people
	});

	it('is mixer-bound with a drum and a helper', () => {
		const t = crewTime(10, bag80, crew({ method: 'drum', people: 3 }));
		expect(t.batches).toBe(5); // 10 bags, 2 a batch (common practice)
		expect(t.totalMinutes).toBeCloseTo(30, 9); // max(5 × 6, 10 × 2 / 2)
	});

	it('places a small bag in the time its share of concrete takes', () => {
		// Two 40 lb bags hold what one 80 lb bag does (bag labels: 0.30 and 0.60 ft³), so 20 of them
		// mix and place in the time 10 of the 80s take: 20 × (4 + 1) / 2 people (common practice, no
		// published source: mixing and placing time go with the mass handled).
		const bag40: BagOffer = { size: 40, kg: 40 * 0.45359237, yieldM3: 0.3 * 0.3048 ** 3 };
		expect(crewTime(20, bag40, crew({})).totalMinutes).toBeCloseTo(50, 9);
		expect(crewTime(20, bag40, crew({})).placeMinutes).toBeCloseTo(10, 9); // 20 × 1 min / 2 people
	});

	it('adds the placing when one person runs the drum alone', () => {
		expect(crewTime(10, bag80, crew({ method: 'drum', people: 1 })).totalMinutes).toBeCloseTo(50, 9); // 30 + 20
	});
});

describe('splitting a section', () => {
	const poly: [number, number][] = [
		[0, 0],
		[24, 0],
		[24, 12],
		[0, 12]
	];
	// Yield 1 per bag and 30 units of concrete: a part holding a share of the 288 area needs ⌈30 × share⌉ bags.

	it('puts every cold joint on a control-joint line, farthest first', () => {
		const grid: SectionGrid = { poly, us: [0, 8, 16, 24], ws: [0, 12] };
		const s = splitSection(grid, 30, 1, 12, identity, 'metric', 1e-9);
		expect(s.parts).toBe(3); // 10 bags a third; two thirds (20) would pass 12
		expect(s.coldJoints.map((j) => j.from[0])).toEqual([8, 16]);
		expect(s.bagsPerPart).toEqual([10, 10, 10]);
		const wide = splitSection(grid, 30, 1, 20, identity, 'metric', 1e-9);
		expect(wide.coldJoints.map((j) => j.from[0])).toEqual([16]); // 20 then 10 bags
		expect(wide.bagsPerPart).toEqual([20, 10]);
	});

	it('lays the joints closer when no line falls where a cut must go', () => {
		// Lines at 12 only: half the slab is 15 bags > 12. The joints are re-laid at most
		// 24 × 12 × 0.9 / 30 = 8.64 apart (strips of ≤ 12 bags with 10 % to spare, an engine choice).
		const asked: number[] = [];
		const relay = (max: number): SectionGrid => {
			asked.push(max);
			return { poly, us: [0, 8, 16, 24], ws: [0, 6, 12] };
		};
		const s = splitSection({ poly, us: [0, 12, 24], ws: [0, 12] }, 30, 1, 12, identity, 'metric', 1e-9, relay);
		expect(asked).toEqual([expect.closeTo(8.64, 9)]);
		expect(s.relaid).toBe(true);
		expect(s.coldJoints.map((j) => j.from[0])).toEqual([8, 16]);
		expect(s.bagsPerPart).toEqual([10, 10, 10]);
	});

	it('draws no cold joints for a split nobody should attempt', () => {
		const grid: SectionGrid = { poly, us: [0, 12, 24], ws: [0, 12] };
		const s = splitSection(grid, 80, 1, 10, identity, 'metric', 1e-9);
		expect(s.parts).toBe(8); // 80 bags at 10 a pour, past 3 pours (engine choice)
		expect(s.coldJoints).toEqual([]);
		expect(s.bagsPerPart).toEqual([]); // not laid out: the list would grow with the bags
		expect(s.note).toMatch(/8 separate pours of about 10 bags/);
		expect(s.note).toMatch(/ready-mix/);
	});

	it('picks cuts greedily on lines', () => {
		// Lines every 4 in a 24 wide strip of area 288; 12 bags a part at most of 30.
		const lines = [4, 8, 12, 16, 20];
		const bagsFor = (a: number) => Math.ceil((a / 288) * 30 - 1e-9);
		// 4 → 5 bags, 8 → 10, 12 → 15: cut at 8; from 8, 16 → 10: cut at 16; the last 8 → 10 bags.
		expect(cutsOnLines(poly, lines, bagsFor, 12)).toEqual([8, 16]);
		expect(cutsOnLines(poly, [12], bagsFor, 12)).toBeNull(); // 15 bags in either half
	});
});
