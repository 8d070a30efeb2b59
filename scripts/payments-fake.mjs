// The local fake of the payment provider, for development and tests: a loopback HTTP server that
// answers the part of the provider's REST API Stakeline's SDK calls (customers, checkout sessions,
// subscriptions, invoices, invoice items), form-encoded in and JSON out in the provider's shapes. It serves its own
// payment page, where a person or a test pays or cancels, and posts signed events to Stakeline's
// webhook the way the provider signs them (HMAC-SHA256 over "timestamp.body", header t=…,v1=…).
// Nothing is charged and no card is asked for. Never used when real keys are set.
//
// Settings: PAYMENTS_FAKE_PORT, PAYMENTS_SECRET_KEY (the key the app must send),
// PAYMENTS_WEBHOOK_SECRET, PAYMENTS_WEBHOOK_URL, PAYMENTS_FAKE_STATE (a JSON file that keeps
// customers, subscriptions and invoices across restarts; memory only when unset).
//
// Invoice items (extra leads) wait on the customer until the subscription's next invoice (a renewal,
// or a final invoice when the subscription ends), which carries them as lines. A POST with an
// Idempotency-Key header answers a repeat with the first answer.
//
// Test and demo controls (not part of the provider's API): POST /_fake/renew {subscription, outcome:
// paid|failed} bills the next period now; POST /_fake/end {subscription} ends a subscription now;
// POST /_fake/config {webhookUrl} points the events elsewhere; GET /_fake shows subscriptions with
// those buttons.
import http from 'node:http';
import fs from 'node:fs';
import { createHmac, randomBytes } from 'node:crypto';

const port = Number(process.env.PAYMENTS_FAKE_PORT ?? 2626);
const apiKey = process.env.PAYMENTS_SECRET_KEY ?? 'sk_test_stakeline_fake';
const webhookSecret = process.env.PAYMENTS_WEBHOOK_SECRET ?? 'whsec_stakeline_fake';
let webhookUrl = process.env.PAYMENTS_WEBHOOK_URL ?? 'http://127.0.0.1:3000/api/webhooks/payments';
const stateFile = process.env.PAYMENTS_FAKE_STATE ?? '';
const base = `http://127.0.0.1:${port}`;
const API_VERSION = '2026-10-28.endive';
const DAY = 86_400;
const MAX_BODY = 64 * 1024;

/** @type {{customers: Record<string, any>, sessions: Record<string, any>, subscriptions: Record<string, any>, invoices: Record<string, any>, invoiceItems: Record<string, any>, idempotent: Record<string, any>, invoiceCount: number}} */
let state = { customers: {}, sessions: {}, subscriptions: {}, invoices: {}, invoiceItems: {}, idempotent: {}, invoiceCount: 0 };
if (stateFile && fs.existsSync(stateFile)) {
	try {
		state = { ...state, ...JSON.parse(fs.readFileSync(stateFile, 'utf8')) };
	} catch {
		console.error(`payments fake: ${stateFile} is not readable JSON; starting empty`);
	}
}
const save = () => {
	if (stateFile) fs.writeFileSync(stateFile, JSON.stringify(state));
};

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix) => `${prefix}_${randomBytes(12).toString('hex')}`;

// ---- form decoding: the SDK sends nested objects as a[b][0][c]=v ----

function decodeForm(text) {
	const out = {};
	for (const [key, value] of new URLSearchParams(text)) {
		const parts = key.split(/\[|\]\[|\]/).filter((p) => p !== '');
		let node = out;
		parts.forEach((part, i) => {
			const last = i === parts.length - 1;
			if (last) node[part] = value;
			else node = node[part] ??= {};
		});
	}
	return arrays(out);
}
/** Objects whose keys are 0..n-1 become arrays. */
function arrays(v) {
	if (v === null || typeof v !== 'object') return v;
	const keys = Object.keys(v);
	if (keys.length && keys.every((k, i) => k === String(i))) return keys.map((k) => arrays(v[k]));
	for (const k of keys) v[k] = arrays(v[k]);
	return v;
}

// ---- provider-shaped objects ----

