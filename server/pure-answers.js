// Answers that are a pure function of the request body (drafts, layouts, estimates: the same JSON in gives the
// same JSON out, for anyone), sent again from memory to the same body without reaching SvelteKit.
//
// The app marks such an answer (`x-tackline-pure`, removed here); from then on, JSON posts to that address
// are read whole here first. A body answered before is answered again, after the app's own per-address API
// limit; any other body goes on to the app exactly as it came, replayed from what was read.
import { Readable } from 'node:stream';
import { captureBody, headersOf } from './capture.js';
import { withinApiLimit } from './front-door.js';

const markHeader = 'x-tackline-pure';
/** Larger bodies go straight to the app (its own limit for JSON is 32 KB). */
const maxRequestBytes = 32 * 1024;
const maxEntries = 500;
const maxKeptBytes = 32 * 1024 * 1024;

/** @param {import('node:http').IncomingMessage} req */
const pathOf = (req) => (req.url ?? '').split('?')[0];

/** @typedef {{ type: string; body: Buffer; at: number }} Kept */
/** @typedef {import('node:http').IncomingMessage & { tacklineBody?: Buffer }} Replayed */

/**
 * The request again, its body served from `body`: what adapter-node reads (headers, method, url, the socket
 * for the address, the data and end events) is all there.
 * @param {import('node:http').IncomingMessage} req @param {Buffer} body
 */
function replay(req, body) {
	const copy = /** @type {Replayed} */ (/** @type {unknown} */ (Readable.from([body], { objectMode: false })));
	Object.assign(copy, {
		method: req.method,
		url: req.url,
		headers: req.headers,
		rawHeaders: req.rawHeaders,
		httpVersion: req.httpVersion,
		httpVersionMajor: req.httpVersionMajor,
		httpVersionMinor: req.httpVersionMinor,
		socket: req.socket,
		connection: req.socket,
		complete: true,
		tacklineBody: body
	});
	return copy;
}

/** @param {import('node:http').IncomingMessage} req */
function readWhole(req) {
	return new Promise((resolve, reject) => {
		/** @type {Buffer[]} */
		const chunks = [];
		req.on('data', (/** @type {Buffer} */ chunk) => chunks.push(chunk));
		req.on('end', () => resolve(Buffer.concat(chunks)));
		req.on('error', reject);
	});
}

export function pureAnswers() {
	/** Addresses the app has marked an answer pure at. */
	const pure = new Set();
	/** @type {Map<string, Kept>} */
	const kept = new Map();
	let keptBytes = 0;

	/** Whether this request is read here first: a JSON post of a known size to a pure address. */
	function wants(/** @type {import('node:http').IncomingMessage} */ req) {
		if (req.method !== 'POST' || !pure.has(pathOf(req))) return false;
		const length = Number(req.headers['content-length']);
		const type = String(req.headers['content-type'] ?? '').toLowerCase();
		return Number.isFinite(length) && length > 0 && length <= maxRequestBytes && type.startsWith('application/json');
	}

	/**
	 * Reads the body; sends the answer kept for it when there is one and the limit allows. Otherwise gives back
	 * the request to hand to the app.
	 * @param {import('node:http').IncomingMessage} req @param {import('node:http').ServerResponse} res
	 * @returns {Promise<Replayed | null>}
	 */
	async function serve(req, res) {
		const body = await readWhole(req);
		const answer = kept.get(`${pathOf(req)}\n${body.toString('latin1')}`);
		if (answer && (await withinApiLimit(req))) {
			res.setHeader('content-type', answer.type);
			res.setHeader('content-length', answer.body.length);
			res.setHeader('age', String(Math.floor((Date.now() - answer.at) / 1000)));
			res.writeHead(200).end(answer.body);
			return null;
		}
		return replay(req, body);
	}

	/**
	 * Removes the app's mark from every answer; keeps a marked answer for the body it was given.
	 * @param {Replayed} req @param {import('node:http').ServerResponse} res
	 */
	function watch(req, res) {
		let marked = false;
		const writeHead = res.writeHead;
		res.writeHead = /** @type {typeof res.writeHead} */ (
			function (/** @type {any[]} */ ...args) {
				if (res.getHeader(markHeader) !== undefined) {
					res.removeHeader(markHeader);
					marked = true;
					pure.add(pathOf(req));
				}
				return writeHead.apply(res, /** @type {any} */ (args));
			}
		);
		const body = req.tacklineBody;
		if (req.method !== 'POST' || !body) return;
		captureBody(res, { maxBytes: 4 * 1024 * 1024, wanted: () => marked }, (answer) => {
			if (!marked || !answer || res.statusCode !== 200) return;
			const key = `${pathOf(req)}\n${body.toString('latin1')}`;
			keptBytes -= kept.get(key)?.body.length ?? 0;
			kept.delete(key);
			while (kept.size >= maxEntries || (kept.size && keptBytes + answer.length > maxKeptBytes)) {
				const oldest = /** @type {string} */ (kept.keys().next().value);
				keptBytes -= kept.get(oldest)?.body.length ?? 0;
				kept.delete(oldest);
			}
			const { 'content-type': type = 'application/json' } = headersOf(res, ['content-type']);
			kept.set(key, { type, body: answer, at: Date.now() });
			keptBytes += answer.length;
		});
	}

	return { wants, serve, watch };
}
