// npm run fault — a fault drill against the built app: writes plans through the API while
// PostgreSQL is restarted, then while it is stopped for 10 s, and checks that
//   - every acknowledged write (201/200) is stored,
//   - writes during the outage failed fast with 503 (never a 500, never a hang),
//   - the app serves writes again within 5 s of the database being back,
//   - retrying the failed writes with their Idempotency-Key makes no duplicate.
// Options: --short (3 s outage; the e2e suite runs this against its server), --url URL (use a
// running app instead of starting one on its own database).
import { spawn } from 'node:child_process';
import postgres from 'postgres';
import { settings } from './lib/settings.mjs';
import { ensurePostgres, pgCluster } from './lib/pg.mjs';
import { background, log } from './lib/run.mjs';
import { build, migrate, node, seed } from './lib/steps.mjs';
import { smallSlab as input } from './lib/plans.mjs';
import path from 'node:path';
import { root } from './lib/settings.mjs';

const args = process.argv.slice(2);
const short = args.includes('--short');
const given = args.includes('--url') ? args[args.indexOf('--url') + 1] : null;
const OUTAGE_MS = short ? 3000 : 10_000;
const STEADY_MS = short ? 1500 : 3000;
const WRITERS = 4;
const FAST_MS = 5000; // a failed write must answer within this
const RECOVERY_MS = 5000; // writes succeed again within this after the database is back
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

if (!given) process.env.PGDATABASE_TEST ??= 'stakeline_fault';
const s = settings('test');
let base = given;
if (!base) {
	ensurePostgres(s, { freshDatabase: true });
	migrate(s.env);
	seed(s.env);
	build();
	const port = Number(process.env.FAULT_PORT ?? s.port + 40);
	base = `http://127.0.0.1:${port}`;
	const env = { ...process.env, ...s.env, PORT: String(port), ORIGIN: base, LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn' };
	// The confirmation mail of the sign-up below goes through the local fake SMTP server.
	if (s.useFakeMail) background(node, [path.join(root, 'scripts', 'mail-fake.mjs')], { env, stdio: ['ignore', 'ignore', 'inherit'] });
	background(node, [path.join(root, 'build')], { env, stdio: ['ignore', 'ignore', 'inherit'] });
	for (let i = 0; ; i++) {
		if (
			await fetch(`${base}/healthz`).then(
				(r) => r.ok,
				() => false
			)
		)
			break;
		if (i > 100) throw new Error('The app did not start');
		await sleep(200);
	}
}
const pg = pgCluster(s);
// Async, so the writers keep going; waits for pg_ctl's exit, not for its pipes (the server keeps them).
const ctl = (action) =>
	new Promise((resolve, reject) => {
		const [cmd, a] = pg.ctlCommand(action);
		spawn(cmd, a, { stdio: 'ignore' }).on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`pg_ctl ${action} exited with ${code}`))));
	});

// A fresh homeowner, signed up through the form like a visitor; sign-up is confirm-first, so the
// session comes from the e-mailed link, read where the fake SMTP server stores mail (dev_mail).
const email = `fault-${Date.now()}-${process.pid}@fault.stakeline.test`;
const formHeaders = { origin: base, accept: 'text/html', 'content-type': 'application/x-www-form-urlencoded' };
const form = new URLSearchParams({ role: 'homeowner', name: 'Fault Drill', email, password: 'fault-drill-password', redirectTo: '' });
const signup = await fetch(`${base}/signup`, { method: 'POST', body: form, redirect: 'manual', headers: formHeaders });
if (signup.status !== 200) throw new Error(`Sign-up answered ${signup.status}`);
const mailDb = postgres(s.env.DATABASE_URL, { max: 1, onnotice: () => {} });
let token = null;
for (let i = 0; !token; i++) {
	if (i > 150) throw new Error(`No confirmation mail reached ${email} in 30 s (is the fake mail server running?)`);
	await sleep(200);
	const [m] = await mailDb`SELECT text FROM dev_mail WHERE "to" ILIKE ${'%' + email + '%'} AND subject LIKE 'Confirm%' ORDER BY received_at DESC LIMIT 1`;
	token = m?.text.match(/verify-email\?token=([\w=-]+)/)?.[1] ?? null;
}
await mailDb.end();
const confirm = await fetch(`${base}/verify-email`, {
	method: 'POST',
	body: new URLSearchParams({ token, next: '' }),
	redirect: 'manual',
	headers: formHeaders
});
const cookie = (confirm.headers.getSetCookie?.() ?? []).map((c) => c.split(';')[0]).join('; ');
if (!cookie) throw new Error(`Following the confirmation link gave no session (status ${confirm.status})`);
const headers = { cookie, origin: base, 'content-type': 'application/json' };

let phase = 'steady';
let stopping = false;
const writes = [];
let n = 0;

async function write(name, key) {
	const t0 = Date.now();
	const at = phase;
	try {
		const res = await fetch(`${base}/api/plans`, {
			method: 'POST',
			headers: { ...headers, 'idempotency-key': key },
			body: JSON.stringify({ name, input }),
			signal: AbortSignal.timeout(30_000)
		});
		const body = await res.json().catch(() => ({}));
		return { name, key, phase: at, t0, t1: Date.now(), status: res.status, id: body.plan?.id, retryAfter: res.headers.get('retry-after') };
	} catch (err) {
		return { name, key, phase: at, t0, t1: Date.now(), status: 0, error: String(err.cause?.code ?? err.name) };
	}
}

