// npm run load: throughput of the main routes as a share of a bare SvelteKit page, in one run.
//
//   npm run load                                  every route, 32 and 64 connections, 5 s each
//   npm run load -- --routes account,plan --duration 8 --connections 32
//   npm run load -- --profile                     the app runs under node --cpu-prof (.data/prof/)
//
// Sets up like `npm start` (database, migrations, demo data, build), builds the bare page in
// scripts/bare once, starts both on loopback, signs in the demo homeowner for a session cookie,
// then drives each route with autocannon and prints req/s, latency, errors, non-2xx and the share
// of the bare page measured in the same run (the bare page is measured again before each
// connection count, so both figures see the same machine load). It also prints the server's CPU
// time per request (from /proc) and the bare page's CPU per request divided by the route's: on a
// machine busy with other work, req/s swings with the load while CPU per request stays put.
// The database's own CPU is not in it (see docs/performance.md for pg_stat_statements).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import autocannon from 'autocannon';
import { root, settings } from './lib/settings.mjs';
import { background, fail, log, run, waitForOk } from './lib/run.mjs';
import { bin, node, prepare } from './lib/steps.mjs';
import { firstPlanId, signInDemo } from './lib/demo-session.mjs';

const ROUTES = ['healthz', 'home', 'wizard', 'account', 'estimate', 'plan'];
const { values: opt } = parseArgs({
	options: {
		routes: { type: 'string', default: ROUTES.join(',') },
		duration: { type: 'string', default: '5' },
		connections: { type: 'string', default: '32,64' },
		warmup: { type: 'string', default: '1' },
		profile: { type: 'boolean', default: false },
		'bare-port': { type: 'string', default: '' }
	}
});
const routes = opt.routes
	.split(',')
	.map((r) => r.trim())
	.filter(Boolean);
for (const r of routes) if (!ROUTES.includes(r)) fail(`Unknown route "${r}"; choose from ${ROUTES.join(', ')}.`);
const duration = Number(opt.duration);
const warmup = Number(opt.warmup);
if (!(duration >= 1 && duration <= 60)) fail('--duration is in seconds, 1–60.');
if (!(warmup >= 0 && warmup <= 10)) fail('--warmup is in seconds, 0–10.');
const connections = opt.connections.split(',').map(Number);
if (connections.some((c) => !(c >= 1 && c <= 256))) fail('--connections takes counts of 1–256, comma-separated.');

const s = settings('dev');
prepare(s);
buildBare();

const appUrl = `http://127.0.0.1:${s.port}`;
const barePort = Number(opt['bare-port'] || s.port + 1000);
const bareUrl = `http://127.0.0.1:${barePort}`;
// Estimate requests come from many addresses (X-Forwarded-For, trusted only in this run), so the
// per-address limit of the public API is still counted in PostgreSQL on every request but never
// answers 429 to the one load generator.
const env = { ...process.env, ...s.env, LOG_LEVEL: process.env.LOG_LEVEL ?? 'info', ADDRESS_HEADER: 'x-forwarded-for', XFF_DEPTH: '1' };
const children = [];
const stopAll = () => {
	for (const c of children) if (c.exitCode === null) c.kill('SIGTERM');
};
process.on('exit', stopAll);
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => process.exit(130));

if (s.useFakeMail) children.push(background(node, [path.join(root, 'scripts', 'mail-fake.mjs')], { env, stdio: 'ignore' }));
const profDir = path.join(root, '.data', 'prof');
if (opt.profile) fs.mkdirSync(profDir, { recursive: true });
// The request log goes to /dev/null: it is written as in production, but not onto this report.
const app = background(node, [...(opt.profile ? ['--cpu-prof', `--cpu-prof-dir=${profDir}`] : []), path.join(root, 'build')], {
	env,
	cwd: root,
	stdio: ['ignore', 'ignore', 'inherit']
});
const bare = background(node, [path.join(root, 'scripts', 'bare', 'build')], {
	env: { ...process.env, HOST: '127.0.0.1', PORT: String(barePort), ORIGIN: bareUrl },
	stdio: ['ignore', 'ignore', 'inherit']
});
children.push(app, bare);

