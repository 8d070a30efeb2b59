// The kill drill: a bounded autocannon run through nginx while one app server is killed (SIGKILL,
// as a crash). Used by `npm run cluster:fault` (long) and tests/cluster.e2e.ts (short). Checks:
//   - nginx sends the rest of the run to the survivor (requests succeed after the kill),
//   - every acknowledged write (201 with the new plan's id) is a row in PostgreSQL,
//   - the only failures are writes that were in flight on the killed server (502 naming it, answered
//     within a moment of the kill, at most one per connection); reads are retried by nginx.
import autocannon from 'autocannon';
import postgres from 'postgres';

/** A small square slab: a valid plan the engine computes quickly. */
const input = { units: 'imperial', sections: [{ outline: [[0, 0], [12, 0], [12, 10], [0, 10]] }] };

/** Signs the demo homeowner in through nginx; returns the session cookie. */
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
 *   databaseUrl: string, email: string, password: string,
 *   durationS: number, killAfterS: number, connections: number, victim?: number
 * }} o
 */
export async function killDrill(o) {
	const { cluster } = o;
	const base = cluster.url;
	const victim = o.victim ?? cluster.apps.length - 1;
	const victimAddress = `127.0.0.1:${cluster.apps[victim].port}`;
	const cookie = await signIn(base, o.email, o.password);
	const headers = { cookie, origin: base, 'content-type': 'application/json' };
	const run = `${Date.now().toString(36)}-${process.pid}`;
	const first = await fetch(`${base}/api/plans`, { method: 'POST', headers, body: JSON.stringify({ name: `Kill drill ${run} first`, input }) });
	if (first.status !== 201) throw new Error(`Creating a plan through nginx answered ${first.status}: ${await first.text()}`);
	const readPath = `/api/plans/${(await first.json()).plan.id}`;

	let seq = 0;
	let killedAt = Infinity;
	const t0 = Date.now();
	/** One entry per answer: what was asked, when it was answered, what came back and from which server. */
	const answers = [];
	const record = (kind) => (status, body, context, resHeaders) => {
		// Header names arrive as sent (X-Stakeline-Upstream).
		const upstreamHeader = Object.entries(resHeaders ?? {}).find(([k]) => k.toLowerCase() === 'x-stakeline-upstream')?.[1];
		const entry = { kind, name: context.name, status, at: Date.now(), upstream: String(upstreamHeader ?? '') };
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
					context.name = `Kill drill ${run} ${seq++}`;
					return { ...req, body: JSON.stringify({ name: context.name, input }) };
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
	let rows;
	try {
		rows = await sql`select id, name from plan where name like ${`Kill drill ${run} %`} and name <> ${`Kill drill ${run} first`}`;
	} finally {
		await sql.end();
	}
	const storedIds = new Set(rows.map((r) => r.id));
	const writes = answers.filter((a) => a.kind === 'write');
	const reads = answers.filter((a) => a.kind === 'read');
	const acked = writes.filter((a) => a.status === 201 && a.id);
	const lost = acked.filter((a) => !storedIds.has(a.id));
	const failed = answers.filter((a) => a.status < 200 || a.status >= 300);
	// In flight on the killed server: a write nginx had already passed to it, answered 502 naming it,
	// within two seconds of the kill.
	const inFlight = (a) => a.kind === 'write' && a.status === 502 && a.upstream.startsWith(victimAddress) && a.at >= killedAt && a.at - killedAt <= 2000;
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
		storedButNotAcknowledged: rows.length - (acked.length - lost.length),
		readsAnswered: reads.length,
		readsFailed: reads.filter((a) => a.status !== 200).length,
		failedInFlightOnKilled: failed.length - otherFailures.length,
		otherFailures: otherFailures.length,
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
	return { figures, problems };
}
