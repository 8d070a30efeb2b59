// Hostile bodies against every JSON route and every form action of the built app: wrong types,
// huge arrays, deep nesting, NaN/Infinity, control characters, lone surrogates, invalid UTF-8 and
// 20 MB. Never a 5xx; every 4xx carries a message. FUZZ_RUNS sets the number of cases
// (npm run fuzz runs 10 000 and prints the tally).
import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { expect, test, type APIRequestContext } from '@playwright/test';
import { demoPassword, demoUser } from './helpers';

const RUNS = Number(process.env.FUZZ_RUNS ?? 1000);

/** Every form action in the routes folder, as [path, action name]. */
function formActions(): { route: string; action: string }[] {
	const out: { route: string; action: string }[] = [];
	const walk = (dir: string) => {
		for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
			const p = path.join(dir, e.name);
			if (e.isDirectory()) walk(p);
			else if (e.name === '+page.server.ts') {
				const text = fs.readFileSync(p, 'utf8');
				const block = text.split('export const actions')[1];
				if (!block) continue;
				const body = block.slice(0, block.search(/\n\}/));
				const route = path
					.dirname(path.relative('src/routes', p))
					.replace(/\([^)]*\)\/?/g, '')
					.replace(/\/$/, '');
				for (const m of body.matchAll(/^\t(\w+)\s*[:(]/gm)) out.push({ route: `/${route}`.replace(/\/$/, '') || '/', action: m[1] });
			}
		}
	};
	walk('src/routes');
	return out;
}

const unit = fc.constantFrom('a', 'Z', '0', ' ', '\u0000', '\u0001', '\u001f', '\u007f', '\u202e', '\ufeff', '\ud800', '\udfff', '😀', '"', '\\', '<', '%');
const hostileString = fc.oneof(fc.string({ unit, maxLength: 60 }), fc.string({ maxLength: 40 }), fc.constant('x'.repeat(10_000)));
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
	hostileString,
	fc.double(),
	fc.integer(),
	fc.boolean(),
	fc.constant(null),
	fc.array(fc.integer(), { maxLength: 5 }),
	fc.integer({ min: 1000, max: 5000 }).map((n) => Array.from({ length: n }, (_, i) => [i, i])),
	fc.jsonValue({ maxDepth: 4 })
);

/** Raw JSON request bodies, some not JSON at all. */
const jsonBody = fc.oneof(
	fc.dictionary(fc.constantFrom('name', 'postcode', 'input', 'revision', 'units', 'sections', 'records', 'x'), hostileValue).map((o) => JSON.stringify(o)),
	// Pour-log records: the right shape with hostile fields, and more of them than one request takes.
	fc
		.array(
			fc.record(
				{
					kind: fc.oneof(fc.constantFrom('start', 'batch', 'undo', 'end', 'bags', 'temp', 'note'), hostileString),
					key: fc.oneof(hostileString, fc.constant('fuzz-key-0001')),
					at: hostileValue,
					tz: hostileValue,
					pour: hostileValue,
					bags: hostileValue,
					date: hostileValue,
					unit: fc.oneof(fc.constantFrom('C', 'F'), hostileValue),
					low: hostileValue,
					high: hostileValue,
					reading: hostileValue,
					time: hostileValue,
					text: hostileValue,
					of: hostileValue
				},
				{ requiredKeys: ['kind'] }
			),
			{ maxLength: 60 }
		)
		.map((records) => JSON.stringify({ records })),
	fc.record({ name: hostileString, input: fc.record({ units: hostileValue, sections: hostileValue }) }).map((o) => JSON.stringify(o)),
	fc.integer({ min: 100, max: 5000 }).map((n) => '['.repeat(n) + ']'.repeat(n)),
	fc.integer({ min: 100, max: 5000 }).map((n) => '{"a":'.repeat(n) + '1' + '}'.repeat(n)),
	fc.constantFrom(
		'NaN',
		'{"name":Infinity}',
		'{"revision":-Infinity}',
		'{"name":NaN}',
		'',
		'{',
		'null',
		'"\\ud800"',
		'{"name":"\\u0000"}',
		'{"name":"a\\udc00"}'
	),
	fc.anything().map((v) => {
		try {
			return JSON.stringify(v) ?? 'undefined';
		} catch {
			return 'x';
		}
	})
);

/** Raw urlencoded form bodies: hostile values, unknown keys, invalid percent-escapes and UTF-8. */
const formField = fc.constantFrom(
	'name',
	'email',
	'password',
	'newPassword',
	'current',
	'token',
	'message',
	'body',
	'note',
	'amount',
	'price',
	'days',
	'id',
	'planId',
	'leadId',
	'photoId',
	'postcode',
	'zips',
	'services',
	'redirectTo',
	'role',
	'reason',
	'x'
);
const formValue = fc.oneof(
	hostileString.map((s) => encodeURIComponent(s.replace(/[\ud800-\udfff]/g, '\u0000'))),
	fc.constantFrom('%ED%A0%80', '%FF%FE', '%', '%zz', '%00', '%C0%80', 'NaN', 'Infinity', '-1e309', '1e309', '0x10', ''),
	fc.integer({ min: 1000, max: 20_000 }).map((n) => 'a'.repeat(n))
);
const formBody = fc.array(fc.tuple(formField, formValue), { maxLength: 12 }).map((kv) => kv.map(([k, v]) => `${k}=${v}`).join('&'));

