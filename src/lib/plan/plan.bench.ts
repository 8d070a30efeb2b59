// computePlan on a 50-vertex outline split into 4 pour sections. A benchmark, not a test: the
// target is a median under 200 µs so the wizard can recompute on every keystroke.

import { afterAll, bench, describe } from 'vitest';
import { computePlan } from './index';
import { wavyPad } from './test-plans';

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
