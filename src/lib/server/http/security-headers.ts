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

/** Headers that belong on every response; the Content-Security-Policy comes from svelte.config.js. */
export const securityHeaders: Handle = async ({ event, resolve }) => {
	const resolved = await resolve(event);
	const headers = protectiveHeaders({ https: event.url.protocol === 'https:' });
	// Some responses (Response.redirect from Auth.js) have immutable headers: copy those first.
	let response = resolved;
	try {
		response.headers.set('x-content-type-options', headers['x-content-type-options']);
	} catch {
		response = new Response(resolved.body, resolved);
	}
	const csp = response.headers.get('content-security-policy');
	if (csp) response.headers.set('content-security-policy', allowHostedPages(csp));
	for (const [name, value] of Object.entries(headers)) {
		if (!response.headers.has(name)) response.headers.set(name, value);
	}
	return response;
};