function customerObject(c) {
	return {
		id: c.id,
		object: 'customer',
		created: c.created,
		email: c.email ?? null,
		name: c.name ?? null,
		metadata: c.metadata ?? {},
		livemode: false,
		deleted: undefined
	};
}

function sessionObject(s) {
	return {
		id: s.id,
		object: 'checkout.session',
		mode: s.mode,
		status: s.status,
		payment_status: s.payment_status,
		customer: s.customer,
		client_reference_id: s.client_reference_id ?? null,
		metadata: s.metadata ?? {},
		success_url: s.success_url,
		cancel_url: s.cancel_url ?? null,
		currency: s.currency ?? null,
		amount_total: s.amount_total,
		subscription: s.subscription ?? null,
		invoice: s.invoice ?? null,
		setup_intent: s.setup_intent ?? null,
		url: s.status === 'open' ? `${base}/pay/${s.id}` : null,
		created: s.created,
		expires_at: s.created + DAY,
		livemode: false
	};
}

function subscriptionObject(s) {
	return {
		id: s.id,
		object: 'subscription',
		customer: s.customer,
		status: s.status,
		cancel_at_period_end: s.cancel_at_period_end,
		cancel_at: s.cancel_at_period_end ? s.period_end : null,
		canceled_at: s.canceled_at ?? null,
		ended_at: s.ended_at ?? null,
		created: s.created,
		metadata: s.metadata ?? {},
		latest_invoice: s.latest_invoice ?? null,
		items: {
			object: 'list',
			has_more: false,
			url: `/v1/subscription_items?subscription=${s.id}`,
			data: [
				{
					id: s.item_id,
					object: 'subscription_item',
					current_period_start: s.period_start,
					current_period_end: s.period_end,
					quantity: 1,
					price: {
						id: s.price_id,
						object: 'price',
						currency: s.currency,
						unit_amount: s.amount,
						recurring: { interval: 'month', interval_count: 1 },
						product: s.product_id
					}
				}
			]
		},
		livemode: false
	};
}

function invoiceObject(i) {
	const lines = i.lines ?? [
		{ id: `il_${i.id.slice(3)}`, amount: i.amount, description: i.description, period_start: i.period_start, period_end: i.period_end }
	];
	return {
		id: i.id,
		object: 'invoice',
		customer: i.customer,
		number: i.number,
		status: i.status,
		currency: i.currency,
		amount_due: i.amount,
		amount_paid: i.status === 'paid' ? i.amount : 0,
		amount_remaining: i.status === 'paid' ? 0 : i.amount,
		total: i.amount,
		created: i.created,
		period_start: i.period_start,
		period_end: i.period_end,
		hosted_invoice_url: null,
		description: i.description,
		parent: i.subscription ? { type: 'subscription_details', quote_details: null, subscription_details: { subscription: i.subscription, metadata: {} } } : null,
		lines: {
			object: 'list',
			has_more: false,
			url: `/v1/invoices/${i.id}/lines`,
			data: lines.map((l) => ({
				id: l.id,
				object: 'line_item',
				amount: l.amount,
				currency: i.currency,
				description: l.description,
				metadata: l.metadata ?? {},
				period: { start: l.period_start, end: l.period_end },
				quantity: 1
			}))
		},
		livemode: false
	};
}

function invoiceItemObject(ii) {
	return {
		id: ii.id,
		object: 'invoiceitem',
		customer: ii.customer,
		amount: ii.amount,
		currency: ii.currency,
		description: ii.description ?? null,
		date: ii.date,
		invoice: ii.invoice ?? null,
		metadata: ii.metadata ?? {},
		parent: ii.subscription ? { type: 'subscription_details', subscription_details: { subscription: ii.subscription } } : null,
		period: { start: ii.date, end: ii.date },
		quantity: 1,
		livemode: false
	};
}

/** The customer's invoice items not yet on an invoice (for this subscription, or for none), oldest first. */
const pendingItems = (customer, subscription) =>
	Object.values(state.invoiceItems)
		.filter((ii) => ii.customer === customer && !ii.invoice && (!ii.subscription || ii.subscription === subscription))
		.sort((a, b) => a.date - b.date);