type Actor = 'anon' | 'homeowner' | 'contractor' | 'admin';
const actorFor = (route: string): Actor =>
	route.startsWith('/admin') ? 'admin' : route.startsWith('/pro') ? 'contractor' : /^\/(plans|account|messages)/.test(route) ? 'homeowner' : 'anon';

async function signedIn(playwright: typeof import('@playwright/test').request, baseURL: string, who: Actor): Promise<APIRequestContext> {
	const ctx = await playwright.newContext({ baseURL });
	if (who === 'anon') return ctx;
	const user = who === 'contractor' ? demoUser('contractor') : demoUser(who);
	await ctx.post('/signin', { form: { email: user.email, password: demoPassword }, headers: { origin: baseURL } });
	return ctx;
}

/** Whether a 4xx answer says what was wrong. */
function hasMessage(text: string): boolean {
	return /message|errors|limit|exceeds|not allowed|invalid|sign in|signin|Error \d{3}/i.test(text);
}

test('hostile bodies never give a 5xx and every 4xx says why', async ({ playwright, baseURL }) => {
	test.setTimeout(Math.max(300_000, RUNS * 300));
	const base = baseURL!;
	const contexts = new Map<Actor, APIRequestContext>();
	const as = async (who: Actor) => contexts.get(who) ?? contexts.set(who, await signedIn(playwright.request, base, who)).get(who)!;

	const home = await as('homeowner');
	const { plans } = await (await home.get('/api/plans')).json();
	const planId: string = plans[0].id;
	const fill = (route: string) =>
		route.replace('[id=uuid]', route.startsWith('/plans') ? planId : crypto.randomUUID()).replace(/\[\w+=uuid\]/g, () => crypto.randomUUID());

	const targets = [
		...[
			{ name: 'POST /api/estimate', method: 'POST', url: '/api/estimate', who: 'anon' as Actor },
			{ name: 'POST /api/plans', method: 'POST', url: '/api/plans', who: 'homeowner' as Actor },
			{ name: 'PATCH /api/plans/[id]', method: 'PATCH', url: `/api/plans/${planId}`, who: 'homeowner' as Actor },
			{ name: 'POST /plans/[id]/pour/records', method: 'POST', url: `/plans/${planId}/pour/records`, who: 'homeowner' as Actor }
		].map((t) => ({ ...t, kind: 'json' as const })),
		...formActions().map(({ route, action }) => ({
			name: `${route}?/${action}`,
			method: 'POST',
			url: action === 'default' ? fill(route) : `${fill(route)}?/${action}`,
			who: actorFor(route),
			kind: 'form' as const
		}))
	];
	expect(targets.length).toBeGreaterThan(20);

	const tally = new Map<string, number>();
	const failures: string[] = [];
	const send = async (t: (typeof targets)[number], body: string) => {
		const ctx = await as(t.who);
		const headers: Record<string, string> =
			t.kind === 'json'
				? { 'content-type': 'application/json', origin: base, 'x-forwarded-for': `10.${Math.floor(Math.random() * 255)}.0.1` }
				: { 'content-type': 'application/x-www-form-urlencoded', origin: base, accept: 'application/json', 'x-sveltekit-action': 'true' };
		let res;
		try {
			res = await ctx.fetch(t.url, { method: t.method, data: Buffer.from(body, 'utf8'), headers, maxRedirects: 0 });
		} catch (err) {
			// The server answered (a redirect, a refusal) before reading a large body and closed the
			// connection: no 5xx, and the client sees a reset. Counted apart; anything else fails.
			if (!/ECONNRESET|EPIPE/.test(String(err))) throw err;
			tally.set('reset', (tally.get('reset') ?? 0) + 1);
			return;
		}
		const status = res.status();
		const key = `${Math.floor(status / 100)}xx`;
		tally.set(key, (tally.get(key) ?? 0) + 1);
		if (status >= 500) failures.push(`${t.name} → ${status} for ${JSON.stringify(body.slice(0, 120))} (${body.length} chars)`);
		else if (status >= 400) {
			const text = await res.text();
			if (!hasMessage(text)) failures.push(`${t.name} → ${status} without a message: ${text.slice(0, 120)}`);
		}
	};

	// 20 MB once per target: refused before it is read, with a 4xx.
	const huge = 'a'.repeat(20 * 1024 * 1024);
	for (const t of targets.filter((t) => t.kind === 'json' || t.name === '/signup?/default')) await send(t, huge);
	// Naming the reserved default action is refused, not a crash.
	await send({ ...targets.find((t) => t.name === '/signin?/default')!, url: '/signin?/default' }, 'email=a');

	await fc.assert(
		fc.asyncProperty(fc.nat({ max: targets.length - 1 }), jsonBody, formBody, async (i, json, form) => {
			const t = targets[i];
			await send(t, t.kind === 'json' ? json : form);
			return true;
		}),
		{ numRuns: RUNS, seed: process.env.FUZZ_SEED ? Number(process.env.FUZZ_SEED) : undefined }
	);
	for (const c of contexts.values()) await c.dispose();
	console.log(`fuzz: ${RUNS} cases over ${targets.length} targets;`, Object.fromEntries([...tally].sort()));
	expect(failures.slice(0, 20), failures.join('\n')).toEqual([]);
});
