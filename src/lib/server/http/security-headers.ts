import type { Handle } from '@sveltejs/kit';
import { protectiveHeaders } from './protective-headers.js';

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
	for (const [name, value] of Object.entries(headers)) {
		if (!response.headers.has(name)) response.headers.set(name, value);
	}
	return response;
};