/** An invoice for the subscription's period with the pending invoice items as further lines (they are then on it). */
function subscriptionInvoice(sub, { status, withPlan = true }) {
	const items = pendingItems(sub.customer, sub.id);
	const lines = [
		...(withPlan ? [{ id: newId('il'), amount: sub.amount, description: sub.description, period_start: sub.period_start, period_end: sub.period_end }] : []),
		...items.map((ii) => ({
			id: newId('il'),
			amount: ii.amount,
			description: ii.description,
			metadata: ii.metadata,
			period_start: ii.date,
			period_end: ii.date
		}))
	];
	const inv = makeInvoice(sub.customer, {
		amount: lines.reduce((sum, l) => sum + l.amount, 0),
		currency: sub.currency,
		description: withPlan ? sub.description : (items[0]?.description ?? 'Invoice'),
		subscription: sub.id,
		periodStart: sub.period_start,
		periodEnd: sub.period_end,
		status
	});
	inv.lines = lines;
	for (const ii of items) ii.invoice = inv.id;
	return inv;
}

function makeInvoice(customer, { amount, currency, description, subscription = null, periodStart, periodEnd, status }) {
	const id = newId('in');
	state.invoiceCount += 1;
	state.invoices[id] = {
		id,
		customer,
		number: `FAKE-${String(state.invoiceCount).padStart(4, '0')}`,
		status,
		amount,
		currency,
		description,
		subscription,
		created: now(),
		period_start: periodStart,
		period_end: periodEnd
	};
	return state.invoices[id];
}

// ---- events ----

const outbox = [];

function sign(payload, t = now()) {
	const v1 = createHmac('sha256', webhookSecret).update(`${t}.${payload}`).digest('hex');
	return `t=${t},v1=${v1}`;
}

/** Posts one event, signed; failed deliveries are retried a few times in the background. */
async function emit(type, object) {
	const event = {
		id: newId('evt'),
		object: 'event',
		api_version: API_VERSION,
		created: now(),
		type,
		data: { object },
		livemode: false,
		pending_webhooks: 1,
		request: { id: null, idempotency_key: null }
	};
	const payload = JSON.stringify(event);
	if (!(await deliver(payload))) outbox.push({ payload, tries: 1 });
	return event;
}