if (!(await waitForOk(`${appUrl}/healthz`)) || !(await waitForOk(bareUrl))) fail('The app or the bare page did not start within a minute.');

const cookie = await signInDemo(appUrl);
const planId = await firstPlanId(appUrl, cookie);
const patio = JSON.stringify(exampleEstimate());
let sent = 0;

/** What autocannon sends for each route. */
const targets = {
	healthz: { title: '/healthz (select 1)', url: `${appUrl}/healthz` },
	home: { title: '/ home, signed out', url: `${appUrl}/` },
	wizard: { title: '/plans/new wizard, signed out', url: `${appUrl}/plans/new` },
	account: { title: '/account, signed in', url: `${appUrl}/account`, headers: { cookie } },
	estimate: {
		title: 'POST /api/estimate (docs/api.md example)',
		url: `${appUrl}/api/estimate`,
		method: 'POST',
		headers: { 'content-type': 'application/json' },
		body: patio,
		// A fresh address per request (see ADDRESS_HEADER above).
		requests: [{ setupRequest: (req) => ({ ...req, headers: { ...req.headers, 'x-forwarded-for': address(sent++) } }) }]
	},
	plan: { title: '/plans/:id, signed in, a demo plan', url: `${appUrl}/plans/${planId}`, headers: { cookie } }
};

const load = os.loadavg();
console.log(`\nMachine: ${os.cpus().length} cores, load average ${load.map((l) => l.toFixed(2)).join(' / ')} (1/5/15 min) before the run`);
console.log(`Each route: ${warmup} s warm-up, then ${duration} s measured; connections ${connections.join(', ')}\n`);

const rows = [];
for (const c of connections) {
	const base = await measure({ title: 'bare SvelteKit page', url: bareUrl }, c);
	rows.push({ ...base, share: 1, cpuShare: 1 });
	for (const r of routes) {
		const m = await measure(targets[r], c);
		rows.push({ ...m, share: m.rps / base.rps, cpuShare: base.cpuPerReq / m.cpuPerReq });
	}
}
printTable(rows);
const after = os.loadavg();
console.log(`\nLoad average after the run: ${after.map((l) => l.toFixed(2)).join(' / ')}`);
const bad = rows.filter((r) => r.errors || r.non2xx);
if (bad.length) console.log(`Errors or non-2xx answers on: ${bad.map((r) => `${r.title} @${r.connections}`).join('; ')}`);

stopAll();
if (opt.profile) {
	await new Promise((r) => app.once('exit', r));
	const newest = fs
		.readdirSync(profDir)
		.filter((f) => f.endsWith('.cpuprofile'))
		.map((f) => path.join(profDir, f))
		.sort((a, b) => fs.statSync(b).mtimeMs - fs.statSync(a).mtimeMs)[0];
	if (newest) {
		console.log(`\nCPU profile: ${path.relative(root, newest)} (open in Chrome DevTools → Performance)`);
		printProfile(newest);
	}
}
process.exit(bad.length ? 1 : 0);

// ---------------------------------------------------------------------------------------------

function buildBare() {
	const dir = path.join(root, 'scripts', 'bare');
	if (fs.existsSync(path.join(dir, 'build', 'index.js'))) return;
	log('Building the bare page (scripts/bare)…');
	run(bin('vite'), ['build', '--logLevel', 'warn'], { cwd: dir });
}

/** docs/api.md's worked example. */
function exampleEstimate() {
	return {
		units: 'imperial',
		name: 'Back patio',
		sections: [
			{
				name: 'Patio',
				outline: [
					[0, 0],
					[16, 0],
					[16, 12],
					[0, 12]
				]
			}
		],
		houseEdge: { section: 0, edge: 0 },
		reference: { label: 'kitchen door sill', below: 1.5 },
		slope: { fall: { value: 0.25, unit: 'inPerFt' } },
		thickness: 4,
		bags: {
			offered: [
				{ size: 80, price: 6.4 },
				{ size: 60, price: 5.1 }
			]
		},
		readyMix: { price: 185, minimum: 3, shortLoadFee: 75 },
		crew: { people: 3, method: 'drum' },
		conditions: { airTemp: [75, 72, 70], humidity: 45, wind: 6, pourDate: '2027-05-15' }
	};
}

