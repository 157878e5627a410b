// What our entry asks the app (same process) before it sends an API answer kept from before.

/** Set by the app once it runs (src/lib/server/freshness/front-door.ts). */
const frontDoorKey = Symbol.for('tackline.front-door');

// The caller's address as adapter-node works it out (ADDRESS_HEADER, XFF_DEPTH), for the API's limit.
const addressHeader = (process.env.ADDRESS_HEADER ?? '').toLowerCase();
const forwardedDepth = Number.parseInt(process.env.XFF_DEPTH ?? '1', 10);

/** @param {import('node:http').IncomingMessage} req */
function clientAddress(req) {
	if (!addressHeader) return req.socket.remoteAddress ?? 'unknown';
	const value = String(req.headers[addressHeader] ?? '');
	if (!value) return 'unknown';
	if (addressHeader !== 'x-forwarded-for') return value;
	const addresses = value.split(',');
	return addresses[addresses.length - forwardedDepth]?.trim() || 'unknown';
}

/** Whether the public API's limit lets this request through; false also before the app has started. */
export async function withinApiLimit(/** @type {import('node:http').IncomingMessage} */ req) {
	const door = /** @type {{ allowApi?: (address: string) => Promise<boolean> } | undefined} */ (
		/** @type {Record<symbol, unknown>} */ (globalThis)[frontDoorKey]
	);
	return door?.allowApi ? door.allowApi(clientAddress(req)) : false;
}
