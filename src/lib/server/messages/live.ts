import type { MessageView } from '$lib/types/messages';
import type { Executor } from '../db';
import { listen } from '../services/notifications';
import { sideOf, threadFacts } from './access';
import { noSuchThread } from './errors';
import { belongsTo, latestMessageId, messagesAfter } from './queries';
import { messagesChannel } from './transitions';

const encoder = new TextEncoder();

/** One server-sent event: the message id as the event id, so a reconnecting browser says where it stopped. */
export function messageEvent(view: MessageView) {
	return encoder.encode(`id: ${view.id}\nevent: message\ndata: ${JSON.stringify(view)}\n\n`);
}

function parse(payload: string): { threadId?: string } {
	try {
		return JSON.parse(payload) as { threadId?: string };
	} catch {
		return {};
	}
}

/**
 * The live stream of a thread for one participant, as server-sent events. It first sends every message
 * after `after` (the browser's `Last-Event-ID`), then each new one as it commits, from any app process:
 * every notification (and every reconnection of the listening connection) re-reads the database from the
 * last id sent, so nothing is skipped or sent twice. A comment every `heartbeatMs` keeps proxies from
 * closing an idle stream. `signal` (the request's) ends it.
 */
export async function openStream(
	db: Executor,
	{
		threadId,
		viewer,
		after,
		signal,
		heartbeatMs = 20_000
	}: { threadId: string; viewer: { id: string }; after?: string | null; signal?: AbortSignal; heartbeatMs?: number }
): Promise<ReadableStream<Uint8Array>> {
	const facts = await threadFacts(db, threadId);
	if (!facts || !sideOf(facts, viewer)) throw noSuchThread();

	let controller!: ReadableStreamDefaultController<Uint8Array>;
	let lastId: string | null = null;
	let done = false;
	let pending: Promise<void> = Promise.resolve();
	let again = false;
	let running = false;
	let heartbeat: ReturnType<typeof setInterval> | null = null;
	let unsubscribe: (() => void) | null = null;
	// Changes heard before the stream has started are caught up once it has.
	let ready = false;
	let missed = false;

	const stop = () => {
		if (done) return;
		done = true;
		if (heartbeat) clearInterval(heartbeat);
		unsubscribe?.();
		signal?.removeEventListener('abort', stop);
		try {
			controller.close();
		} catch {
			// already closed by the client going away
		}
	};

	const send = (chunk: Uint8Array) => {
		if (done) return;
		try {
			controller.enqueue(chunk);
		} catch {
			stop();
		}
	};

	// Catch-ups never overlap: a change while one runs asks for one more run afterwards.
	const catchUp = () => {
		if (done) return pending;
		if (running) {
			again = true;
			return pending;
		}
		running = true;
		pending = (async () => {
			try {
				do {
					again = false;
					const fresh = await messagesAfter(db, { threadId, after: lastId, viewerId: viewer.id });
					for (const view of fresh) {
						send(messageEvent(view));
						lastId = view.id;
					}
					if (fresh.length === 200) again = true;
				} while (again && !done);
			} catch (error) {
				console.error('[messages] live stream could not read the thread:', error);
				stop();
			} finally {
				running = false;
			}
		})();
		return pending;
	};

	// Listen before reading, so a message committed between the two is heard.
	unsubscribe = await listen(messagesChannel, (event) => {
		if (event.type === 'closing') return stop();
		if (event.type === 'notification' && parse(event.payload).threadId !== threadId) return;
		if (ready) void catchUp();
		else missed = true;
	});
	lastId = after && (await belongsTo(db, { threadId, messageId: after })) ? after : await latestMessageId(db, threadId);
	const startFrom = after && lastId === after;

	return new ReadableStream<Uint8Array>({
		start(c) {
			controller = c;
			send(encoder.encode('retry: 3000\n\n'));
			if (signal?.aborted) return stop();
			signal?.addEventListener('abort', stop);
			heartbeat = setInterval(() => send(encoder.encode(': keep-alive\n\n')), heartbeatMs);
			ready = true;
			if (startFrom || missed) void catchUp();
		},
		cancel() {
			stop();
		}
	});
}
