// The kill drill: a bounded autocannon run through nginx while one app server is killed (SIGKILL,
// as a crash). Used by `npm run cluster:fault` (long) and tests/cluster.e2e.ts (short). Checks:
//   - nginx sends the rest of the run to the survivor (requests succeed after the kill),
//   - every acknowledged write (201 with the new plan's id) is a row in PostgreSQL,
//   - the only failures are writes that were in flight on the killed server (502 naming it, answered
//     within a moment of the kill, at most one per connection); reads are retried by nginx;
//   - a client retrying those writes with their Idempotency-Key gets each stored exactly once.
import { hash } from '@node-rs/argon2';
import autocannon from 'autocannon';
import postgres from 'postgres';
import { smallSlab as input } from './plans.mjs';

/**
 * Signs a homeowner in through nginx; returns the session cookie.
 * @param {string} base @param {string} email @param {string} password
 */
async function signIn(base, email, password) {
	const res = await fetch(`${base}/signin`, {
		method: 'POST',
		redirect: 'manual',
		headers: { origin: base, accept: 'text/html', 'content-type': 'application/x-www-form-urlencoded' },
		body: new URLSearchParams({ email, password })
	});
	const cookie = (res.headers.getSetCookie?.() ?? []).map((c) => c.split(';')[0]).find((c) => c.startsWith('stakeline_session='));
	if (res.status !== 303 || !cookie) throw new Error(`Signing in ${email} through nginx answered ${res.status} without a session`);
	return cookie;
}

/**
 * @param {{
 *   cluster: { url: string, apps: { port: number, name: string }[], kill: (i: number) => Promise<unknown> },
 *   databaseUrl: string,
 *   durationS: number, killAfterS: number, connections: number, victim?: number
 * }} o
 */