async function deliver(payload) {
	try {
		const res = await fetch(webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': sign(payload) }, body: payload });
		if (!res.ok) console.error(`payments fake: webhook answered ${res.status}`);
		return res.ok;
	} catch (err) {
		console.error(`payments fake: webhook not reachable (${err.message})`);
		return false;
	}
}

setInterval(async () => {
	for (const item of outbox.splice(0)) {
		if (await deliver(item.payload)) continue;
		if (++item.tries < 8) outbox.push(item);
	}
}, 3000).unref();

// ---- what the payment page and the controls do ----

function amountOf(lineItems = []) {
	return lineItems.reduce((sum, li) => sum + Number(li.price_data?.unit_amount ?? 0) * Number(li.quantity ?? 1), 0);
}

async function completeSession(s, { failRenewals }) {
	const customer = state.customers[s.customer];
	if (customer) customer.failRenewals = failRenewals;
	const t = now();
	if (s.mode === 'subscription') {
		const li = s.line_items?.[0] ?? {};
		const sub = {
			id: newId('sub'),
			item_id: newId('si'),
			price_id: newId('price'),
			product_id: newId('prod'),
			customer: s.customer,
			status: 'active',
			cancel_at_period_end: false,
			created: t,
			period_start: t,
			period_end: t + 30 * DAY,
			amount: Number(li.price_data?.unit_amount ?? 0),
			currency: li.price_data?.currency ?? s.currency ?? 'usd',
			description: li.price_data?.product_data?.name ?? 'Subscription',
			metadata: s.subscription_data?.metadata ?? {}
		};
		state.subscriptions[sub.id] = sub;
		const inv = makeInvoice(s.customer, {
			amount: sub.amount,
			currency: sub.currency,
			description: sub.description,
			subscription: sub.id,
			periodStart: sub.period_start,
			periodEnd: sub.period_end,
			status: 'paid'
		});
		sub.latest_invoice = inv.id;
		Object.assign(s, { status: 'complete', payment_status: 'paid', subscription: sub.id, invoice: inv.id });
		save();
		await emit('checkout.session.completed', sessionObject(s));
		await emit('invoice.paid', invoiceObject(inv));
	} else if (s.mode === 'payment') {
		const li = s.line_items?.[0] ?? {};
		const inv = makeInvoice(s.customer, {
			amount: s.amount_total,
			currency: s.currency ?? li.price_data?.currency ?? 'usd',
			description: li.price_data?.product_data?.name ?? 'Payment',
			periodStart: t,
			periodEnd: t,
			status: 'paid'
		});
		Object.assign(s, { status: 'complete', payment_status: 'paid', invoice: inv.id });
		save();
		await emit('checkout.session.completed', sessionObject(s));
	} else {
		// Setup: a new card is on file. An overdue invoice is retried with it at once.
		Object.assign(s, { status: 'complete', payment_status: 'no_payment_required', setup_intent: newId('seti') });
		save();
		await emit('checkout.session.completed', sessionObject(s));
		for (const inv of Object.values(state.invoices).filter((i) => i.customer === s.customer && i.status === 'open')) {
			if (failRenewals) continue;
			inv.status = 'paid';
			const sub = inv.subscription && state.subscriptions[inv.subscription];
			if (sub && sub.status === 'past_due') sub.status = 'active';
			save();
			await emit('invoice.paid', invoiceObject(inv));
		}
	}
}

async function renew(sub, outcome) {
	if (sub.status === 'canceled') throw new ApiError(400, `Subscription ${sub.id} has ended.`);
	if (sub.cancel_at_period_end) return end(sub);
	const customer = state.customers[sub.customer];
	const paid = outcome ? outcome === 'paid' : !customer?.failRenewals;
	sub.period_start = sub.period_end;
	sub.period_end = sub.period_start + 30 * DAY;
	sub.status = paid ? 'active' : 'past_due';
	// The period just ended is billed ahead for the next one, with the invoice items (extra leads) that wait for it.
	const inv = subscriptionInvoice(sub, { status: paid ? 'paid' : 'open' });
	sub.latest_invoice = inv.id;
	save();
	await emit(paid ? 'invoice.paid' : 'invoice.payment_failed', invoiceObject(inv));
	return subscriptionObject(sub);
}

async function end(sub) {
	Object.assign(sub, { status: 'canceled', canceled_at: now(), ended_at: now() });
	// Invoice items still waiting for this subscription are billed on a final invoice.
	const final = pendingItems(sub.customer, sub.id).length
		? subscriptionInvoice(sub, { status: state.customers[sub.customer]?.failRenewals ? 'open' : 'paid', withPlan: false })
		: null;
	save();
	await emit('customer.subscription.deleted', subscriptionObject(sub));
	if (final) await emit(final.status === 'paid' ? 'invoice.paid' : 'invoice.payment_failed', invoiceObject(final));
	return subscriptionObject(sub);
}

// ---- HTTP ----

class ApiError extends Error {
	constructor(status, message, param) {
		super(message);
		this.status = status;
		this.param = param;
	}
}

const found = (map, id, what) => {
	const v = map[id];
	if (!v) throw new ApiError(404, `No such ${what}: '${id}'`, 'id');
	return v;
};

function readBody(req) {
	return new Promise((resolve, reject) => {
		let size = 0;
		const chunks = [];
		req.on('data', (c) => {
			size += c.length;
			if (size > MAX_BODY) {
				reject(new ApiError(413, `Request body over ${MAX_BODY} bytes.`));
				req.destroy();
			} else chunks.push(c);
		});
		req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
		req.on('error', reject);
	});
}

const json = (res, status, body) => {
	res.writeHead(status, { 'content-type': 'application/json', 'request-id': newId('req') });
	res.end(JSON.stringify(body));
};

/** The provider's REST API (the subset used). */
async function api(method, path, query, body) {
	let m;
	if (method === 'POST' && path === '/v1/customers') {
		const c = { id: newId('cus'), created: now(), email: body.email, name: body.name, metadata: body.metadata ?? {}, failRenewals: false };
		state.customers[c.id] = c;
		save();
		return customerObject(c);
	}
	if (method === 'GET' && (m = path.match(/^\/v1\/customers\/([\w]+)$/))) return customerObject(found(state.customers, m[1], 'customer'));
	if (method === 'POST' && path === '/v1/checkout/sessions') {
		const mode = body.mode;
		if (!['subscription', 'payment', 'setup'].includes(mode)) throw new ApiError(400, 'Invalid mode: must be one of payment, setup, or subscription', 'mode');
		if (!body.success_url) throw new ApiError(400, 'Missing required param: success_url.', 'success_url');
		if (!body.customer) throw new ApiError(400, 'This fake needs a customer on every checkout session.', 'customer');
		found(state.customers, body.customer, 'customer');
		if (mode !== 'setup' && !Array.isArray(body.line_items)) throw new ApiError(400, 'Missing required param: line_items.', 'line_items');
		const s = {
			id: newId('cs_test'),
			mode,
			status: 'open',
			payment_status: 'unpaid',
			customer: body.customer,
			client_reference_id: body.client_reference_id,
			metadata: body.metadata ?? {},
			success_url: body.success_url,
			cancel_url: body.cancel_url,
			currency: body.currency ?? body.line_items?.[0]?.price_data?.currency ?? null,
			line_items: body.line_items ?? [],
			subscription_data: body.subscription_data,
			amount_total: mode === 'setup' ? null : amountOf(body.line_items),
			created: now()
		};
		state.sessions[s.id] = s;
		save();
		return sessionObject(s);
	}
	if (method === 'GET' && (m = path.match(/^\/v1\/checkout\/sessions\/([\w]+)$/))) return sessionObject(found(state.sessions, m[1], 'checkout.session'));
	if ((m = path.match(/^\/v1\/subscriptions\/([\w]+)$/))) {
		const sub = found(state.subscriptions, m[1], 'subscription');
		if (method === 'GET') return subscriptionObject(sub);
		if (method === 'POST') {
			if (sub.status === 'canceled') throw new ApiError(400, 'A canceled subscription can only update its cancellation_details and metadata.');
			if ('cancel_at_period_end' in body) sub.cancel_at_period_end = body.cancel_at_period_end === 'true';
			save();
			return subscriptionObject(sub);
		}
		if (method === 'DELETE') return end(sub);
	}
	if (method === 'POST' && path === '/v1/invoiceitems') {
		found(state.customers, body.customer, 'customer');
		const amount = Number(body.amount);
		if (!Number.isInteger(amount)) throw new ApiError(400, 'This fake needs an integer amount on an invoice item.', 'amount');
		if (!body.currency) throw new ApiError(400, 'Missing required param: currency.', 'currency');
		if (body.subscription) {
			const sub = found(state.subscriptions, body.subscription, 'subscription');
			if (sub.customer !== body.customer) throw new ApiError(400, 'The subscription belongs to another customer.', 'subscription');
			if (sub.status === 'canceled') throw new ApiError(400, `Subscription ${sub.id} has ended.`, 'subscription');
		}
		const ii = {
			id: newId('ii'),
			customer: body.customer,
			subscription: body.subscription ?? null,
			amount,
			currency: body.currency,
			description: body.description ?? null,
			metadata: body.metadata ?? {},
			date: now(),
			invoice: null
		};
		state.invoiceItems[ii.id] = ii;
		save();
		return invoiceItemObject(ii);
	}
	if ((m = path.match(/^\/v1\/invoiceitems\/([\w]+)$/))) {
		const ii = found(state.invoiceItems, m[1], 'invoiceitem');
		if (method === 'GET') return invoiceItemObject(ii);
		if (method === 'DELETE') {
			if (ii.invoice) throw new ApiError(400, 'This invoice item is on an invoice already and cannot be deleted.', 'id');
			delete state.invoiceItems[ii.id];
			save();
			return { id: ii.id, object: 'invoiceitem', deleted: true };
		}
	}
	if (method === 'GET' && path === '/v1/invoiceitems') {
		const customer = query.get('customer');
		const pending = query.get('pending');
		const all = Object.values(state.invoiceItems)
			.filter((ii) => (!customer || ii.customer === customer) && (pending !== 'true' || !ii.invoice))
			.sort((a, b) => b.date - a.date);
		return { object: 'list', url: '/v1/invoiceitems', has_more: false, data: all.slice(0, 100).map(invoiceItemObject) };
	}
	if (method === 'GET' && path === '/v1/invoices') {
		const limit = Math.min(Math.max(Number(query.get('limit') ?? 10), 1), 100);
		const customer = query.get('customer');
		const all = Object.values(state.invoices)
			.filter((i) => !customer || i.customer === customer)
			.sort((a, b) => b.created - a.created || b.number.localeCompare(a.number));
		return { object: 'list', url: '/v1/invoices', has_more: all.length > limit, data: all.slice(0, limit).map(invoiceObject) };
	}
	throw new ApiError(404, `Unrecognized request URL (${method}: ${path}).`);
}

const esc = (s) => String(s ?? '').replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const dollars = (cents, currency) => `${(cents / 100).toFixed(2)} ${String(currency ?? 'usd').toUpperCase()}`;

function page(title, inner) {
	return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${esc(title)}</title>
<style>body{font-family:system-ui,sans-serif;margin:0;background:#eef2ee;color:#1d2a22}main{max-width:28rem;margin:2rem auto;padding:1.5rem;background:#fff;border:1px solid #c9d3cb;border-radius:.75rem}
h1{font-size:1.3rem;margin:0 0 .25rem}.note{font-size:.85rem;color:#4a5a4f;background:#f6f1df;border-radius:.4rem;padding:.5rem .75rem}
.amount{font-size:1.6rem;font-weight:700;margin:.75rem 0}button{font:inherit;min-height:44px;padding:.7rem 1rem;border-radius:.5rem;border:1px solid #2f5d45;cursor:pointer;width:100%;margin-top:.5rem}
.pay{background:#2f5d45;color:#fff}.back{background:#fff;color:#2f5d45}label{display:block;margin-top:1rem;font-weight:600}select{font:inherit;min-height:44px;width:100%;padding:.5rem;margin-top:.25rem}
table{width:100%;border-collapse:collapse;font-size:.9rem}td,th{text-align:left;padding:.3rem;border-bottom:1px solid #dde4de}</style></head>
<body><main>${inner}</main></body></html>`;
}

function payPage(s) {
	if (s.status !== 'open')
		return page(
			'Payment closed',
			`<h1>This payment is closed</h1><p>It was ${s.status === 'complete' ? 'completed' : 'cancelled'} already.</p><p><a href="${esc(s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id))}">Back to Stakeline</a></p>`
		);
	const what = s.mode === 'setup' ? 'Save a new card for your Stakeline plan' : esc(s.line_items?.[0]?.price_data?.product_data?.name ?? 'Payment');
	const sum = s.mode === 'setup' ? '' : `<p class="amount">${esc(dollars(s.amount_total, s.currency))}${s.mode === 'subscription' ? ' a month' : ''}</p>`;
	return page(
		'Test payment',
		`<p class="note">Test payment page on this computer: no card is needed and nothing is charged.</p>
<h1>${what}</h1>${sum}
<form method="post" action="/pay/${esc(s.id)}/complete">
<label for="card">Test card</label>
<select id="card" name="card"><option value="good">A card that pays every month</option><option value="declines">A card that is declined from next month</option></select>
<button class="pay" type="submit">${s.mode === 'setup' ? 'Save card' : 'Pay'}</button></form>
<form method="post" action="/pay/${esc(s.id)}/cancel"><button class="back" type="submit">Cancel and go back</button></form>`
	);
}

function controlPage() {
	const rows = Object.values(state.subscriptions)
		.map((s) => {
			const c = state.customers[s.customer];
			const btn = (url, label, extra = '') =>
				`<form method="post" action="${url}" style="display:inline"><input type="hidden" name="subscription" value="${esc(s.id)}">${extra}<button type="submit">${label}</button></form>`;
			return `<tr><td>${esc(c?.email ?? s.customer)}</td><td>${esc(s.status)}${s.cancel_at_period_end ? ' (ends at period end)' : ''}</td><td>${s.status === 'canceled' ? '' : btn('/_fake/renew', 'Next month: pays', '<input type="hidden" name="outcome" value="paid">') + btn('/_fake/renew', 'Next month: declined', '<input type="hidden" name="outcome" value="failed">') + btn('/_fake/end', 'End now')}</td></tr>`;
		})
		.join('');
	return page(
		'Fake payments',
		`<h1>Subscriptions in the fake</h1><table><tr><th>Customer</th><th>Status</th><th></th></tr>${rows || '<tr><td colspan="3">None yet.</td></tr>'}</table>`
	);
}

const server = http.createServer(async (req, res) => {
	const url = new URL(req.url ?? '/', base);
	const path = url.pathname;
	try {
		const raw = req.method === 'GET' || req.method === 'HEAD' ? '' : await readBody(req);
		const isForm = (req.headers['content-type'] ?? '').includes('application/x-www-form-urlencoded');
		const body = raw ? (isForm ? decodeForm(raw) : JSON.parse(raw)) : {};
		let m;
		if (path.startsWith('/v1/')) {
			if (req.headers.authorization !== `Bearer ${apiKey}`)
				return json(res, 401, { error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' } });
			// As the provider does: a POST repeated with the same Idempotency-Key gets the first answer back, and makes nothing new.
			const key = req.method === 'POST' ? req.headers['idempotency-key'] : undefined;
			const remembered = typeof key === 'string' ? state.idempotent[`${path} ${key}`] : undefined;
			if (remembered) return json(res, 200, remembered);
			const out = await api(req.method, path, url.searchParams, body);
			if (typeof key === 'string') {
				state.idempotent[`${path} ${key}`] = out;
				// The SDK sends a key with every POST; the newest 500 are kept (the provider keeps them a day).
				const keys = Object.keys(state.idempotent);
				for (const old of keys.slice(0, Math.max(0, keys.length - 500))) delete state.idempotent[old];
				save();
			}
			return json(res, 200, out);
		}
		if (req.method === 'GET' && (m = path.match(/^\/pay\/([\w]+)$/))) {
			const s = state.sessions[m[1]];
			res.writeHead(s ? 200 : 404, { 'content-type': 'text/html; charset=utf-8' });
			return res.end(s ? payPage(s) : page('Not found', '<h1>No such payment</h1>'));
		}
		if (req.method === 'POST' && (m = path.match(/^\/pay\/([\w]+)\/(complete|cancel)$/))) {
			const s = found(state.sessions, m[1], 'checkout.session');
			if (s.status === 'open') {
				if (m[2] === 'complete') await completeSession(s, { failRenewals: body.card === 'declines' });
				else {
					s.status = 'expired';
					save();
				}
			}
			const back = m[2] === 'complete' || !s.cancel_url ? s.success_url : s.cancel_url;
			res.writeHead(303, { location: back.replace('{CHECKOUT_SESSION_ID}', s.id) });
			return res.end();
		}
		if (req.method === 'GET' && path === '/_fake') {
			res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
			return res.end(controlPage());
		}
		if (req.method === 'POST' && path === '/_fake/renew') {
			const out = await renew(found(state.subscriptions, body.subscription, 'subscription'), body.outcome);
			return isForm ? (res.writeHead(303, { location: '/_fake' }), res.end()) : json(res, 200, out);
		}
		if (req.method === 'POST' && path === '/_fake/end') {
			const out = await end(found(state.subscriptions, body.subscription, 'subscription'));
			return isForm ? (res.writeHead(303, { location: '/_fake' }), res.end()) : json(res, 200, out);
		}
		if (req.method === 'POST' && path === '/_fake/config') {
			const previous = webhookUrl;
			if (body.webhookUrl) webhookUrl = String(body.webhookUrl);
			return json(res, 200, { webhookUrl, previous });
		}
		json(res, 404, { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${req.method}: ${path}).` } });
	} catch (err) {
		if (err instanceof ApiError)
			return json(res, err.status, {
				error: { type: 'invalid_request_error', message: err.message, param: err.param, code: err.status === 404 ? 'resource_missing' : undefined }
			});
		console.error('payments fake:', err);
		json(res, 500, { error: { type: 'api_error', message: 'The fake failed; see its log.' } });
	}
});

server.on('error', (err) => console.error('payments fake:', err.message));
server.listen(port, '127.0.0.1', () => console.log(`Fake payment provider on ${base}`));

const shutdown = () => server.close(() => process.exit(0));
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
