import { describe, expect, it } from 'vitest';
import type { SectionGrid } from './joints';
import { NIOSH_LOAD_CONSTANT_KG, crewTime, cutsAt, splitSection, workingMinutes } from './mixing';
import type { BagOffer, Model } from './model';
import { areaLeftOf, type Frame } from './polygon';

const bag80: BagOffer = { size: 80, kg: 80 * 0.45359237, yieldM3: 0.6 * 0.3048 ** 3 };
const crew = (over: Partial<Model['crew']>): Model['crew'] => ({
	people: 2,
	method: 'hand',
	handMinutesPerKg: 8 / bag80.kg, // 8 min an 80 lb bag, common practice 5–8
	drumMinutesPerBatch: 6, // from memory
	drumBatchKg: 2 * bag80.kg, // two 80 lb bags, common practice
	placeMinutesPerBag: 2, // from memory
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

	it('adds the placing when one person runs the drum alone', () => {
		expect(crewTime(10, bag80, crew({ method: 'drum', people: 1 })).totalMinutes).toBeCloseTo(50, 9); // 30 + 20
	});
});

describe('the heaviest lift', () => {
	it('compares a bag with the NIOSH load constant', () => {
		expect(NIOSH_LOAD_CONSTANT_KG).toBe(23); // NIOSH Pub. 94-110, 23 kg (51 lb)
		expect(bag80.kg).toBeGreaterThan(NIOSH_LOAD_CONSTANT_KG); // 36.3 kg, NIOSH Pub. 94-110
	});
});

describe('splitting a section', () => {
	const poly: [number, number][] = [[0, 0], [24, 0], [24, 12], [0, 12]];

	it('cuts at equal areas', () => {
		const tri: [number, number][] = [[0, 0], [10, 0], [0, 10]];
		const [c] = cutsAt(tri, [0.5]);
		// Area left of c in the triangle: 50 − (10 − c)² / 2 = 25 → c = 10 − √50
		expect(c).toBeCloseTo(10 - Math.sqrt(50), 9);
		expect(areaLeftOf(tri, c)).toBeCloseTo(25, 9);
	});

	it('puts cold joints on control-joint lines when the parts still fit', () => {
		const grid: SectionGrid = { poly, us: [0, 8, 16, 24], ws: [0, 12] };
		const s = splitSection(grid, 30, 12, identity, 'metric', 1e-9);
		expect(s.parts).toBe(3); // 30 bags, 12 a part at most
		expect(s.coldJoints.map((j) => j.from[0])).toEqual([8, 16]);
		expect(s.bagsPerPart).toEqual([10, 10, 10]);
	});

	it('draws no cold joints for a split nobody should attempt', () => {
		const grid: SectionGrid = { poly, us: [0, 12, 24], ws: [0, 12] };
		const s = splitSection(grid, 80, 10, identity, 'metric', 1e-9);
		expect(s.parts).toBe(8); // 80 bags at 10 a pour
		expect(s.coldJoints).toEqual([]);
		expect(s.bagsPerPart).toEqual([]); // not laid out: the list would grow with the bags
		expect(s.note).toMatch(/8 separate pours of about 10 bags/);
		expect(s.note).toMatch(/ready-mix/);
	});

	it('keeps the exact cut when a joint line would overfill a part', () => {
		const grid: SectionGrid = { poly, us: [0, 12, 24], ws: [0, 12] };
		const s = splitSection(grid, 30, 10, identity, 'metric', 1e-9);
		expect(s.coldJoints.map((j) => j.from[0])).toEqual([8, 16].map((x) => expect.closeTo(x, 9))); // thirds of 24
		expect(s.coldJoints[0].to).toEqual([expect.closeTo(8, 9), 12]);
	});
});
