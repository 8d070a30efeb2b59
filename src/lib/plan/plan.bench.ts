// computePlan on a 50-vertex outline split into 4 pour sections, and on the costliest plan the
// schema's limits allow. A benchmark, not a test: the targets are a median under 200 µs and a p99
// under 2 ms for the first, so the wizard can recompute on every keystroke, and under 20 ms for the
// second, so no accepted request holds the server for long.
//
// It times the engine as it ships: bundled by Vite (as `vite build` bundles it for the browser and
// the server) and loaded by Node itself, not through the test runner's per-module transform. A
// second of warm-up first: the wizard recomputes for as long as someone types, so steady state is
// what people feel.

import path from 'node:path';
import { afterAll, bench, describe } from 'vitest';
import { bundleEngine } from '../../../scripts/lib/engine-bundle.mjs';

const { engine, plans } = await bundleEngine(path.resolve('node_modules/.cache/engine-bench'));
const { computePlan } = engine;
const { largestPlan, wavyPad } = plans;

const cases = [
	{ name: '50-vertex outline, 4 sections', input: wavyPad(), target: 'median < 200 µs, p99 < 2 ms' },
	{ name: 'largest plan inside the limits', input: largestPlan(), target: 'p99 < 20 ms' }
];
const samples = new Map<string, number[]>();

describe('computePlan', () => {
	for (const c of cases)
		bench(
			c.name,
			() => {
				const t = performance.now();
				computePlan(c.input);
				samples.get(c.name)!.push(performance.now() - t);
			},
			// Keep only the timed phase's samples (setup runs before warm-up and again before the run).
			{ time: 3000, warmupTime: 1000, setup: () => void samples.set(c.name, []) }
		);
});

const at = (s: number[], q: number) => s[Math.min(s.length - 1, Math.floor(q * s.length))];
const us = (ms: number) => (ms >= 1 ? `${ms.toFixed(2)} ms` : `${(ms * 1000).toFixed(1)} µs`);

afterAll(() => {
	for (const c of cases) {
		const s = [...(samples.get(c.name) ?? [])].sort((a, b) => a - b);
		if (!s.length) continue;
		const median = s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
		console.log(`${c.name}: median ${us(median)}, p99 ${us(at(s, 0.99))} over ${s.length} runs (target ${c.target})`);
	}
});
