import { json } from '@sveltejs/kit';
import { env } from '$env/dynamic/private';
import { applyEvent, BadSignature, verifyEvent, WEBHOOK_MAX_BYTES } from '$lib/server/billing/webhooks';
import type { RequestHandler } from './$types';

/**
 * The payment provider's events. No session and no origin check: the signature (checked by the
 * SDK's helper against PAYMENTS_WEBHOOK_SECRET) is the authentication. Each event id is applied
 * once; a replay answers 200 and changes nothing, so the provider stops retrying.
 */
export const POST: RequestHandler = async ({ request, url }) => {
	const declared = Number(request.headers.get('content-length') ?? 0);
	if (declared > WEBHOOK_MAX_BYTES) return json({ error: `The body is over ${WEBHOOK_MAX_BYTES} bytes.` }, { status: 413 });
	const body = await request.arrayBuffer();
	if (body.byteLength > WEBHOOK_MAX_BYTES) return json({ error: `The body is over ${WEBHOOK_MAX_BYTES} bytes.` }, { status: 413 });
	const payload = new TextDecoder().decode(body);
	let event;
	try {
		event = verifyEvent(payload, request.headers.get('stripe-signature'));
	} catch (err) {
		if (err instanceof BadSignature) return json({ error: `Signature check failed: ${err.message}` }, { status: 400 });
		throw err;
	}
	const out = await applyEvent(event, env.ORIGIN || url.origin);
	return json({ received: true, result: out.result });
};
