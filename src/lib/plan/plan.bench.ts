// computePlan on a 50-vertex outline split into 4 pour sections. A benchmark, not a test: the
// target is a median under 200 µs so the wizard can recompute on every keystroke.

import { afterAll, bench, describe } from 'vitest';
import { computePlan, type PlanInput } from './index';
import type { Pt } from './polygon';

/** A 40 × 20 ft pad with a wavy back edge: 5 points along the front, 45 along the back. */
function wavyPad(): PlanInput {
	const top = (x: number): Pt => [x, 20 + Math.sin((x / 40) * Math.PI * 3) * 1.5];
	const sections = [0, 1, 2, 3].map((k) => {
		const x0 = k * 10;
		const back = Array.from({ length: 12 }, (_, i) => top(x0 + 10 - (i * 10) / 11));
		return { outline: [[x0, 0] as Pt, [x0 + 10, 0] as Pt, ...back].map(([x, y]) => [x, y] as [number, number]) };
	});
	return {
		units: 'imperial',
		sections,
		houseEdge: null,
		slope: { fall: { value: 1.5, unit: 'percent' }, crossFall: { value: 0.5, unit: 'percent' } },
		thickenedEdge: { edges: 'free' },
		fill: { shareOfTrench: 0.2, largestPiece: 3 },
		bags: { offered: [{ size: 80, price: 6.4 }, { size: 60, price: 5.1 }] },
		readyMix: { price: 185 },
		crew: { people: 3, method: 'drum' },
		conditions: { airTemp: [60, 55, 50, 58, 62, 65], humidity: 40, wind: 8, pourDate: '2027-06-01' }
	};
}

const input = wavyPad();
let samples: number[] = [];

describe('computePlan', () => {
	bench(
		'50-vertex outline, 4 sections',
		() => {
			const t = performance.now();
			computePlan(input);
			samples.push(performance.now() - t);
		},
		// Keep only the timed phase's samples (setup runs before warm-up and again before the run).
		{ time: 2000, setup: () => void (samples = []) }
	);
});

afterAll(() => {
	const s = [...samples].sort((a, b) => a - b);
	const median = s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
	console.log(`computePlan median: ${(median * 1000).toFixed(1)} µs over ${s.length} runs (target < 200 µs)`);
});
