// How often V8 throws away the engine's optimised code while the bench's plan runs: the engine
// bundled as the bench bundles it (unminified, for names), `runs` runs of the 50-vertex plan in a
// process of its own under --trace-deopt, then each deopt's function, reason and place in the
// bundle, and the median run time per 1,000 runs. Every deopt sends a function back to the
// interpreter until it is optimised again, so a run of them keeps the engine slow for seconds after
// start-up (docs/performance.md, Engine). The count depends on the code, hardly on the load; the
// times do not.
//
//   node scripts/engine-deopts.mjs [runs=6000]

import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import { bundleEngine } from './lib/engine-bundle.mjs';

const runs = Number(process.argv[2] ?? 6000);
const dir = path.resolve('node_modules/.cache/engine-deopts');
await bundleEngine(dir, { minify: false });

const runner = `
const engine = await import(${JSON.stringify(pathToFileURL(path.join(dir, 'engine.js')).href)});
const plans = await import(${JSON.stringify(pathToFileURL(path.join(dir, 'plans.js')).href)});
const input = plans.wavyPad();
const s = [];
for (let i = 0; i < ${runs}; i++) { const t = performance.now(); engine.computePlan(input); s.push(performance.now() - t); }
console.log('RUNS ' + JSON.stringify(s));
`;
const out = spawnSync(process.execPath, ['--trace-deopt-verbose', '--input-type=module', '-e', runner], { encoding: 'utf8', maxBuffer: 1 << 28 });
if (out.status !== 0) throw new Error(out.stderr);
const lines = out.stdout.split('\n');
const deopts = [];
for (let i = 0; i < lines.length; i++) {
	const m = /^\[bailout \(kind: ([^,]+), reason: ([^)]*)\).*<JSFunction ([^ >(]*)/.exec(lines[i]);
	if (!m) continue;
	const at = /deoptimize at <([^>]*)>/.exec(lines[i + 1] ?? '');
	deopts.push(`${m[3] || '(anonymous)'}: ${m[2]} (${m[1]}) at ${at ? path.basename(at[1]) : '?'}`);
}
const s = JSON.parse(lines.find((l) => l.startsWith('RUNS ')).slice(5));
const medians = [];
for (let i = 0; i < s.length; i += 1000) {
	const c = s.slice(i, i + 1000).sort((a, b) => a - b);
	medians.push(`${(c[c.length >> 1] * 1000).toFixed(0)}`);
}
console.log(`${deopts.length} deopts in ${runs} runs`);
for (const d of deopts) console.log(`  ${d}`);
console.log(`median µs per 1,000 runs: ${medians.join(' ')}`);
