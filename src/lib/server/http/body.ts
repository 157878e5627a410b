/** Reading request bodies with a size limit, so no route buffers more than it can use. */

export class BodyError extends Error {
	constructor(
		readonly status: 400 | 413 | 415,
		readonly code: 'unreadable_body' | 'too_large' | 'unsupported_media_type',
		message: string
	) {
		super(message);
	}
}

export const kilobytes = (n: number) => n * 1024;

function describeBytes(limit: number) {
	return limit >= 1024 * 1024 ? `${Math.round(limit / (1024 * 1024))} MB` : `${Math.round(limit / 1024)} KB`;
}

export function tooLarge(limit: number) {
	return new BodyError(
		413,
		'too_large',
		`The request is larger than the ${describeBytes(limit)} this address accepts.`
	);
}

/** The media type without parameters, lower-cased; '' when absent. */
export function mediaType(request: Request) {
	return (request.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
}

/** adapter-node's own BODY_SIZE_LIMIT surfaces as an error with status 413 while streaming. */
const isPayloadTooLarge = (error: unknown) =>
	typeof error === 'object' && error !== null && (error as { status?: unknown }).status === 413;

/**
 * Reads the rest of a refused body and throws it away (in the background). Left unread, adapter-node keeps
 * the connection paused mid-body and the client's next request on it hangs; BODY_SIZE_LIMIT bounds the work.
 */
function discard(reader: ReadableStreamDefaultReader<Uint8Array>) {
	const next = (): Promise<void> => reader.read().then(({ done }) => (done ? undefined : next()));
	void next().catch(() => {});
}

/** The whole body, refusing (413) as soon as it passes `limit` bytes, declared or streamed. */
export async function readLimited(request: Request, limit: number): Promise<Uint8Array<ArrayBuffer>> {
	const declared = Number(request.headers.get('content-length'));
	if (Number.isFinite(declared) && declared > limit) {
		if (request.body) discard(request.body.getReader());
		throw tooLarge(limit);
	}
	if (!request.body) return new Uint8Array(0);
	const reader = request.body.getReader();
	const chunks: Uint8Array[] = [];
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) break;
			size += value.byteLength;
			if (size > limit) {
				discard(reader);
				throw tooLarge(limit);
			}
			chunks.push(value);
		}
	} catch (error) {
		if (error instanceof BodyError) throw error;
		if (isPayloadTooLarge(error)) throw tooLarge(limit);
		throw new BodyError(400, 'unreadable_body', 'The request body could not be read.');
	}
	const bytes = new Uint8Array(size);
	let offset = 0;
	for (const chunk of chunks) {
		bytes.set(chunk, offset);
		offset += chunk.byteLength;
	}
	return bytes;
}

/** NUL and the other C0 controls (and DEL) have no place in typed text; PostgreSQL refuses NUL outright. */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const controlsExceptLineBreaks = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
// eslint-disable-next-line no-control-regex -- as above
const anyControl = /[\u0000-\u001F\u007F]/;

export function hasControlCharacters(value: string, options: { multiline?: boolean } = {}) {
	return (options.multiline ? controlsExceptLineBreaks : anyControl).test(value);
}
