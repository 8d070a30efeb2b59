// Authorization matrix: every page, form action and API route found in src/routes, asked by each
// kind of visitor over HTTP against the built app, with the status each must get. A route found
// in the folder without a row here fails the test, and the message gives the row to add.
//
// Actors, in the order of x(...) below:
//   anon       signed out
//   ownerA     homeowner who owns plan A (with a photo, a lead, a bid and a message)
//   ownerB     another homeowner, with plan B and its photo
//   pending    contractor awaiting review
//   withLead   approved contractor holding the lead on plan A (and its bid)
//   noLead     approved contractor without it
//   suspended  suspended contractor
//   admin      the demo admin
//
// In a URL or body: {planA} {planB} {photoA} {photoB} {leadA} {bidA} {random} (a fresh uuid),
// {doc.<contractor actor>}, {user.<actor>}, {myPlan} (plan B for ownerB, else plan A) and
// {otherPlan} (plan B for ownerA, else plan A).
// Form actions are posted as the enhanced form does (x-sveltekit-action); the status checked is the
// action's own (a failure's status, a redirect's 303, a thrown error's status, 200 for success).
// Authorised actors mostly get a 400 from an empty body: the check passed and nothing changed.
import fs from 'node:fs';
import path from 'node:path';
import { expect, test, type APIRequestContext } from '@playwright/test';
import { actors, setUpMatrix, stillThere, type Actor, type Fixtures } from './authz-fixtures';

type Expect = Record<Actor, number>;
type Row = { url: string; method?: string; form?: Record<string, string>; json?: unknown; expect: Expect; last?: boolean };

/** Statuses in actor order: anon, ownerA, ownerB, pending, withLead, noLead, suspended, admin. */
const x = (...s: number[]): Expect => {
	if (s.length !== actors.length) throw new Error(`x() takes ${actors.length} statuses, got ${s.length}`);
	return Object.fromEntries(actors.map((a, i) => [a, s[i]])) as Expect;
};
/** One status for every actor: a route that does not tell them apart. */
const everyone = (s: number): Expect => x(...actors.map(() => s));
const r = (url: string, expect: Expect, more: Omit<Row, 'url' | 'expect'> = {}): Row => ({ url, expect, ...more });

const bid = { total: '2500', earliestStart: '2099-01-01', durationDays: '2', validUntil: '2099-02-01' };

