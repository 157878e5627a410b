import type { Handle } from '@sveltejs/kit';
import { hostedPagesOrigins } from '../services/payments';
import { protectiveHeaders } from './protective-headers.js';

/**
 * Paying and payout set-up are forms whose answer redirects to the processor's hosted pages; browsers hold
 * such redirects to `form-action`, so those origins (and only those) are added to it.
 */
function allowHostedPages(csp: string): string {
	const origins = hostedPagesOrigins().join(' ');
	return csp.replace(/form-action 'self'(?=;|$)/, `form-action 'self' ${origins}`);
}

/** Pages send one of a few policies (one per nonce-free page kind): each widened once, not per response. */
const widened = new Map<string, string>();
function widenedPolicy(csp: string): string {
	let found = widened.get(csp);
	if (found === undefined) {
		found = allowHostedPages(csp);
		// Policies with a per-response nonce never repeat: keep the map from growing with them.
		if (widened.size > 64) widened.clear();
		widened.set(csp, found);
	}
	return found;
}

/** The protective headers as [name, value] pairs, worked out once for http and once for https. */
const headerPairs = {
	http: Object.entries(protectiveHeaders({ https: false })),
	https: Object.entries(protectiveHeaders({ https: true }))
};

/** Headers that belong on every response; the Content-Security-Policy comes from svelte.config.js. */
export const securityHeaders: Handle = async ({ event, resolve }) =>
	withSecurityHeaders(await resolve(event), event.url.protocol === 'https:');

/** The response with the protective headers it lacks, and the hosted pages allowed in its policy. */
export function withSecurityHeaders(resolved: Response, https: boolean): Response {
	const pairs = https ? headerPairs.https : headerPairs.http;
	// Some responses (Response.redirect from Auth.js) have immutable headers: copy those first.
	let response = resolved;
	try {
		response.headers.set(pairs[0][0], pairs[0][1]);
	} catch {
		response = new Response(resolved.body, resolved);
	}
	const { headers } = response;
	const csp = headers.get('content-security-policy');
	if (csp) headers.set('content-security-policy', widenedPolicy(csp));
	for (const [name, value] of pairs) {
		if (!headers.has(name)) headers.set(name, value);
	}
	return response;
}
