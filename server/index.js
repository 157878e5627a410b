// The production server (`node build`): adapter-node's request handler behind a thin layer, copied into
// build/index.js by svelte.config.js. adapter-node serves static files before SvelteKit's hooks run, so the
// protective headers are set here, for every response; and a cross-site form post to the JSON API gets
// the API's error shape instead of SvelteKit's plain-text 403.
import http from 'node:http';
import process from 'node:process';
import { protectiveHeaders } from './protective-headers.js';
import { loadPublicPages, servePublicPage } from './public-pages.js';
import { privateAnswers } from './private-answers.js';
import { pureAnswers } from './pure-answers.js';
import { sharedAnswers } from './shared-answers.js';

// The largest body any request may carry: one 15 MB photo upload with its multipart framing. Each route
// reads with its own limit (forms 64 KB, JSON 32 KB, photo uploads 16 MB), so the others stay small.
process.env.BODY_SIZE_LIMIT ??= '16M';
const { handler } = await import('./handler.js');
const publicPages = loadPublicPages(new URL('./public-pages', import.meta.url).pathname);
const shared = sharedAnswers();
const kept = privateAnswers({ databaseUrl: process.env.DATABASE_URL });
const pure = pureAnswers();
process.once('sveltekit:shutdown', () => void kept.close());

const host = process.env.HOST ?? '0.0.0.0';
const port = Number(process.env.PORT ?? 3000);
const configuredOrigin = process.env.ORIGIN;
const protocolHeader = process.env.PROTOCOL_HEADER?.toLowerCase();
const shutdownTimeoutMs = Number(process.env.SHUTDOWN_TIMEOUT ?? 30) * 1000;

/** @param {http.IncomingMessage} req */
function originOf(req) {
	if (configuredOrigin) return configuredOrigin;
	// Without ORIGIN, adapter-node assumes https unless a protocol header says otherwise.
	const protocol = (protocolHeader && String(req.headers[protocolHeader] ?? '')) || 'https';
	return `${protocol}://${req.headers.host ?? ''}`;
}

const formTypes = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain'];
const unsafeMethods = ['POST', 'PUT', 'PATCH', 'DELETE'];

/** SvelteKit refuses these with a plain-text 403; under /api the answer must be the JSON error shape. */
function isCrossSiteApiForm(/** @type {http.IncomingMessage} */ req, /** @type {string} */ origin) {
	const path = (req.url ?? '').split('?')[0];
	if (path !== '/api' && !path.startsWith('/api/')) return false;
	const type = String(req.headers['content-type'] ?? '')
		.split(';')[0]
		.trim()
		.toLowerCase();
	return unsafeMethods.includes(req.method ?? '') && formTypes.includes(type) && req.headers.origin !== origin;
}

const crossSiteBody = JSON.stringify({
	error: {
		code: 'cross_site',
		message: 'Cross-site form submissions are forbidden. Send JSON with Content-Type: application/json.',
		issues: []
	}
});

let closing = false;

/** What a refused body may still send before its connection is cut. */
const discardLimit = 1024 * 1024;

/**
 * adapter-node starts reading every body and pauses when nothing consumes it, so a response sent without
 * reading the body (a 405, a 415, an early 413) would leave the connection stuck mid-body: throw the rest away.
 * @param {http.IncomingMessage} req
 */
function discardUnreadBody(req) {
	if (req.complete || req.destroyed) return;
	req.removeAllListeners('data');
	let left = discardLimit;
	req.on('data', (/** @type {Buffer} */ chunk) => {
		left -= chunk.length;
		if (left < 0) req.destroy();
	});
	req.resume();
}

const server = http.createServer((req, res) => {
	const origin = originOf(req);
	for (const [name, value] of Object.entries(protectiveHeaders({ https: origin.startsWith('https:') }))) {
		res.setHeader(name, value);
	}
	if (closing) res.setHeader('connection', 'close');
	res.on('finish', () => discardUnreadBody(req));
	if (isCrossSiteApiForm(req, origin)) {
		res.writeHead(403, { 'content-type': 'application/json' }).end(crossSiteBody);
		return;
	}
	if (servePublicPage(publicPages, req, res)) return;
	if (shared.serve(req, res)) return;
	if (pure.wants(req)) {
		pure.serve(req, res).then(
			(replayed) => replayed && toApp(replayed, res),
			() => res.destroy()
		);
		return;
	}
	kept.serve(req, res).then(
		(sent) => sent || toApp(req, res),
		() => toApp(req, res)
	);
});

/** @param {http.IncomingMessage} req @param {http.ServerResponse} res */
function toApp(req, res) {
	shared.watch(req, res);
	kept.watch(req, res);
	pure.watch(req, res);
	handler(req, res, () => {
		res.writeHead(404, { 'content-type': 'text/plain' }).end('Not found');
	});
}

server.listen({ host, port }, () => console.log(`Listening on http://${host}:${port}`));

// As adapter-node's own entry does: stop accepting, let requests drain, then tell the app to close its pools.
/** @param {'SIGINT' | 'SIGTERM'} reason */
function shutdown(reason) {
	if (closing) return;
	closing = true;
	server.closeIdleConnections();
	server.close(() => process.emit(/** @type {never} */ ('sveltekit:shutdown'), reason));
	setTimeout(() => server.closeAllConnections(), shutdownTimeoutMs).unref();
}
server.on('request', (req) => req.on('close', () => closing && server.closeIdleConnections()));
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
