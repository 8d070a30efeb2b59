// What the young-generation collector does while computePlan runs as the bench runs it (a second
// of warm-up, then 3 s of the 50-vertex plan): how many runs between scavenges, how much each
// scavenge copies (what survives it) and promotes, and how long it takes. The p99 of the bench is
// the run a scavenge falls in, so this is the figure behind it (docs/performance.md, Engine).
// Runs per scavenge and the bytes copied do not depend on load; the times do.
//
//   node scripts/engine-gc.mjs [seconds=3]

import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { bundleEngine } from './lib/engine-bundle.mjs';

const seconds = Number(process.argv[2] ?? 3);
const dir = path.resolve('node_modules/.cache/engine-gc');
await bundleEngine(dir);

// The timed loop runs in a process of its own, so V8's trace holds nothing but it.
const runner = `
const engine = await import(${JSON.stringify(pathToFileURL(path.join(dir, 'engine.js')).href)});
const plans = await import(${JSON.stringify(pathToFileURL(path.join(dir, 'plans.js')).href)});
const input = plans.wavyPad();
const t0 = performance.now();
while (performance.now() - t0 < 1000) engine.computePlan(input);
console.log('TIMED');
const s = [];
const t1 = performance.now();
while (performance.now() - t1 < ${seconds * 1000}) { const t = performance.now(); engine.computePlan(input); s.push(performance.now() - t); }
// The times go to a file: a GC trace line printed while this long line is written would split it.
(await import('node:fs')).writeFileSync(${JSON.stringify(path.join(dir, 'runs.json'))}, JSON.stringify(s));
console.log('RUNS');
// What finished runs leave behind: after a collection, 20 whole runs, then another collection.
gc({ type: 'minor' });
for (let i = 0; i < 20; i++) engine.computePlan(input);
console.log('LEFT');
gc({ type: 'minor' });
`;
const out = spawnSync(process.execPath, ['--trace-gc-nvp', '--expose-gc', '--input-type=module', '-e', runner], { encoding: 'utf8', maxBuffer: 1 << 28 });
if (out.status !== 0) throw new Error(out.stderr);
const lines = out.stdout.split('\n');
const timed = lines.slice(lines.indexOf('TIMED') + 1, lines.indexOf('RUNS'));
const runs = JSON.parse(readFileSync(path.join(dir, 'runs.json'), 'utf8')).sort((a, b) => a - b);
const fields = (l) =>
	Object.fromEntries(
		l
			.split(' ')
			.filter((x) => x.includes('='))
			.map((x) => x.split('='))
	);
const left = fields(lines.slice(lines.indexOf('LEFT') + 1).find((l) => l.includes(' gc=s ')));
const scavenges = timed.filter((l) => l.includes(' gc=s ')).map(fields);
const majors = timed.filter((l) => / gc=m[cs] /.test(l)).length;
const mean = (k) => scavenges.reduce((a, r) => a + Number(r[k]), 0) / scavenges.length;
const median = (v) => [...v].sort((a, b) => a - b)[v.length >> 1];
const us = (ms) => (ms >= 1 ? `${ms.toFixed(2)} ms` : `${(ms * 1000).toFixed(0)} µs`);
console.log(
	`${runs.length} runs: median ${us(median(runs))}, p99 ${us(runs[Math.floor(runs.length * 0.99)])}, min ${us(runs[0])}\n` +
		`${scavenges.length} scavenges, one every ${(runs.length / scavenges.length).toFixed(0)} runs (${(mean('allocated') / 1e6).toFixed(1)} MB apart); ` +
		`each copies ${(mean('new_space_survived') / 1e3).toFixed(0)} kB and promotes ${(mean('promoted') / 1e3).toFixed(0)} kB (means), ` +
		`median ${us(median(scavenges.map((r) => Number(r.scavenge))))}; ${majors} major GCs\n` +
		`after 20 finished runs a scavenge still copies ${Number(left.new_space_survived).toLocaleString('en-US')} bytes (nothing of a finished run should be left)`
);
