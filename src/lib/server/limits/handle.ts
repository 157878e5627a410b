import type { Handle, RequestEvent } from '@sveltejs/kit';
import { apiError } from '../http/respond';
import { publicApi } from '.';

/** The caller's address; 'unknown' when the configured address header is missing. */
export function clientAddress(event: RequestEvent) {
	try {
		return event.getClientAddress();
	} catch {
		return 'unknown';
	}
}

/**
 * Paths under /api/v1 outside the per-address limit: the payment processor's webhooks come from a handful of
 * its addresses, in bursts when it retries, and each one is verified by its signature before anything is done.
 */
const unlimited = new Set(['/api/v1/webhooks/stripe']);

/** A generous per-address limit on the public JSON API; over it, 429 with Retry-After. */
export const limitPublicApi: Handle = async ({ event, resolve }) => {
	if (!event.url.pathname.startsWith('/api/v1/') || unlimited.has(event.url.pathname)) return resolve(event);
	const gate = await publicApi({ address: clientAddress(event) });
	if (gate.allowed) return resolve(event);
	const response = apiError(
		429,
		'rate_limited',
		`Too many requests from this address. Try again in ${gate.retryAfterSeconds} seconds.`
	);
	response.headers.set('retry-after', String(gate.retryAfterSeconds));
	return response;
};
