// npm run cluster:fault — the kill drill on a fresh two-server cluster: a homeowner of its own, a
// bounded autocannon run through nginx (plan writes and reads, 30 s, 16 connections) with one app server killed 10 s in.
// Prints the figures (docs/deploy.md records them) and fails when an acknowledged write is missing
// or anything but the killed server's in-flight writes failed.
// Options: --short (10 s, kill at 4 s: what the cluster end-to-end test runs).
import os from 'node:os';
import fs from 'node:fs';
import path from 'node:path';
import { root, settings } from './lib/settings.mjs';
import { background, fail, log } from './lib/run.mjs';
import { node, prepare } from './lib/steps.mjs';

const short = process.argv.includes('--short');
process.env.PGDATABASE_TEST ??= 'stakeline_cluster_fault';
const s = settings('test');
prepare(s, { freshDatabase: true });

const { startCluster } = await import('./lib/cluster.mjs');
const { killDrill } = await import('./lib/cluster-drill.mjs');

const env = { ...s.env, LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn' };
if (s.useFakeMail) background(node, [path.join(root, 'scripts', 'mail-fake.mjs')], { env: { ...process.env, ...env }, stdio: ['ignore', 'ignore', 'inherit'] });
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'stakeline-cluster-fault-'));
let cluster;
try {
	cluster = await startCluster({ env, dir, quiet: true });
} catch (err) {
	fail(err.message);
}
const durationS = short ? 10 : 30;
const killAfterS = short ? 4 : 10;
log(`Load through nginx for ${durationS} s; app server ${cluster.apps.at(-1).name} is killed after ${killAfterS} s`);
let outcome;
try {
	outcome = await killDrill({ cluster, databaseUrl: s.env.DATABASE_URL, durationS, killAfterS, connections: short ? 8 : 16 });
} finally {
	await cluster.stop();
}
console.log(JSON.stringify(outcome.figures, null, 2));
for (const p of outcome.problems) console.error(`✖ ${p}`);
if (outcome.problems.length) {
	console.error(`Logs kept in ${path.join(dir, 'logs')} and ${path.join(dir, 'nginx')}`);
	process.exit(1);
}
fs.rmSync(dir, { recursive: true, force: true });
log('Kill drill passed: nginx moved to the survivor and no acknowledged write was lost');
process.exit(0);
