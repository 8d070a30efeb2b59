import { json, type Handle, type HandleServerError, type RequestEvent } from '@sveltejs/kit';
import { databaseUnavailable, RETRY_AFTER_S } from './db';
import { log as defaultLog, requestLog, safePath } from './log';
import type { Logger } from 'pino';

export const UNAVAILABLE = 'The database is not answering right now. Nothing was saved; please try again in a few seconds.';

/** Requests whose failure was the database being down: their 500 becomes a 503. */
const downFor = new WeakSet<Request>();
const idFor = new WeakMap<Request, string>();

const wantsJson = (event: RequestEvent) => event.url.pathname.startsWith('/api/') || (event.request.headers.get('accept') ?? '').includes('application/json');

function unavailable(event: RequestEvent, requestId: string): Response {
	const headers = { 'retry-after': String(RETRY_AFTER_S), 'x-request-id': requestId, 'cache-control': 'no-store' };
	if (wantsJson(event)) return json({ message: UNAVAILABLE, errors: [{ path: '', message: UNAVAILABLE }] }, { status: 503, headers });
	return new Response(`<!doctype html><meta charset="utf-8"><title>Try again shortly · Stakeline</title><h1>Try again shortly</h1><p>${UNAVAILABLE}</p>`, {
		status: 503,
		headers: { ...headers, 'content-type': 'text/html; charset=utf-8' }
	});
}

/**
 * First in the hook chain: gives each request an id, writes one log line when it ends (method,
 * path without query, route, status, time), and turns "database down" failures into a fast 503
 * with Retry-After — also when a hook further down (the session lookup) is what failed.
 */
export function requestHandle(logger: Logger = requestLog): Handle {
	return async ({ event, resolve }) => {
		const t0 = performance.now();
		const requestId = crypto.randomUUID();
		idFor.set(event.request, requestId);
		let response: Response;
		try {
			response = refuseEarly(event, requestId) ?? (await limitUnsizedBody(event, requestId)) ?? (await resolve(event));
			if (downFor.has(event.request) && response.status === 500) {
				const headers = new Headers(response.headers);
				headers.set('retry-after', String(RETRY_AFTER_S));
				response = wantsJson(event) ? unavailable(event, requestId) : new Response(response.body, { status: 503, statusText: 'Service Unavailable', headers });
			}
		} catch (err) {
			if (!databaseUnavailable(err)) throw err;
			logger.warn({ requestId, err }, 'database unavailable');
			response = unavailable(event, requestId);
		}
		if (!response.headers.has('x-request-id')) {
			try {
				response.headers.set('x-request-id', requestId);
			} catch {
				// Immutable headers (a fetched response passed through); the log line still has the id.
			}
		}
		logger.info({
			requestId,
			method: event.request.method,
			path: safePath(event.url),
			route: event.route.id,
			status: response.status,
			ms: Math.round(performance.now() - t0),
			user: event.locals.user?.id
		});
		return response;
	};
}

/** adapter-node's body limit (BODY_SIZE_LIMIT, e.g. "16M"), so an over-long body gets 413 before any action reads it. */
function bodyLimit(): number {
	const m = /^(\d+)([KMG]?)$/i.exec(process.env.BODY_SIZE_LIMIT ?? '512K');
	if (!m) return Infinity;
	return Number(m[1]) * ({ '': 1, K: 1024, M: 1024 ** 2, G: 1024 ** 3 } as Record<string, number>)[m[2].toUpperCase()];
}

const mb = (n: number) => `${(n / 1024 ** 2).toFixed(1)} MB`;

/**
 * A body sent without Content-Length (chunked) is read here, up to the limit: past it the answer is
 * the same 413 with the limit as a sized body gets, before any action or route sees a half-read
 * stream. Under it, the request goes on with the bytes read.
 */
