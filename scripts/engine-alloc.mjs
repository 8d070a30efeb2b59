// Bytes the engine allocates per computePlan run, by engine function, for the plans the bench
// times. Allocation, unlike time, does not depend on how loaded the machine is, so this is the
// figure to compare between changes (docs/performance.md, Engine).
//
// Like the bench it measures the engine as it ships: bundled by Vite, loaded by Node. V8's sampling
// heap profiler counts every object, including those the young-generation GC already collected.
//
//   node scripts/engine-alloc.mjs [runs=1000] [top=25] [--anonymous: list arrow functions apart]

import path from 'node:path';
import { Session } from 'node:inspector/promises';
import { bundleEngine } from './lib/engine-bundle.mjs';

const runs = Number(process.argv[2] ?? 1000);
const top = Number(process.argv[3] ?? 25);
const anon = process.argv.includes('--anonymous');
const { engine, plans } = await bundleEngine(path.resolve('node_modules/.cache/engine-alloc'), { minify: false });
const { computePlan } = engine;
const { wavyPad, largestPlan } = plans;

const session = new Session();
session.connect();

for (const [name, input, n] of [
	['50-vertex outline, 4 sections', wavyPad(), runs],
	['largest plan inside the limits', largestPlan(), Math.max(20, Math.round(runs / 20))]
]) {
	for (let i = 0; i < 2 * n; i++) computePlan(input); // warm up: optimised code allocates less
	await session.post('HeapProfiler.startSampling', {
		samplingInterval: 256,
		includeObjectsCollectedByMinorGC: true,
		includeObjectsCollectedByMajorGC: true
	});
	for (let i = 0; i < n; i++) computePlan(input);
	const { profile } = await session.post('HeapProfiler.stopSampling');

	// Self bytes by the innermost engine function on the stack (runtime and library frames are
	// charged to the engine function that called them).
	const byFn = new Map();
	let total = 0;
	const walk = (node, owner) => {
		const f = node.callFrame;
		const mine =
			f.url.includes('engine-alloc') && (f.functionName || anon) ? `${f.functionName || '(anonymous)'} (${path.basename(f.url)}:${f.lineNumber + 1})` : owner;
		if (node.selfSize) {
			total += node.selfSize;
			byFn.set(mine, (byFn.get(mine) ?? 0) + node.selfSize);
		}
		for (const c of node.children) walk(c, mine);
	};
	walk(profile.head, '(outside the engine)');
	const kB = (b) => `${(b / n / 1000).toFixed(1)} kB`;
	console.log(`\n${name}: ${kB(total)} a run (${n} runs)`);
	for (const [fn, b] of [...byFn].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`  ${kB(b).padStart(9)}  ${fn}`);
}
session.disconnect();
