import type { Handle, RequestEvent } from '@sveltejs/kit';
import { apiError } from '../http/respond';
import { publicApi, type Gate } from '.';

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

function answer(gate: Gate, event: RequestEvent, resolve: Parameters<Handle>[0]['resolve']) {
	if (gate.allowed) return resolve(event);
	const response = apiError(
		429,
		'rate_limited',
		`Too many requests from this address. Try again in ${gate.retryAfterSeconds} seconds.`
	);
	response.headers.set('retry-after', String(gate.retryAfterSeconds));
	return response;
}

/**
 * A generous per-address limit on the public JSON API; over it, 429 with Retry-After. While the address's
 * lease lasts (see `leasedLimit`), the request goes on without waiting for anything.
 */
export const limitPublicApi: Handle = ({ event, resolve }) => {
	const { pathname } = event.url;
	if (!pathname.startsWith('/api/v1/') || unlimited.has(pathname)) return resolve(event);
	const gate = publicApi({ address: clientAddress(event) });
	return gate instanceof Promise ? gate.then((g) => answer(g, event, resolve)) : answer(gate, event, resolve);
};
