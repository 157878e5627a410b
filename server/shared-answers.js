// A small shared cache in front of the app, as a CDN would be: an answer the app marks
// `Cache-Control: public, max-age=N` (the same for everyone, such as the garment catalogue) is kept for N
// seconds and sent again from memory to GET and HEAD requests without a session cookie, without reaching
// SvelteKit, its hooks or the database. Signed-in requests always reach the app, which re-checks the session.
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import { captureBody, headersOf } from './capture.js';

/** Answers kept at once, and the largest kept; anything else is simply not kept. */
const maxEntries = 128;
const maxBodyBytes = 1024 * 1024;
/** Headers sent again with a kept answer (the protective headers are set for every response anyway). */
const keptHeaders = ['content-type', 'etag', 'cache-control', 'last-modified', 'content-language'];

/** Auth.js's session cookie, whatever its prefix or chunk number. */
const sessionCookie = 'authjs.session-token';

/** @typedef {{ headers: Record<string, string>; identity: Buffer; gzip: Buffer | null; br: Buffer | null; until: number }} Kept */

/** @param {import('node:http').IncomingMessage} req */
function mayShare(req) {
	if (req.method !== 'GET' && req.method !== 'HEAD') return false;
	if (req.headers.authorization || String(req.headers.cookie ?? '').includes(sessionCookie)) return false;
	return true;
}

/** `max-age` of a `public` answer, in seconds; null when it may not be kept. @param {unknown} value */
function sharedMaxAge(value) {
	const directives = String(value ?? '').toLowerCase();
	if (!/(^|,)\s*public\s*(,|$)/.test(directives) || /no-store|no-cache|private/.test(directives)) return null;
	const age = /(?:^|,)\s*(?:s-maxage|max-age)\s*=\s*(\d+)/.exec(directives);
	return age ? Number(age[1]) : null;
}

/** @param {string | undefined} header @param {string | undefined} etag */
const matchesTag = (header, etag) =>
	Boolean(etag && header?.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etag.replace(/^W\//, '')));

export function sharedAnswers() {
	/** @type {Map<string, Kept>} */
	const kept = new Map();

	/**
	 * Answers the request from memory when a fresh answer is kept for it.
	 * @param {import('node:http').IncomingMessage} req @param {import('node:http').ServerResponse} res
	 */
	function serve(req, res) {
		if (!mayShare(req)) return false;
		const asked = String(req.headers['cache-control'] ?? '') + String(req.headers.pragma ?? '');
		if (/no-cache|max-age=0/.test(asked)) return false;
		const key = req.url ?? '';
		const answer = kept.get(key);
		if (!answer) return false;
		if (answer.until <= Date.now()) {
			kept.delete(key);
			return false;
		}
		for (const [name, value] of Object.entries(answer.headers)) res.setHeader(name, value);
		res.setHeader('vary', 'Accept-Encoding');
		if (matchesTag(/** @type {string | undefined} */ (req.headers['if-none-match']), answer.headers.etag)) {
			res.writeHead(304).end();
			return true;
		}
		const accepted = String(req.headers['accept-encoding'] ?? '');
		const encoding =
			answer.br && /\bbr\b/.test(accepted) ? 'br' : answer.gzip && /\bgzip\b/.test(accepted) ? 'gzip' : null;
		const body = encoding ? /** @type {Buffer} */ (answer[encoding]) : answer.identity;
		if (encoding) res.setHeader('content-encoding', encoding);
		res.setHeader('content-length', body.length);
		res.writeHead(200);
		res.end(req.method === 'HEAD' ? undefined : body);
		return true;
	}

	/**
	 * Watches the app's answer to the request and keeps it when it says it may be shared.
	 * @param {import('node:http').IncomingMessage} req @param {import('node:http').ServerResponse} res
	 */
	function watch(req, res) {
		if (req.method !== 'GET' || !mayShare(req)) return;
		const key = req.url ?? '';
		captureBody(res, { maxBytes: maxBodyBytes }, (identity) => {
			const maxAge = sharedMaxAge(res.getHeader('cache-control'));
			const encoded = res.getHeader('content-encoding');
			const vary = String(res.getHeader('vary') ?? '').toLowerCase();
			if (
				!identity ||
				res.statusCode !== 200 ||
				!maxAge ||
				encoded ||
				res.getHeader('set-cookie') ||
				(vary && vary !== 'accept-encoding')
			) {
				return;
			}
			const compressible = identity.length > 1024;
			if (kept.size >= maxEntries) kept.delete(/** @type {string} */ (kept.keys().next().value));
			kept.set(key, {
				headers: headersOf(res, keptHeaders),
				identity,
				gzip: compressible ? gzipSync(identity) : null,
				br: compressible ? brotliCompressSync(identity, { params: { [constants.BROTLI_PARAM_QUALITY]: 9 } }) : null,
				until: Date.now() + maxAge * 1000
			});
		});
	}

	return { serve, watch };
}
