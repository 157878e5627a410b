// Pages and lists sent again from memory while they are still what the app would render.
//
// The app marks an answer it may be sent again (src/lib/server/freshness/handle.ts) with the data version it
// read before reading anything else (with the session, when there is one) and with that session and user.
// Every committed change to what pages show moves the version (migration 0011, a deferred trigger on each
// table). Before a kept answer is sent again, one query checks that the version is unchanged and, for a
// signed-in answer, that its session is still live and its account not suspended; a kept API answer also
// counts against the app's own per-address limit. Otherwise the request goes to the app as usual. Each app
// process keeps its own answers, and they never disagree, because every use is checked against the one
// database. An answer is kept for at most `maxAgeMs` besides, for what the clock alone changes ("due in 2
// days"). A request that asks for no cached answer (`Cache-Control: no-cache`, a reload) goes to the app.
import pg from 'pg';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import { captureBody, headersOf } from './capture.js';
import { withinApiLimit } from './front-door.js';

/** Set by the app on a keepable answer; always removed here, so it never reaches the browser. */
const markHeader = 'x-tackline-keep';
const maxAgeMs = 30_000;
const maxEntries = 2000;
const maxBodyBytes = 1024 * 1024;
const maxKeptBytes = 64 * 1024 * 1024;
/** Headers sent again with a kept answer (the protective headers are set for every response anyway). */
const keptHeaders = [
	'content-type',
	'cache-control',
	'content-security-policy',
	'link',
	'vary',
	'x-robots-tag',
	'x-search-source'
];
const versionOnly = {
	name: 'tackline-kept-answer-version',
	text: 'select value::text as version from data_version where id = 1'
};
const check = {
	name: 'tackline-kept-answer-check',
	text: `select d.value::text as version
		from data_version d
		where d.id = 1 and exists (
			select 1 from session s join "user" u on u.id = s.user_id
			where s.session_token = $1 and s.user_id = $2 and s.expires > now() and u.suspended_at is null
		)`
};

/**
 * @typedef {{ version: string; sessionId: string; userId: string; endsAt: number; until: number;
 *   headers: Record<string, string>; etag: string; identity: Buffer; gzip?: Buffer; br?: Buffer }} Kept
 */

/** @param {import('node:http').IncomingMessage} req */
function keyOf(req) {
	if ((req.method !== 'GET' && req.method !== 'HEAD') || req.headers.authorization) return null;
	const asked = `${req.headers['cache-control'] ?? ''} ${req.headers.pragma ?? ''}`;
	if (/no-cache|no-store|max-age=0/.test(asked)) return null;
	const cookie = String(req.headers.cookie ?? '');
	// A request without a session shares answers rendered without one; the cookie header is part of the key.
	return [req.url, cookie, req.headers.accept ?? '', req.headers['accept-language'] ?? ''].join('\n');
}

/** @param {string | undefined} header @param {string} etag */
const matchesTag = (header, etag) => Boolean(header?.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etag));

/** @param {string} value */
function readMark(value) {
	try {
		const mark = JSON.parse(decodeURIComponent(value));
		const valid = ['v', 's', 'u'].every((name) => typeof mark[name] === 'string') && typeof mark.e === 'number';
		return valid ? /** @type {{ v: string; s: string; u: string; e: number }} */ (mark) : null;
	} catch {
		return null;
	}
}