async function limitUnsizedBody(event: RequestEvent, requestId: string): Promise<Response | null> {
	const request = event.request;
	if (!request.body || request.headers.has('content-length')) return null;
	const limit = bodyLimit();
	const over = () =>
		tooLarge(event, `The request is over ${mb(limit)}; the limit is ${mb(limit)}. Send smaller files, one at a time.`, { 'x-request-id': requestId });
	const reader = request.body.getReader();
	const chunks: Uint8Array[] = [];
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) break;
			size += value.byteLength;
			if (size > limit) {
				void reader.cancel().catch(() => {});
				return over();
			}
			chunks.push(value);
		}
	} catch (err) {
		// adapter-node's own stream stops at the same limit with a 413 error.
		if ((err as { status?: number }).status === 413) return over();
		throw err;
	}
	const body = new Uint8Array(size);
	let at = 0;
	for (const c of chunks) {
		body.set(c, at);
		at += c.byteLength;
	}
	const headers = new Headers(request.headers);
	headers.delete('transfer-encoding');
	headers.set('content-length', String(size));
	const sized = new Request(request.url, { method: request.method, headers, body, signal: request.signal });
	idFor.set(sized, requestId);
	event.request = sized;
	return null;
}

/** Requests answered with a 4xx before routing: too large a body; a form naming the reserved "default" action. */
function refuseEarly(event: RequestEvent, requestId: string): Response | null {
	const headers = { 'x-request-id': requestId };
	const length = Number(event.request.headers.get('content-length') ?? 0);
	const limit = bodyLimit();
	if (length > limit) return tooLarge(event, `The request is ${mb(length)}; the limit is ${mb(limit)}. Send smaller files, one at a time.`, headers);
	// SvelteKit throws (a 500) when a client names the default action; it is simply not an action name.
	if (event.request.method === 'POST' && event.url.searchParams.has('/default')) {
		const message = 'No such form action.';
		return json({ message, errors: [{ path: '', message }] }, { status: 400, headers });
	}
	return null;
}

/**
 * A body over the limit, answered in the form the sender reads: an enhanced form gets a form
 * failure (the page keeps what was typed and shows the message), a plain form post a page that
 * says why and leads back, everything else JSON. Never a bare 413.
 */
function tooLarge(event: RequestEvent, message: string, headers: Record<string, string>): Response {
	if (event.request.headers.get('x-sveltekit-action') === 'true') {
		// SvelteKit's ActionResult; `data` is devalue's encoding of { message }.
		return json({ type: 'failure', status: 413, data: JSON.stringify([{ message: 1 }, message]) }, { headers });
	}
	if (!wantsJson(event) && event.request.method === 'POST') {
		const esc = message.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);
		const back = event.request.headers.get('referer');
		const safeBack = back && new URL(back, event.url).origin === event.url.origin ? new URL(back, event.url).pathname : '/';
		return new Response(
			`<!doctype html><html lang="en"><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Files too large · Stakeline</title>` +
				`<main style="font-family:sans-serif;max-width:32rem;margin:2rem auto;padding:0 1rem"><h1>The files are too large</h1><p>${esc}</p>` +
				`<p>Nothing was saved. Use your browser's Back button: what you typed is still in the form; choose smaller files there.</p>` +
				`<p><a href="${safeBack}">Open the form again</a> (empty)</p></main></html>`,
			{ status: 413, headers: { ...headers, 'content-type': 'text/html; charset=utf-8' } }
		);
	}
	return json({ message, errors: [{ path: '', message }] }, { status: 413, headers });
}

/** Unexpected errors: logged without query parameters; the database being down is said plainly. */
export function serverErrorHandler(logger: Logger = defaultLog): HandleServerError {
	return ({ error, event, status, message }) => {
		const requestId = idFor.get(event.request);
		if (databaseUnavailable(error)) {
			downFor.add(event.request);
			logger.warn({ requestId, err: error }, 'database unavailable');
			return { message: UNAVAILABLE, requestId, unavailable: true };
		}
		// An address nothing answers (SvelteKit reports it here too) is the visitor's mistake, not ours:
		// logged as such, so the error level stays for what needs a look.
		if (status === 404) {
			logger.info({ requestId, status, path: event.url.pathname }, 'not found');
			return { message, requestId };
		}
		logger.error({ requestId, status, err: error }, 'unexpected error');
		return { message: 'Something broke on our side.', requestId };
	};
}
