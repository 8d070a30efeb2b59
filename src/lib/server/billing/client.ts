import Stripe from 'stripe';
import { env } from '$env/dynamic/private';

/**
 * The payment provider's SDK client, built from settings only: PAYMENTS_SECRET_KEY, and where the
 * API is (PAYMENTS_API_HOST, PAYMENTS_API_PORT, PAYMENTS_API_PROTOCOL; unset means the provider's
 * own). `npm start` and `npm test` point these at the local fake; real keys work by env alone.
 */
let client: Stripe | null = null;

export class BillingUnavailable extends Error {}

export function payments(): Stripe {
	if (client) return client;
	if (!env.PAYMENTS_SECRET_KEY) throw new BillingUnavailable('Billing is not set up on this server (PAYMENTS_SECRET_KEY is missing).');
	const protocol = env.PAYMENTS_API_PROTOCOL;
	client = new Stripe(env.PAYMENTS_SECRET_KEY, {
		host: env.PAYMENTS_API_HOST || undefined,
		port: env.PAYMENTS_API_PORT ? Number(env.PAYMENTS_API_PORT) : undefined,
		protocol: protocol === 'http' || protocol === 'https' ? protocol : undefined,
		maxNetworkRetries: 1,
		timeout: 10_000,
		telemetry: false,
		appInfo: { name: 'Stakeline' }
	});
	return client;
}

/** The secret the provider signs webhook events with. */
export function webhookSecret(): string {
	if (!env.PAYMENTS_WEBHOOK_SECRET) throw new BillingUnavailable('PAYMENTS_WEBHOOK_SECRET is not set.');
	return env.PAYMENTS_WEBHOOK_SECRET;
}