async function writer(w) {
	while (!stopping) {
		const i = n++;
		writes.push(await write(`Fault drill ${w}-${i}`, `fault-${process.pid}-${i}`));
		await sleep(20);
	}
}

const running = Array.from({ length: WRITERS }, (_, w) => writer(w));
await sleep(STEADY_MS);
log('Restarting PostgreSQL');
phase = 'restart';
await ctl('restart');
phase = 'steady';
await sleep(STEADY_MS);
log(`Stopping PostgreSQL for ${OUTAGE_MS / 1000} s`);
phase = 'stopping';
await ctl('stop');
phase = 'down';
const health = await fetch(`${base}/healthz`).then(
	async (r) => ({ status: r.status, body: await r.json() }),
	(e) => ({ status: 0, body: String(e) })
);
await sleep(OUTAGE_MS);
phase = 'starting';
await ctl('start');
const upAt = Date.now();
phase = 'after';
log('PostgreSQL is back');
await sleep(STEADY_MS + RECOVERY_MS);
stopping = true;
await Promise.all(running);

// Retry each failed write with the same key, as a client would: a few at a time, up to three
// times, waiting as Retry-After says (at most a second here).
const failed = writes.filter((w) => !w.id);
const retried = [];
const queue = [...failed];
await Promise.all(
	Array.from({ length: WRITERS }, async () => {
		for (let w = queue.shift(); w; w = queue.shift()) {
			let r = await write(w.name, w.key);
			for (let i = 0; i < 2 && !r.id; i++) {
				await sleep(Math.min(1000, Number(r.retryAfter ?? 1) * 1000));
				r = await write(w.name, w.key);
			}
			retried.push(r);
		}
	})
);

const listed = await fetch(`${base}/api/plans`, { headers }).then((r) => r.json());
const stored = new Map();
for (const p of listed.plans) stored.set(p.name, (stored.get(p.name) ?? []).concat(p.id));

const acked = writes.filter((w) => w.id);
const lost = acked.filter((w) => !(stored.get(w.name) ?? []).includes(w.id));
const duplicates = [...stored.entries()].filter(([, ids]) => ids.length > 1);
const downWrites = writes.filter((w) => w.phase === 'down' && w.t1 <= upAt);
const wrongDown = downWrites.filter((w) => w.status !== 503 || w.retryAfter === null);
const slowFailures = writes.filter((w) => !w.id && w.t1 - w.t0 > FAST_MS);
const serverErrors = writes.concat(retried).filter((w) => w.status >= 500 && w.status !== 503);
const firstOk = writes.filter((w) => w.id && w.t0 >= upAt).sort((a, b) => a.t1 - b.t1)[0];
const recoveryMs = firstOk ? firstOk.t1 - upAt : Infinity;
const retriedMissing = retried.filter((w) => !w.id);
const downLatency = downWrites.map((w) => w.t1 - w.t0).sort((a, b) => a - b);

const tally = {
	writes: writes.length,
	acknowledged: acked.length,
	acknowledgedStored: acked.length - lost.length,
	failed: failed.length,
	duringOutage: downWrites.length,
	outage503: downWrites.filter((w) => w.status === 503).length,
	outageMedianMs: downLatency[Math.floor(downLatency.length / 2)] ?? null,
	outageMaxMs: downLatency.at(-1) ?? null,
	healthzDuringOutage: health.status,
	recoveryMs,
	retriedStored: retried.length - retriedMissing.length,
	duplicates: duplicates.length,
	serverErrors: serverErrors.length
};
console.log(JSON.stringify(tally, null, 2));

const problems = [];
if (lost.length) problems.push(`${lost.length} acknowledged writes are not stored`);
if (!downWrites.length) problems.push('no write was attempted while the database was down');
if (wrongDown.length)
	problems.push(`${wrongDown.length} writes during the outage did not get 503 with Retry-After (${[...new Set(wrongDown.map((w) => w.status))]})`);
if (slowFailures.length) problems.push(`${slowFailures.length} failed writes took over ${FAST_MS} ms`);
if (serverErrors.length) problems.push(`${serverErrors.length} answers were 5xx other than 503`);
if (recoveryMs > RECOVERY_MS) problems.push(`writes succeeded again only after ${recoveryMs} ms`);
if (health.status !== 503 || health.body?.database !== 'down') problems.push(`/healthz during the outage answered ${health.status}`);
if (retriedMissing.length) problems.push(`${retriedMissing.length} retried writes failed after recovery`);
if (duplicates.length) problems.push(`${duplicates.length} plans were stored twice`);
const byKind = (list) => {
	const groups = new Map();
	for (const w of list) {
		const k = `${w.phase} ${w.status}${w.error ? ` ${w.error}` : ''}`;
		groups.set(k, (groups.get(k) ?? []).concat(w));
	}
	return [...groups].map(([k, v]) => `${k}: ${v.length} (max ${Math.max(...v.map((w) => w.t1 - w.t0))} ms)`);
};
if (problems.length) console.error('failed writes by phase and status:', byKind(failed), 'retries:', byKind(retriedMissing));
for (const p of problems) console.error(`✖ ${p}`);
if (!problems.length) log('Fault drill passed');
process.exit(problems.length ? 1 : 0);