// One entry per route as found in src/routes: "METHOD /path" for pages (GET) and +server.ts
// handlers, "POST /path?/action" for form actions ("POST /path" for a default action).
const matrix: Record<string, Row[]> = {
	'GET /': [r('/', everyone(200))],
	'GET /healthz': [r('/healthz', everyone(200))],
	'GET /dev/mailbox': [r('/dev/mailbox?to=nobody.example', everyone(200))],

	// Account pages
	'GET /signin': [r('/signin', x(200, 303, 303, 303, 303, 303, 303, 303))],
	'POST /signin': [r('/signin', everyone(400), { form: {} })],
	'GET /signin/link': [r('/signin/link', x(200, 303, 303, 303, 303, 303, 303, 303))],
	'POST /signin/link?/send': [r('/signin/link?/send', everyone(400), { form: {} })],
	'POST /signin/link?/use': [r('/signin/link?/use', everyone(400), { form: {} })],
	'GET /signup': [r('/signup', x(200, 303, 303, 303, 303, 303, 303, 303))],
	'POST /signup': [r('/signup', everyone(400), { form: {} })],
	'GET /signout': [r('/signout', x(303, 200, 200, 200, 200, 200, 200, 200))],
	'POST /signout': [r('/signout', everyone(303), { form: {}, last: true })],
	'GET /forgot-password': [r('/forgot-password', everyone(200))],
	'POST /forgot-password': [r('/forgot-password', everyone(400), { form: {} })],
	'GET /reset-password': [r('/reset-password', everyone(200))],
	'POST /reset-password': [r('/reset-password', everyone(400), { form: {} })],
	'GET /verify-email': [r('/verify-email', everyone(200))],
	'POST /verify-email': [r('/verify-email', everyone(400), { form: { token: 'not-a-token' } })],
	'GET /account': [r('/account', x(303, 200, 200, 200, 200, 200, 200, 200))],
	'POST /account?/password': [r('/account?/password', x(303, 400, 400, 400, 400, 400, 400, 400), { form: {} })],
	'POST /account?/email': [r('/account?/email', x(303, 400, 400, 400, 400, 400, 400, 400), { form: {} })],
	// An empty form turns every optional e-mail off for that account; statuses are all this test reads.
	'POST /account?/notices': [r('/account?/notices', x(303, 200, 200, 200, 200, 200, 200, 200), { form: {} })],
	// The distance unit is a contractor's setting.
	'POST /account?/distance': [r('/account?/distance', x(303, 403, 403, 400, 400, 400, 400, 403), { form: {} })],
	// The e-mail-change link: a page anyone may open; confirming without a valid token is refused.
	'GET /confirm-email': [r('/confirm-email', everyone(200))],
	'POST /confirm-email': [r('/confirm-email', everyone(400), { form: {} })],
	'POST /account?/resend': [r('/account?/resend', x(303, 400, 400, 400, 400, 400, 400, 400), { form: {} })],
	'GET /messages': [r('/messages', x(303, 200, 200, 200, 200, 200, 200, 403))],

	// Homeowner plans: someone else's plan, lead, bid or photo is "not found"
	'GET /plans/new': [r('/plans/new', x(200, 200, 200, 403, 403, 403, 403, 403))],
	'GET /plans': [r('/plans', x(303, 200, 200, 403, 403, 403, 403, 403))],
	'POST /plans?/rename': [
		r('/plans?/rename', x(303, 400, 400, 403, 403, 403, 403, 403), { form: {} }),
		r('/plans?/rename', x(303, 404, 404, 403, 403, 403, 403, 403), { form: { id: '{otherPlan}', name: 'Taken over' } })
	],
	'POST /plans?/duplicate': [r('/plans?/duplicate', x(303, 404, 404, 403, 403, 403, 403, 403), { form: { id: '{otherPlan}' } })],
	'POST /plans?/delete': [
		r('/plans?/delete', x(303, 409, 404, 403, 403, 403, 403, 403), { form: { id: '{planA}' } }),
		r('/plans?/delete', x(303, 404, 404, 403, 403, 403, 403, 403), { form: { id: '{otherPlan}' } })
	],
	'GET /plans/[id]': [r('/plans/{planA}', x(303, 200, 404, 403, 403, 403, 403, 403))],
	'GET /plans/[id]/edit': [r('/plans/{planA}/edit', x(303, 200, 404, 403, 403, 403, 403, 403))],
	'POST /plans/[id]?/upload': [r('/plans/{planA}?/upload', x(303, 400, 404, 403, 403, 403, 403, 403), { form: {} })],
	'POST /plans/[id]?/deletePhoto': [
		r('/plans/{planA}?/deletePhoto', x(303, 404, 404, 403, 403, 403, 403, 403), { form: { photoId: '{random}' } }),
		// Each owner's own plan id with the other's photo, and the other's plan id: all missing, both photos stay.
		r('/plans/{planA}?/deletePhoto', x(303, 404, 404, 403, 403, 403, 403, 403), { form: { photoId: '{photoB}' } }),
		r('/plans/{planB}?/deletePhoto', x(303, 404, 404, 403, 403, 403, 403, 403), { form: { photoId: '{photoA}' } })
	],
	'POST /plans/[id]/photos': [r('/plans/{planA}/photos', x(401, 400, 404, 403, 403, 403, 403, 403), { form: {} })],
	'GET /plans/[id]/photos/[photoId]': [
		r('/plans/{planA}/photos/{photoA}', x(401, 200, 404, 403, 403, 403, 403, 403)),
		r('/plans/{myPlan}/photos/{photoA}', x(401, 200, 404, 403, 403, 403, 403, 403))
	],
	'GET /plans/[id]/photos/[photoId]/thumb': [
		r('/plans/{planA}/photos/{photoA}/thumb', x(401, 200, 404, 403, 403, 403, 403, 403)),
		r('/plans/{myPlan}/photos/{photoA}/thumb', x(401, 200, 404, 403, 403, 403, 403, 403))
	],
	'GET /plans/[id]/pour': [r('/plans/{planA}/pour', x(303, 200, 404, 403, 403, 403, 403, 403))],
	'GET /plans/[id]/sheets': [r('/plans/{planA}/sheets', x(303, 200, 404, 403, 403, 403, 403, 403))],
	'POST /plans/[id]/pour/records': [
		r('/plans/{planA}/pour/records', x(401, 400, 404, 403, 403, 403, 403, 403), { json: {} }),
		// A well-formed record for the other owner's plan: not found, nothing stored.
		r('/plans/{otherPlan}/pour/records', x(401, 404, 404, 403, 403, 403, 403, 403), {
			json: { records: [{ kind: 'note', key: 'matrix-note-1', at: 1800000000000, tz: 0, text: 'Matrix note' }] }
		})
	],
	'GET /plans/[id]/plan.pdf': [r('/plans/{planA}/plan.pdf', x(401, 200, 404, 403, 403, 403, 403, 403))],
	'GET /plans/[id]/plan.ics': [r('/plans/{planA}/plan.ics', x(401, 200, 404, 403, 403, 403, 403, 403))],
	// An empty form is the switch unticked: reminders off for the owner's own plan.
	'POST /plans/[id]?/reminders': [r('/plans/{planA}?/reminders', x(303, 200, 404, 403, 403, 403, 403, 403), { form: {} })],
	// The stop link in a reminder e-mail: no sign-in, the signed token is the only key.
	'GET /reminders/stop': [r('/reminders/stop?token=not-a-token', everyone(200))],
	'POST /reminders/stop': [r('/reminders/stop', everyone(400), { form: { token: 'not-a-token' } })],
	'GET /plans/[id]/bids': [r('/plans/{planA}/bids', x(303, 200, 404, 403, 403, 403, 403, 403))],
	'POST /plans/[id]/bids?/send': [r('/plans/{planA}/bids?/send', x(303, 400, 404, 403, 403, 403, 403, 403), { form: {} })],
	'POST /plans/[id]/bids?/announce': [r('/plans/{planA}/bids?/announce', x(303, 200, 404, 403, 403, 403, 403, 403), { form: {} })],
	'POST /plans/[id]/bids?/accept': [
		r('/plans/{planA}/bids?/accept', x(303, 400, 404, 403, 403, 403, 403, 403), { form: {} }),
		// Plan B's page, plan A's bid.
		r('/plans/{planB}/bids?/accept', x(303, 404, 404, 403, 403, 403, 403, 403), {
			form: { bid: '{bidA}', siteAddress: '12 Alder Street, Albany', phone: '(541) 555-0100' }
		})
	],
	'POST /plans/[id]/bids?/done': [r('/plans/{planA}/bids?/done', x(303, 409, 404, 403, 403, 403, 403, 403), { form: {} })],
	'POST /plans/[id]/bids?/reopen': [r('/plans/{planA}/bids?/reopen', x(303, 409, 404, 403, 403, 403, 403, 403), { form: {} })],
	'GET /plans/[id]/bids/[leadId]': [
		r('/plans/{planA}/bids/{leadA}', x(303, 200, 404, 403, 403, 403, 403, 403)),
		r('/plans/{myPlan}/bids/{leadA}', x(303, 200, 404, 403, 403, 403, 403, 403))
	],
	'POST /plans/[id]/bids/[leadId]?/message': [
		r('/plans/{planA}/bids/{leadA}?/message', x(303, 400, 404, 403, 403, 403, 403, 403), { form: {} }),
		r('/plans/{myPlan}/bids/{leadA}?/message', x(303, 200, 404, 403, 403, 403, 403, 403), { form: { body: 'Matrix message' } })
	],

	// JSON API
	'POST /api/estimate': [r('/api/estimate', everyone(400), { json: {} })],
	'GET /api/estimate/schema': [r('/api/estimate/schema', everyone(200))],
	'GET /api/plans': [r('/api/plans', x(401, 200, 200, 403, 403, 403, 403, 403))],
	'POST /api/plans': [r('/api/plans', x(401, 400, 400, 403, 403, 403, 403, 403), { json: {} })],
	'GET /api/plans/[id]': [r('/api/plans/{planA}', x(401, 200, 404, 403, 403, 403, 403, 403))],
	'PATCH /api/plans/[id]': [
		r('/api/plans/{planA}', x(401, 400, 400, 403, 403, 403, 403, 403), { method: 'PATCH', json: {} }),
		r('/api/plans/{otherPlan}', x(401, 404, 404, 403, 403, 403, 403, 403), { method: 'PATCH', json: { revision: 1, name: 'Taken over' } })
	],
	'DELETE /api/plans/[id]': [
		r('/api/plans/{planA}', x(401, 409, 404, 403, 403, 403, 403, 403), { method: 'DELETE' }),
		r('/api/plans/{otherPlan}', x(401, 404, 404, 403, 403, 403, 403, 403), { method: 'DELETE' })
	],

	// Contractors: leads only for approved ones, and only their own
	'GET /pro': [r('/pro', x(303, 403, 403, 200, 200, 200, 200, 403))],
	'GET /pro/profile': [r('/pro/profile', x(303, 403, 403, 200, 200, 200, 200, 403))],
	'POST /pro/profile': [r('/pro/profile', x(303, 403, 403, 400, 400, 400, 400, 403), { form: {} })],
	'GET /pro/leads': [r('/pro/leads', x(303, 403, 403, 403, 200, 200, 403, 403))],
	'GET /pro/leads/[id]': [r('/pro/leads/{leadA}', x(303, 403, 403, 403, 200, 404, 403, 403))],
	'POST /pro/leads/[id]?/bid': [r('/pro/leads/{leadA}?/bid', x(303, 403, 403, 403, 200, 404, 403, 403), { form: bid })],
	'POST /pro/leads/[id]?/message': [r('/pro/leads/{leadA}?/message', x(303, 403, 403, 403, 200, 404, 403, 403), { form: { body: 'Matrix reply' } })],
	'POST /pro/leads/[id]?/withdraw': [r('/pro/leads/{leadA}?/withdraw', x(303, 403, 403, 403, 200, 404, 403, 403), { form: {}, last: true })],
	// Runs after the withdraw above, so the lead's own contractor finds it closed (409).
	'POST /pro/leads/[id]?/decline': [
		r('/pro/leads/{leadA}?/decline', x(303, 403, 403, 403, 409, 404, 403, 403), { form: { reason: 'Booked all season.' }, last: true })
	],
	// After the withdraw and decline above (last rows run in this order) plan A has no open lead left, so
	// its owner is told there is nothing to close (409); closing an open request is in pro-lifecycle.e2e.ts.
	'POST /plans/[id]/bids?/close': [r('/plans/{planA}/bids?/close', x(303, 409, 404, 403, 403, 403, 403, 403), { form: {}, last: true })],
	'GET /pro/leads/[id]/photos/[photoId]': [
		r('/pro/leads/{leadA}/photos/{photoA}', x(303, 403, 403, 403, 200, 404, 403, 403)),
		r('/pro/leads/{leadA}/photos/{photoB}', x(303, 403, 403, 403, 404, 404, 403, 403))
	],
	// Billing: any contractor sees the page; paying is for approved ones. withLead and noLead have a running
	// plan with no provider record, so a second plan, a card update or a cancel is refused (409); a lead pack
	// opens a checkout on the fake payment provider (200 with its page).
	'GET /pro/billing': [r('/pro/billing', x(303, 403, 403, 200, 200, 200, 200, 403))],
	'POST /pro/billing?/subscribe': [r('/pro/billing?/subscribe', x(303, 403, 403, 403, 409, 409, 403, 403), { form: {} })],
	'POST /pro/billing?/buyPack': [r('/pro/billing?/buyPack', x(303, 403, 403, 403, 200, 200, 403, 403), { form: {} })],
	'POST /pro/billing?/updateCard': [r('/pro/billing?/updateCard', x(303, 403, 403, 403, 409, 409, 403, 403), { form: {} })],
	'POST /pro/billing?/cancel': [r('/pro/billing?/cancel', x(303, 403, 403, 403, 409, 409, 403, 403), { form: {} })],
	'POST /pro/billing?/openExtra': [r('/pro/billing?/openExtra', x(303, 403, 403, 403, 400, 400, 403, 403), { form: {} })],
	'POST /pro/billing?/resume': [r('/pro/billing?/resume', x(303, 403, 403, 403, 409, 409, 403, 403), { form: {} })],
	// The payment provider's events: no session counts, only the signature; an unsigned body is refused.
	'POST /api/webhooks/payments': [r('/api/webhooks/payments', everyone(400), { json: {} })],
	'GET /contractor-documents/[id]': [
		r('/contractor-documents/{doc.withLead}', x(303, 403, 403, 404, 200, 404, 404, 200)),
		r('/contractor-documents/{doc.pending}', x(303, 403, 403, 200, 404, 404, 404, 200)),
		r('/contractor-documents/{doc.suspended}', x(303, 403, 403, 404, 404, 404, 200, 200))
	],

	// Admin
	'GET /admin': [r('/admin', x(303, 403, 403, 403, 403, 403, 403, 200))],
	'GET /admin/audit': [r('/admin/audit', x(303, 403, 403, 403, 403, 403, 403, 200))],
	'GET /admin/users': [r('/admin/users', x(303, 403, 403, 403, 403, 403, 403, 200))],
	'GET /admin/users/[id]': [r('/admin/users/{user.ownerB}', x(303, 403, 403, 403, 403, 403, 403, 200))],
	// No reason given: the admin gets the form's 400 and nothing changes.
	'POST /admin/users/[id]?/disable': [r('/admin/users/{user.ownerB}?/disable', x(303, 403, 403, 403, 403, 403, 403, 400), { form: {} })],
	'POST /admin/users/[id]?/enable': [r('/admin/users/{user.ownerB}?/enable', x(303, 403, 403, 403, 403, 403, 403, 400), { form: {} })],
	'GET /admin/expiring': [r('/admin/expiring', x(303, 403, 403, 403, 403, 403, 403, 200))],
	'GET /admin/contractors/[id]': [r('/admin/contractors/{user.withLead}', x(303, 403, 403, 403, 403, 403, 403, 200))],
	'POST /admin/contractors/[id]?/approve': [r('/admin/contractors/{user.withLead}?/approve', x(303, 403, 403, 403, 403, 403, 403, 409), { form: {} })],
	'POST /admin/contractors/[id]?/sendBack': [r('/admin/contractors/{user.withLead}?/sendBack', x(303, 403, 403, 403, 403, 403, 403, 400), { form: {} })],
	'POST /admin/contractors/[id]?/suspend': [r('/admin/contractors/{user.withLead}?/suspend', x(303, 403, 403, 403, 403, 403, 403, 400), { form: {} })],
	'POST /admin/contractors/[id]?/reinstate': [r('/admin/contractors/{user.withLead}?/reinstate', x(303, 403, 403, 403, 403, 403, 403, 409), { form: {} })]
};

