// Is the engine faster than at another commit? Both engines, bundled as the bench bundles them, run
// in one process in alternating batches of 200 runs of the 50-vertex plan, so both see the same
// load from whatever else the machine is doing; a plain before/after pair of `npm run bench` runs
// on a shared machine mostly measures the other sessions. Prints the median of the batch medians
// and of the batch 10th percentiles, and in how many batch pairs each was faster.
//
//   node scripts/engine-ab.mjs [git-ref=HEAD] [pairs=30]

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import { bundleEngine } from './lib/engine-bundle.mjs';

const ref = process.argv[2] ?? 'HEAD';
const pairs = Number(process.argv[3] ?? 30);

// The other commit's engine, from git, beside this tree's node_modules (zod resolves from there).
const other = fs.mkdtempSync(path.join(os.tmpdir(), 'engine-ab-'));
const tar = execFileSync('git', ['archive', ref, 'src/lib/plan']);
execFileSync('tar', ['-x', '-C', other], { input: tar });
fs.symlinkSync(path.resolve('node_modules'), path.join(other, 'node_modules'));
const cache = path.resolve('node_modules/.cache');
const engines = {
	[ref]: await bundleEngine(path.join(cache, 'engine-ab-ref'), { root: other }),
	'this tree': await bundleEngine(path.join(cache, 'engine-ab-tree'))
};
fs.rmSync(other, { recursive: true });

const names = Object.keys(engines);
const inputs = names.map((n) => engines[n].plans.wavyPad());
const run = (k) => engines[names[k]].engine.computePlan(inputs[k]);
const t0 = performance.now();
while (performance.now() - t0 < 2000) for (let k = 0; k < 2; k++) run(k); // warm up both
const medians = [[], []];
const lows = [[], []];
for (let b = 0; b < pairs; b++)
	// Each goes first in every other pair.
	for (const k of b % 2 ? [0, 1] : [1, 0]) {
		const s = [];
		for (let i = 0; i < 200; i++) {
			const t = performance.now();
			run(k);
			s.push(performance.now() - t);
		}
		s.sort((x, y) => x - y);
		medians[k].push(s[100]);
		lows[k].push(s[20]);
	}
const mid = (v) => [...v].sort((x, y) => x - y)[v.length >> 1] * 1000;
for (let k = 0; k < 2; k++) {
	const faster = medians[k].filter((m, b) => m < medians[1 - k][b]).length;
	console.log(
		`${names[k]}: median ${mid(medians[k]).toFixed(0)} µs, 10th percentile ${mid(lows[k]).toFixed(0)} µs (medians of ${pairs} batches); faster in ${faster} of ${pairs} pairs`
	);
}
