import { env } from '$env/dynamic/private';
import Stripe from 'stripe';

let configured: Stripe | null = null;

/**
 * The configured `stripe` client: the local stand-in when `STRIPE_API_HOST` is set (with
 * `STRIPE_API_PORT` and `STRIPE_API_PROTOCOL`), Stripe itself otherwise. Every call that moves money
 * passes its own idempotency key, derived from the business action, so the SDK's retries of
 * connection errors, 409s and 5xx answers are safe; a call that still fails is retried by a job.
 */
export function payments(): Stripe {
	if (configured) return configured;
	if (!env.STRIPE_SECRET_KEY) throw new Error('STRIPE_SECRET_KEY is not set');
	const retries = Number(env.STRIPE_MAX_NETWORK_RETRIES ?? 2);
	const timeout = Number(env.STRIPE_TIMEOUT_MS ?? 15_000);
	configured = new Stripe(env.STRIPE_SECRET_KEY, {
		...(env.STRIPE_API_HOST
			? {
					host: env.STRIPE_API_HOST,
					port: Number(env.STRIPE_API_PORT || 443),
					protocol: env.STRIPE_API_PROTOCOL === 'http' ? 'http' : 'https'
				}
			: {}),
		maxNetworkRetries: Number.isInteger(retries) && retries >= 0 ? retries : 2,
		timeout: Number.isInteger(timeout) && timeout > 0 ? timeout : 15_000,
		telemetry: false,
		appInfo: { name: 'Tackline' }
	});
	return configured;
}

/** The signing secret of the webhook endpoint (`whsec_…`), for `stripe.webhooks.constructEvent`. */
export function webhookSecret(): string {
	if (!env.STRIPE_WEBHOOK_SECRET) throw new Error('STRIPE_WEBHOOK_SECRET is not set');
	return env.STRIPE_WEBHOOK_SECRET;
}

const checkCacheMs = 5000;
let lastCheck: { at: number; result: Promise<string> } | null = null;

async function ping(): Promise<string> {
	try {
		// A cheap authenticated read; no retries and a short timeout, so a slow processor cannot hold health up.
		await payments().balance.retrieve({}, { maxNetworkRetries: 0, timeout: 3000 });
		return 'ok';
	} catch (error) {
		return error instanceof Error ? error.message || error.name : 'unreachable';
	}
}

/** `ok`, or why the payment processor cannot be reached; remembered for a few seconds so health polls stay cheap. */
export function check(): Promise<string> {
	const now = Date.now();
	if (!lastCheck || now - lastCheck.at > checkCacheMs) lastCheck = { at: now, result: ping() };
	return lastCheck.result;
}

/**
 * Where the processor's hosted pages (payment, onboarding) live, for the Content-Security-Policy's
 * `form-action`: a form that pays redirects there. The stand-in serves them from its own address.
 */
export function hostedPagesOrigins(): string[] {
	if (env.STRIPE_API_HOST) {
		const protocol = env.STRIPE_API_PROTOCOL === 'http' ? 'http' : 'https';
		const port = env.STRIPE_API_PORT ? `:${Number(env.STRIPE_API_PORT)}` : '';
		return [`${protocol}://${env.STRIPE_API_HOST}${port}`];
	}
	return ['https://checkout.stripe.com', 'https://connect.stripe.com'];
}

/** Whether a processor call failed on the processor's side or on the way there (rather than on our request). */
export function isProcessorOutage(error: unknown): boolean {
	const { type, statusCode } = (error ?? {}) as { type?: unknown; statusCode?: unknown };
	if (typeof type !== 'string' || !type.startsWith('Stripe')) return false;
	if (['StripeConnectionError', 'StripeAPIError', 'StripeRateLimitError'].includes(type)) return true;
	return typeof statusCode === 'number' && (statusCode >= 500 || statusCode === 409 || statusCode === 429);
}
