import { json, type Handle, type HandleServerError, type RequestEvent } from '@sveltejs/kit';
import { databaseUnavailable, RETRY_AFTER_S } from './db';
import { log as defaultLog, safePath } from './log';
import type { Logger } from 'pino';

export const UNAVAILABLE = 'The database is not answering right now. Nothing was saved; please try again in a few seconds.';

/** Requests whose failure was the database being down: their 500 becomes a 503. */
const downFor = new WeakSet<Request>();
const idFor = new WeakMap<Request, string>();

const wantsJson = (event: RequestEvent) =>
	event.url.pathname.startsWith('/api/') || (event.request.headers.get('accept') ?? '').includes('application/json');

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
export function requestHandle(logger: Logger = defaultLog): Handle {
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
				response = wantsJson(event)
					? unavailable(event, requestId)
					: new Response(response.body, { status: 503, statusText: 'Service Unavailable', headers });
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
const tooLarge = (message: string, requestId: string) =>
	json({ message, errors: [{ path: '', message }] }, { status: 413, headers: { 'x-request-id': requestId } });

/**
 * A body sent without Content-Length (chunked) is read here, up to the limit: past it the answer is
 * the same 413 with the limit as a sized body gets, before any action or route sees a half-read
 * stream. Under it, the request goes on with the bytes read.
 */
async function limitUnsizedBody(event: RequestEvent, requestId: string): Promise<Response | null> {
	const request = event.request;
	if (!request.body || request.headers.has('content-length')) return null;
	const limit = bodyLimit();
	const over = () => tooLarge(`The request is over ${mb(limit)}; the limit is ${mb(limit)}. Send smaller files, one at a time.`, requestId);
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
	if (length > limit) return tooLarge(`The request is ${mb(length)}; the limit is ${mb(limit)}. Send smaller files, one at a time.`, requestId);
	// SvelteKit throws (a 500) when a client names the default action; it is simply not an action name.
	if (event.request.method === 'POST' && event.url.searchParams.has('/default')) {
		const message = 'No such form action.';
		return json({ message, errors: [{ path: '', message }] }, { status: 400, headers });
	}
	return null;
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
		logger.error({ requestId, status, err: error }, 'unexpected error');
		return { message: status === 404 ? message : 'Something broke on our side.', requestId };
	};
}
