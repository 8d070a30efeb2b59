// Times sign-up and password-reset answers for addresses with and without an account, against a
// running app, to check that the time does not tell them apart. The app must read the client's
// address from X-Forwarded-For (ADDRESS_HEADER=x-forwarded-for XFF_DEPTH=1) so the per-client mail
// limit does not stop the run:
//   ADDRESS_HEADER=x-forwarded-for XFF_DEPTH=1 node build &   (with the usual npm test settings)
//   node scripts/measure-enumeration.mjs http://127.0.0.1:3100 [rounds]
const base = process.argv[2] ?? 'http://127.0.0.1:3100';
const rounds = Number(process.argv[3] ?? 15);
const run = Date.now();
let n = 0;

async function post(path, fields) {
	const t = performance.now();
	const res = await fetch(base + path, {
		method: 'POST',
		redirect: 'manual',
		headers: { accept: 'text/html', 'content-type': 'application/x-www-form-urlencoded', origin: base, 'x-forwarded-for': `192.0.2.${n++ % 250}` },
		body: new URLSearchParams(fields)
	});
	await res.arrayBuffer();
	return { ms: performance.now() - t, status: res.status };
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const row = (label, samples) =>
	console.log(
		`${label.padEnd(40)} median ${median(samples.map((s) => s.ms))
			.toFixed(1)
			.padStart(6)} ms  statuses ${[...new Set(samples.map((s) => s.status))].join(',')}`
	);

const emails = Array.from({ length: rounds }, (_, i) => `timing-${run}-${i}@measure.stakeline.test`);
const signUp = (email) => post('/signup', { name: 'Timing Check', email, password: 'timing-password-1', role: 'homeowner' });
const fresh = [];
const taken = [];
const confirmed = [];
// Addresses with a confirmed account: the demo accounts (loaded into the local cluster).
const demo = JSON.parse(await import('node:fs').then((fs) => fs.readFileSync(new URL('../fixtures/demo.json', import.meta.url), 'utf8')));
// Interleaved, so load on the machine affects all sides alike.
for (const [i, email] of emails.entries()) {
	fresh.push(await signUp(email));
	taken.push(await signUp(email));
	confirmed.push(await signUp(demo.users[i % demo.users.length].email));
}
const resetKnown = [];
const resetUnknown = [];
for (const [i, email] of emails.entries()) {
	resetKnown.push(await post('/forgot-password', { email }));
	resetUnknown.push(await post('/forgot-password', { email: `nobody-${run}-${i}@measure.stakeline.test` }));
}
row('sign-up, new address', fresh);
row('sign-up, taken, not yet confirmed', taken);
row('sign-up, taken, confirmed account', confirmed);
row('reset, address has an account', resetKnown);
row('reset, no such account', resetUnknown);