export async function killDrill(o) {
	const { cluster } = o;
	const base = cluster.url;
	const victim = o.victim ?? cluster.apps.length - 1;
	const victimAddress = `127.0.0.1:${cluster.apps[victim].port}`;
	const run = `${Date.now().toString(36)}-${process.pid}`;
	// A homeowner of its own, so the drill's hundreds of plans never land in anyone else's list.
	const email = `kill-drill-${run}@drill.stakeline.test`;
	const password = `drill-${run}-password`;
	const setup = postgres(o.databaseUrl, { max: 1, onnotice: () => {} });
	try {
		await setup`INSERT INTO "user" (email, name, role, password_hash, email_verified_at)
			VALUES (${email}, 'Kill Drill', 'homeowner', ${await hash(password)}, now())`;
	} finally {
		await setup.end();
	}
	const cookie = await signIn(base, email, password);
	const headers = { cookie, origin: base, 'content-type': 'application/json' };
	const first = await fetch(`${base}/api/plans`, { method: 'POST', headers, body: JSON.stringify({ name: `Kill drill ${run} first`, input }) });
	if (first.status !== 201) throw new Error(`Creating a plan through nginx answered ${first.status}: ${await first.text()}`);
	const readPath = `/api/plans/${(await first.json()).plan.id}`;

	let seq = 0;
	let killedAt = Infinity;
	const t0 = Date.now();
	/**
	 * One entry per answer: what was asked, when it was answered, what came back and from which server.
	 * @typedef {{ kind: 'write' | 'read', name: string, key: string, status: number, at: number, upstream: string, id?: string | null }} Answer
	 * @type {Answer[]}
	 */
	const answers = [];
	/** @param {'write' | 'read'} kind @returns {(status: number, body: string, context: Record<string, unknown>, resHeaders: Record<string, string | string[]>) => void} */
	const record = (kind) => (status, body, context, resHeaders) => {
		// Header names arrive as sent (X-Stakeline-Upstream).
		const upstreamHeader = Object.entries(resHeaders ?? {}).find(([k]) => k.toLowerCase() === 'x-stakeline-upstream')?.[1];
		/** @type {Answer} */
		const entry = { kind, name: String(context.name), key: String(context.key), status, at: Date.now(), upstream: String(upstreamHeader ?? '') };
		if (kind === 'write' && status === 201) {
			try {
				entry.id = JSON.parse(body).plan.id;
			} catch {
				entry.id = null;
			}
		}
		answers.push(entry);
	};

	const load = autocannon({
		url: base,
		connections: o.connections,
		duration: o.durationS,
		timeout: 20,
		headers,
		requests: [
			{
				method: 'POST',
				path: '/api/plans',
				setupRequest: (req, context) => {
					const n = seq++;
					context.name = `Kill drill ${run} ${n}`;
					context.key = `kill-${run}-${n}`;
					return { ...req, headers: { ...req.headers, 'idempotency-key': String(context.key) }, body: JSON.stringify({ name: context.name, input }) };
				},
				onResponse: record('write')
			},
			{ method: 'GET', path: readPath, onResponse: record('read') }
		]
	});
	const killer = new Promise((resolve) =>
		setTimeout(() => {
			killedAt = Date.now();
			resolve(cluster.kill(victim));
		}, o.killAfterS * 1000)
	);
	const result = await load;
	await killer;

	const sql = postgres(o.databaseUrl, { max: 1, onnotice: () => {} });
	const drillRows = () => sql`select id, name from plan where name like ${`Kill drill ${run} %`} and name <> ${`Kill drill ${run} first`}`;
	let rows, retried, afterRetry;
	try {
		rows = await drillRows();
		// As a client would: each failed write sent again with its key, now that only the survivor is up.
		retried = [];
		for (const w of answers.filter((a) => a.kind === 'write' && a.status !== 201)) {
			const res = await fetch(`${base}/api/plans`, {
				method: 'POST',
				headers: { ...headers, 'idempotency-key': w.key },
				body: JSON.stringify({ name: w.name, input })
			});
			retried.push({ ...w, retryStatus: res.status });
		}
		afterRetry = await drillRows();
	} finally {
		await sql.end();
	}
	const answeredNames = new Set(answers.map((a) => a.name));
	const perName = new Map();
	for (const r of afterRetry) perName.set(r.name, (perName.get(r.name) ?? 0) + 1);
	const duplicates = [...perName.values()].filter((c) => c > 1).length;
	const retriedMissing = retried.filter((w) => !perName.has(w.name));
	const storedIds = new Set(rows.map((r) => r.id));
	const writes = answers.filter((a) => a.kind === 'write');
	const reads = answers.filter((a) => a.kind === 'read');
	const acked = writes.filter((a) => a.status === 201 && a.id);
	const lost = acked.filter((a) => !storedIds.has(a.id));
	const failed = answers.filter((a) => a.status < 200 || a.status >= 300);
	// In flight on the killed server: a write nginx had already passed to it, answered 502 naming it,
	// within two seconds of the kill.
	const inFlight = (/** @type {Answer} */ a) =>
		a.kind === 'write' && a.status === 502 && a.upstream.startsWith(victimAddress) && a.at >= killedAt && a.at - killedAt <= 2000;
	const otherFailures = failed.filter((a) => !inFlight(a));
	const afterKill = answers.filter((a) => a.at > killedAt + 2000);
	const survivorAnswers = afterKill.filter((a) => a.status >= 200 && a.status < 300);
	const servedByVictimAfter = afterKill.filter((a) => a.upstream.split(', ').at(-1) === victimAddress && a.status < 400);

	const figures = {
		seconds: o.durationS,
		connections: o.connections,
		killedServerAfterS: Number(((killedAt - t0) / 1000).toFixed(1)),
		requests: answers.length,
		requestsPerSecond: Math.round(answers.length / o.durationS),
		latencyP50Ms: result.latency.p50,
		latencyP99Ms: result.latency.p99,
		writesAnswered: writes.length,
		writesAcknowledged: acked.length,
		acknowledgedStored: acked.length - lost.length,
		rowsStored: rows.length,
		// Rows whose request autocannon was still waiting for when the run ended (it drops those answers).
		storedStillInFlightAtEnd: rows.filter((r) => !answeredNames.has(r.name)).length,
		// A write answered 502 whose row exists anyway: the server died after the commit.
		failedButStored: writes.filter((a) => a.status !== 201 && rows.some((r) => r.name === a.name)).length,
		readsAnswered: reads.length,
		readsFailed: reads.filter((a) => a.status !== 200).length,
		failedInFlightOnKilled: failed.length - otherFailures.length,
		otherFailures: otherFailures.length,
		retriedWithKey: retried.length,
		retriedStoredOnce: retried.filter((w) => perName.get(w.name) === 1).length,
		retryAnswers: [...new Set(retried.map((w) => w.retryStatus))].join(' ') || null,
		duplicatesAfterRetry: duplicates,
		socketErrors: result.errors,
		timeouts: result.timeouts,
		answeredBySurvivorAfterKill: survivorAnswers.length
	};

	const problems = [];
	if (lost.length) problems.push(`${lost.length} acknowledged writes are not in the database`);
	if (otherFailures.length)
		problems.push(`${otherFailures.length} failures other than writes in flight on the killed server: ${JSON.stringify(otherFailures.slice(0, 5))}`);
	if (failed.length - otherFailures.length > o.connections) problems.push(`${failed.length} failures, more than one per connection`);
	if (result.errors || result.timeouts) problems.push(`${result.errors} connection errors and ${result.timeouts} timeouts between the client and nginx`);
	if (!survivorAnswers.length) problems.push('nothing was answered after the kill: nginx did not move to the survivor');
	if (servedByVictimAfter.length) problems.push(`${servedByVictimAfter.length} answers came from the killed server after the kill`);
	if (!acked.length) problems.push('no write was acknowledged');
	if (retriedMissing.length) problems.push(`${retriedMissing.length} failed writes were not stored after a retry with their key`);
	if (duplicates) problems.push(`${duplicates} plans were stored twice after retrying with the same key`);
	return { figures, problems };
}
