import { estimate } from '$lib/plan';
import { badRequest } from '$lib/server/api';
import { log } from '$lib/server/log';
import { limitEstimate } from '$lib/server/rate-limit';
import { toRoundedJson } from '$lib/plan/format';
import type { RequestHandler } from './$types';

/** A slab plan is a few kilobytes; anything far larger is not one. */
const MAX_BODY_CHARS = 256 * 1024;

const JSON_TYPE = { 'content-type': 'application/json; charset=utf-8' };

/** Public estimate: plan input as JSON in, the full plan out. No sign-in. */
export const POST: RequestHandler = async ({ request, getClientAddress }) => {
	const limited = await limitEstimate(getClientAddress());
	if (limited) return limited;
	let text: string;
	try {
		text = await request.text();
	} catch {
		return badRequest([{ path: '', message: 'The request body could not be read.' }]);
	}
	if (text.length > MAX_BODY_CHARS) return badRequest([{ path: '', message: `The body is over ${MAX_BODY_CHARS} characters.` }]);
	let body: unknown;
	try {
		body = JSON.parse(text);
	} catch {
		return badRequest([{ path: '', message: 'The body is not valid JSON.' }]);
	}
	try {
		const result = estimate(body);
		if (!result.ok) return badRequest(result.errors);
		return new Response(toRoundedJson(result.plan), { headers: JSON_TYPE });
	} catch (e) {
		// The schema should have caught it; answer as bad input rather than fail, and keep the trace.
		log.error({ err: e }, 'estimate failed on validated input');
		return badRequest([{ path: '', message: 'This plan could not be computed; check the outlines and sizes.' }]);
	}
};