function address(n) {
	return `10.${(n >> 16) & 255}.${(n >> 8) & 255}.${n & 255}`;
}

function cannon(target, c, seconds) {
	return new Promise((resolve, reject) => {
		const { title: _t, ...rest } = target;
		autocannon({ ...rest, connections: c, duration: seconds, pipelining: 1, timeout: 10 }, (err, result) => (err ? reject(err) : resolve(result)));
	});
}

/** CPU time (user + system) the process has used so far, in ms, from /proc (Linux). */
function cpuMs(pid) {
	try {
		const f = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
		return ((Number(f[11]) + Number(f[12])) * 1000) / 100; // utime, stime in clock ticks (USER_HZ = 100)
	} catch {
		return NaN;
	}
}

async function measure(target, c) {
	if (warmup > 0) await cannon(target, c, warmup);
	const pid = target.url.startsWith(bareUrl) ? bare.pid : app.pid;
	const cpu0 = cpuMs(pid);
	const r = await cannon(target, c, duration);
	const cpu = cpuMs(pid) - cpu0;
	const row = {
		title: target.title,
		connections: c,
		rps: r.requests.average,
		p50: r.latency.p50,
		p99: r.latency.p99,
		errors: r.errors + r.timeouts,
		non2xx: r.non2xx,
		// Server CPU per answered request: unlike req/s, barely moved by other work on the machine.
		cpuPerReq: r.requests.total ? cpu / r.requests.total : NaN
	};
	process.stdout.write(`  measured ${row.title} @${c}: ${Math.round(row.rps)} req/s\n`);
	return row;
}

function printTable(rows) {
	const head = ['route', 'conns', 'req/s', 'p50 ms', 'p99 ms', 'errors', 'non-2xx', 'share of bare', 'server CPU ms/req', 'CPU share'];
	const body = rows.map((r) => [
		r.title,
		String(r.connections),
		Math.round(r.rps).toLocaleString('en-US'),
		String(r.p50),
		String(r.p99),
		String(r.errors),
		String(r.non2xx),
		r.share.toFixed(2),
		r.cpuPerReq.toFixed(2),
		r.cpuShare.toFixed(2)
	]);
	const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i].length)));
	const line = (cells) => `| ${cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join(' | ')} |`;
	console.log(`\n${line(head)}\n|${widths.map((w, i) => (i === 0 ? '-'.repeat(w + 2) : `${'-'.repeat(w + 1)}:`)).join('|')}|`);
	for (const b of body) console.log(line(b));
}

/** Self time by function and by package/file, from a .cpuprofile: where the CPU went. */
function printProfile(file) {
	const prof = JSON.parse(fs.readFileSync(file, 'utf8'));
	const byId = new Map(prof.nodes.map((n) => [n.id, n]));
	const self = new Map();
	const dt = prof.timeDeltas;
	for (let i = 0; i < prof.samples.length; i++) self.set(prof.samples[i], (self.get(prof.samples[i]) ?? 0) + (dt[i] ?? 0));
	const total = [...self.values()].reduce((a, b) => a + b, 0);
	const fns = new Map();
	const files = new Map();
	for (const [id, us] of self) {
		const f = byId.get(id).callFrame;
		const where = f.url
			? f.url
					.replace(/^file:\/\//, '')
					.replace(root + '/', '')
					.replace(/node_modules\/((@[^/]+\/)?[^/]+).*/, '$1')
			: `(${f.functionName || 'native'})`;
		const key = `${f.functionName || '(anonymous)'}  ${where}${f.url ? `:${f.lineNumber + 1}` : ''}`;
		fns.set(key, (fns.get(key) ?? 0) + us);
		files.set(where, (files.get(where) ?? 0) + us);
	}
	const top = (m, n) =>
		[...m]
			.sort((a, b) => b[1] - a[1])
			.slice(0, n)
			.map(([k, us]) => `  ${((100 * us) / total).toFixed(1).padStart(5)} %  ${k}`)
			.join('\n');
	console.log(`\nSelf time by package or file (${(total / 1e6).toFixed(1)} s sampled):\n${top(files, 15)}`);
	console.log(`\nSelf time by function:\n${top(fns, 25)}`);
}