/** @param {{ databaseUrl: string | undefined }} options */
export function privateAnswers({ databaseUrl }) {
	/** @type {Map<string, Kept>} */
	const kept = new Map();
	let keptBytes = 0;
	const pool = databaseUrl ? new pg.Pool({ connectionString: databaseUrl, max: 4, idleTimeoutMillis: 30_000 }) : null;
	pool?.on('error', () => {}); // a dropped idle connection is replaced on the next check

	/** @param {string} key */
	function drop(key) {
		const answer = kept.get(key);
		if (!answer) return;
		kept.delete(key);
		keptBytes -= answer.identity.length + (answer.gzip?.length ?? 0) + (answer.br?.length ?? 0);
	}

	/** @param {string} key @param {Kept} answer */
	function keep(key, answer) {
		drop(key);
		while (kept.size >= maxEntries || (kept.size && keptBytes + answer.identity.length > maxKeptBytes)) {
			drop(/** @type {string} */ (kept.keys().next().value));
		}
		kept.set(key, answer);
		keptBytes += answer.identity.length;
	}

	/** Whether the answer may still be sent: its session live, its account not suspended, nothing changed. */
	async function stillCurrent(/** @type {Kept} */ answer) {
		if (!pool || answer.until <= Date.now() || (answer.endsAt && answer.endsAt <= Date.now())) return false;
		try {
			const { rows } = answer.sessionId
				? await pool.query({ ...check, values: [answer.sessionId, answer.userId] })
				: await pool.query(versionOnly);
			return rows[0]?.version === answer.version;
		} catch {
			return false; // the app answers, and reports the database's state its own way
		}
	}

	/** @param {Kept} answer @param {'gzip' | 'br'} encoding */
	function encoded(answer, encoding) {
		if (!answer[encoding]) {
			answer[encoding] =
				encoding === 'br'
					? brotliCompressSync(answer.identity, { params: { [constants.BROTLI_PARAM_QUALITY]: 5 } })
					: gzipSync(answer.identity);
			keptBytes += answer[encoding].length;
		}
		return /** @type {Buffer} */ (answer[encoding]);
	}

	/**
	 * Sends the kept answer to this request when it is still current; false when the app must answer.
	 * @param {import('node:http').IncomingMessage} req @param {import('node:http').ServerResponse} res
	 */
	async function serve(req, res) {
		const key = keyOf(req);
		const answer = key ? kept.get(key) : undefined;
		if (!key || !answer) return false;
		const path = (req.url ?? '').split('?')[0];
		if ((path === '/api' || path.startsWith('/api/')) && !(await withinApiLimit(req))) return false;
		if (!(await stillCurrent(answer))) {
			if (kept.get(key) === answer) drop(key);
			return false;
		}
		for (const [name, value] of Object.entries(answer.headers)) res.setHeader(name, value);
		res.setHeader('etag', answer.etag);
		res.setHeader('age', String(Math.floor((Date.now() - (answer.until - maxAgeMs)) / 1000)));
		if (matchesTag(/** @type {string | undefined} */ (req.headers['if-none-match']), answer.etag)) {
			res.writeHead(304).end();
			return true;
		}
		const accepted = String(req.headers['accept-encoding'] ?? '');
		const large = answer.identity.length > 1024;
		const encoding = large && /\bbr\b/.test(accepted) ? 'br' : large && /\bgzip\b/.test(accepted) ? 'gzip' : null;
		const body = encoding ? encoded(answer, encoding) : answer.identity;
		if (encoding) res.setHeader('content-encoding', encoding);
		res.setHeader('vary', [answer.headers.vary, 'Accept-Encoding', 'Cookie'].filter(Boolean).join(', '));
		res.setHeader('content-length', body.length);
		res.writeHead(200);
		res.end(req.method === 'HEAD' ? undefined : body);
		return true;
	}

	/**
	 * Removes the app's mark from every answer, and keeps a marked one for the request's key.
	 * @param {import('node:http').IncomingMessage} req @param {import('node:http').ServerResponse} res
	 */
	function watch(req, res) {
		const key = keyOf(req);
		/** @type {ReturnType<typeof readMark>} */
		let mark = null;
		const writeHead = res.writeHead;
		res.writeHead = /** @type {typeof res.writeHead} */ (
			function (/** @type {any[]} */ ...args) {
				const value = res.getHeader(markHeader);
				if (value !== undefined) {
					res.removeHeader(markHeader);
					mark = readMark(String(value));
				}
				return writeHead.apply(res, /** @type {any} */ (args));
			}
		);
		if (!key || req.method !== 'GET' || !pool) return;
		captureBody(res, { maxBytes: maxBodyBytes, wanted: () => mark !== null }, (identity) => {
			const found = /** @type {ReturnType<typeof readMark>} */ (mark);
			if (!found || !identity || res.statusCode !== 200 || res.getHeader('set-cookie')) return;
			keep(key, {
				version: found.v,
				sessionId: found.s,
				userId: found.u,
				endsAt: found.e,
				until: Date.now() + maxAgeMs,
				headers: headersOf(res, keptHeaders),
				etag: `"k${found.v}-${identity.length.toString(36)}-${Date.now().toString(36)}"`,
				identity
			});
		});
	}

	return { serve, watch, close: () => pool?.end() };
}