/** Every page, form action and +server.ts handler in src/routes, as "METHOD /path[?/action]". */
function routesInFolder(): Map<string, 'page' | 'action' | 'server'> {
	const out = new Map<string, 'page' | 'action' | 'server'>();
	const walk = (dir: string) => {
		for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
			const p = path.join(dir, e.name);
			if (e.isDirectory()) {
				walk(p);
				continue;
			}
			const route =
				'/' +
				path
					.relative('src/routes', dir)
					.split(path.sep)
					.filter((seg) => seg && !/^\(.*\)$/.test(seg))
					.map((seg) => seg.replace(/^\[(\w+)=\w+\]$/, '[$1]'))
					.join('/');
			const text = () => fs.readFileSync(p, 'utf8');
			if (e.name === '+page.svelte') out.set(`GET ${route}`, 'page');
			else if (e.name === '+page.server.ts') {
				const block = text().split('export const actions')[1];
				if (!block) continue;
				const body = block.slice(0, block.search(/\n\}/));
				const names = [...body.matchAll(/^\t(\w+)\s*[:(]/gm)].map((m) => m[1]);
				// Actions written on one line would be missed silently: say so instead.
				if (!names.length) throw new Error(`${p}: write its actions one per line, so this test can list them`);
				for (const n of names) out.set(n === 'default' ? `POST ${route}` : `POST ${route}?/${n}`, 'action');
			} else if (e.name === '+server.ts') {
				for (const m of text().matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS|fallback)\b/g))
					out.set(`${m[1]} ${route}`, 'server');
			}
		}
	};
	walk('src/routes');
	return out;
}

