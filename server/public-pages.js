// Public pages built ahead of time (`prerender = 'auto'`), answered from memory to every request without a
// session cookie. svelte.config.js moves them out of adapter-node's own prerendered folder, so a signed-in
// request falls through to SvelteKit, which renders the same page with that person's header.
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { brotliCompressSync, gzipSync, constants } from 'node:zlib';

/** @param {string} dir @returns {string[]} */
function filesUnder(dir) {
	return readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
		entry.isDirectory() ? filesUnder(join(dir, entry.name)) : [join(dir, entry.name)]
	);
}

/** `index.html` → `/`, `how-it-works.html` → `/how-it-works`, `how-it-works/__data.json` as it is. */
function pathOf(/** @type {string} */ file) {
	if (file === 'index.html') return '/';
	return '/' + (file.endsWith('.html') ? file.slice(0, -'.html'.length) : file);
}

/**
 * Kit writes a prerendered page's Content-Security-Policy (script hashes instead of nonces) into a meta
 * tag; the same policy goes out as a header, with `frame-ancestors`, which a meta tag cannot carry.
 * @param {string} html
 */
function policyOf(html) {
	const meta = /<meta http-equiv="content-security-policy" content="([^"]*)"/i.exec(html);
	if (!meta) return null;
	const policy = meta[1].replaceAll('&#39;', "'").replaceAll('&quot;', '"').replaceAll('&amp;', '&');
	return /frame-ancestors/.test(policy) ? policy : `${policy}; frame-ancestors 'none'`;
}

/** @typedef {{ type: string; etag: string; policy: string | null; identity: Buffer; gzip: Buffer; br: Buffer }} Page */

/** @param {string} dir */
export function loadPublicPages(dir) {
	/** @type {Map<string, Page>} */
	const pages = new Map();
	if (!existsSync(dir)) return pages;
	for (const file of filesUnder(dir)) {
		if (!/\.(html|json)$/.test(file)) continue;
		const identity = readFileSync(file);
		const html = file.endsWith('.html');
		pages.set(pathOf(relative(dir, file).split('\\').join('/')), {
			type: html ? 'text/html; charset=utf-8' : 'application/json',
			etag: `"${createHash('sha256').update(identity).digest('base64url').slice(0, 27)}"`,
			policy: html ? policyOf(identity.toString('utf8')) : null,
			identity,
			gzip: gzipSync(identity, { level: 9 }),
			br: brotliCompressSync(identity, { params: { [constants.BROTLI_PARAM_QUALITY]: 11 } })
		});
	}
	return pages;
}

/** Auth.js's session cookie, whatever its prefix or chunk number. */
const sessionCookie = 'authjs.session-token';

/**
 * Answers the request when it is a GET or HEAD for a public page and carries no session cookie.
 * @param {Map<string, Page>} pages
 * @param {import('node:http').IncomingMessage} req
 * @param {import('node:http').ServerResponse} res
 */
export function servePublicPage(pages, req, res) {
	if (req.method !== 'GET' && req.method !== 'HEAD') return false;
	const page = pages.get((req.url ?? '').split('?')[0]);
	if (!page || String(req.headers.cookie ?? '').includes(sessionCookie)) return false;
	res.setHeader('content-type', page.type);
	res.setHeader('etag', page.etag);
	// The same address answers differently once signed in: caches must ask again each time and keep copies apart.
	res.setHeader('cache-control', 'no-cache');
	res.setHeader('vary', 'Cookie, Accept-Encoding');
	if (page.policy) res.setHeader('content-security-policy', page.policy);
	const tags = String(req.headers['if-none-match'] ?? '');
	if (tags.split(',').some((tag) => tag.trim().replace(/^W\//, '') === page.etag)) {
		res.writeHead(304).end();
		return true;
	}
	const accepted = String(req.headers['accept-encoding'] ?? '');
	const encoding = /\bbr\b/.test(accepted) ? 'br' : /\bgzip\b/.test(accepted) ? 'gzip' : null;
	const body = encoding ? page[encoding] : page.identity;
	if (encoding) res.setHeader('content-encoding', encoding);
	res.setHeader('content-length', body.length);
	res.writeHead(200);
	res.end(req.method === 'HEAD' ? undefined : body);
	return true;
}
