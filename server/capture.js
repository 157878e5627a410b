// What the app writes to a response, collected on the way out by the layers that keep answers.

/**
 * Collects the body the app sends through `res` and calls `done` with it just before the end goes out: the
 * whole body, or null once it passed `maxBytes` or `wanted()` said no at a chunk.
 * @param {import('node:http').ServerResponse} res
 * @param {{ maxBytes: number; wanted?: () => boolean }} options
 * @param {(body: Buffer | null) => void} done
 */
export function captureBody(res, { maxBytes, wanted = () => true }, done) {
	/** @type {Buffer[]} */
	const chunks = [];
	let size = 0;
	let whole = true;
	const collect = (/** @type {unknown} */ chunk) => {
		if (!whole || chunk == null || typeof chunk === 'function') return;
		if (!wanted()) {
			whole = false;
			return;
		}
		const buffer = typeof chunk === 'string' ? Buffer.from(chunk) : Buffer.from(/** @type {Uint8Array} */ (chunk));
		size += buffer.length;
		if (size > maxBytes) whole = false;
		else chunks.push(buffer);
	};
	const write = res.write;
	const end = res.end;
	res.write = /** @type {typeof res.write} */ (
		function (/** @type {unknown} */ chunk, /** @type {any[]} */ ...rest) {
			collect(chunk);
			return write.call(res, /** @type {any} */ (chunk), ...rest);
		}
	);
	res.end = /** @type {typeof res.end} */ (
		function (/** @type {unknown} */ chunk, /** @type {any[]} */ ...rest) {
			collect(chunk);
			done(whole ? Buffer.concat(chunks) : null);
			return end.call(res, /** @type {any} */ (chunk), ...rest);
		}
	);
}

/**
 * The named headers the response carries, as strings.
 * @param {import('node:http').ServerResponse} res @param {string[]} names
 */
export function headersOf(res, names) {
	/** @type {Record<string, string>} */
	const headers = {};
	for (const name of names) {
		const value = res.getHeader(name);
		if (value !== undefined) headers[name] = String(value);
	}
	return headers;
}