function fill(s: string, a: Actor, fx: Fixtures): string {
	return s.replace(/\{([\w.]+)\}/g, (_, k: string) => {
		if (k === 'random') return crypto.randomUUID();
		if (k === 'myPlan') return a === 'ownerB' ? fx.planB : fx.planA;
		if (k === 'otherPlan') return a === 'ownerA' ? fx.planB : fx.planA;
		const [group, key] = k.split('.');
		const v =
			group === 'doc'
				? fx.doc[key as keyof Fixtures['doc']]
				: group === 'user'
					? fx.userId[key as keyof Fixtures['userId']]
					: (fx as unknown as Record<string, string>)[k];
		if (!v) throw new Error(`Unknown placeholder {${k}}`);
		return v;
	});
}

/** The status to compare: a form action's own (its JSON says failure/redirect/error), else the HTTP status. */
async function send(ctx: APIRequestContext, base: string, isAction: boolean, method: string, url: string, row: Row, a: Actor, fx: Fixtures): Promise<number> {
	const headers: Record<string, string> = { origin: base };
	let data: string | Buffer | undefined;
	if (row.json !== undefined) {
		headers['content-type'] = 'application/json';
		data = fill(JSON.stringify(row.json), a, fx);
	} else if (row.form) {
		headers['content-type'] = 'application/x-www-form-urlencoded';
		data = new URLSearchParams(Object.entries(row.form).map(([k, v]) => [k, fill(v, a, fx)])).toString();
	}
	if (isAction) Object.assign(headers, { accept: 'application/json', 'x-sveltekit-action': 'true' });
	const res = await ctx.fetch(url, { method, headers, data, maxRedirects: 0 });
	if (!isAction || !(res.headers()['content-type'] ?? '').includes('application/json')) return res.status();
	const body = await res.json().catch(() => null);
	if (body?.type === 'success') return 200;
	if (body?.type === 'failure' || body?.type === 'redirect') return body.status;
	return res.status();
}

