// Plain JavaScript: the production server entry (server/index.js) copies this file next to itself, so
// static files get the same headers as pages. The Content-Security-Policy comes from svelte.config.js.

/** Two years, the usual preload-list minimum; only ever sent over https. */
const hsts = 'max-age=63072000; includeSubDomains';

/**
 * The headers every response carries.
 * @param {{ https: boolean }} options
 * @returns {Record<string, string>}
 */
export function protectiveHeaders({ https }) {
	return {
		'x-content-type-options': 'nosniff',
		'referrer-policy': 'strict-origin-when-cross-origin',
		'permissions-policy': 'camera=(), microphone=(), geolocation=(self), payment=()',
		'x-frame-options': 'DENY',
		...(https ? { 'strict-transport-security': hsts } : {})
	};
}