/** Runs tasks with at most `n` at a time. */
async function pool<T>(tasks: (() => Promise<T>)[], n: number): Promise<T[]> {
	const out: T[] = new Array(tasks.length);
	let next = 0;
	await Promise.all(
		Array.from({ length: n }, async () => {
			while (next < tasks.length) {
				const i = next++;
				out[i] = await tasks[i]();
			}
		})
	);
	return out;
}

const methodOf = (key: string, row: Row) => row.method ?? key.split(' ')[0];

test('every route answers each kind of visitor as the matrix says', async ({ playwright, baseURL }) => {
	test.setTimeout(600_000);
	const base = baseURL!;
	const found = routesInFolder();

	// A route without a row fails, with the line to add (after the fixtures, so the line can show real answers).
	const missing = [...found.keys()].filter((k) => !matrix[k]).sort();
	const stale = Object.keys(matrix).filter((k) => !found.has(k));
	const { ctx, fx } = await setUpMatrix(() => playwright.request.newContext({ baseURL: base }), base);
	if (missing.length) {
		// Ask each actor once (params filled with fresh ids, an empty body) so the message can say what to add.
		const lines = await pool(
			missing.map((key) => async () => {
				const [method, target] = key.split(' ');
				const url = target.replace(/\[\w+\]/g, () => crypto.randomUUID());
				const row: Row = { url, expect: everyone(0), ...(method === 'GET' ? {} : { form: {} }) };
				const seen = await Promise.all(actors.map((a) => send(ctx[a], base, found.get(key) === 'action', method, url, row, a, fx)));
				const statuses = seen.every((s) => s === seen[0]) ? `everyone(${seen[0]})` : `x(${seen.join(', ')})`;
				return `\t'${key}': [r('${target.replace(/\[(\w+)\]/g, '{$1}')}', ${statuses}${method === 'GET' ? '' : ', { form: {} }'})],`;
			}),
			4
		);
		throw new Error(
			`${missing.length} route(s) in src/routes have no row in the matrix of tests/authz-matrix.e2e.ts: ${missing.join(', ')}.\n` +
				`Add to \`matrix\` (statuses in the order ${actors.join(', ')}; these are what the app answers now with made-up ids ` +
				`and an empty body: check each, and replace the {params} with fixtures such as {planA} or {leadA}):\n${lines.join('\n')}`
		);
	}
	expect(stale, 'matrix rows for routes that no longer exist').toEqual([]);

	const cases = Object.entries(matrix).flatMap(([key, rows]) =>
		rows.flatMap((row) => actors.map((a) => ({ key, row, a, method: methodOf(key, row), url: fill(row.url, a, fx) })))
	);
	const run = (c: (typeof cases)[number]) => async () => {
		const got = await send(ctx[c.a], base, found.get(c.key) === 'action', c.method, c.url, c.row, c.a, fx);
		return got === c.row.expect[c.a] ? null : `${c.key} as ${c.a} (${c.method} ${c.url}): expected ${c.row.expect[c.a]}, got ${got}`;
	};
	const wrong = [
		...(await pool(cases.filter((c) => !c.row.last).map(run), 6)),
		// Steps that change the fixtures (withdraw, decline, sign out) run after everything else, in order.
		...(await pool(cases.filter((c) => c.row.last && c.key !== 'POST /signout').map(run), 1)),
		...(await pool(cases.filter((c) => c.key === 'POST /signout').map(run), 8))
	].filter(Boolean);
	console.log(`authz matrix: ${found.size} routes, ${cases.length} (route, actor) requests, ${actors.length} actors`);
	expect(wrong, wrong.join('\n')).toEqual([]);

	// Refused deletes left everything in place.
	expect(await stillThere('plan_photo', fx.photoA)).toBe(true);
	expect(await stillThere('plan_photo', fx.photoB)).toBe(true);
	expect(await stillThere('plan', fx.planA)).toBe(true);
	expect(await stillThere('plan', fx.planB)).toBe(true);
	for (const c of Object.values(ctx)) await c.dispose();
});
