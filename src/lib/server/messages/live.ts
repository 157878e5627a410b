import type { MessageView } from '$lib/types/messages';
import type { Executor } from '../db';
import { listen } from '../services/notifications';
import { sideOf, threadFacts } from './access';
import { noSuchThread } from './errors';
import { belongsTo, latestMessageId, messagesAfter, unreadCount } from './queries';
import { messagesChannel } from './transitions';

const encoder = new TextEncoder();

/** One server-sent event: the message id as the event id, so a reconnecting browser says where it stopped. */
export function messageEvent(view: MessageView) {
	return encoder.encode(`id: ${view.id}\nevent: message\ndata: ${JSON.stringify(view)}\n\n`);
}

/** What a notification on the messages channel says: a message posted, or messages read (`readBy`). */
type Note = { threadId?: string; messageId?: string; readBy?: string; readAt?: string; people?: string[] };

function parse(payload: string): Note {
	try {
		return JSON.parse(payload) as Note;
	} catch {
		return {};
	}
}

/** The other side read what the viewer sent, up to now: their "read" marks can show. No id: resuming skips it. */
export function readEvent(readAt: string) {
	return encoder.encode(`event: read\ndata: ${JSON.stringify({ readAt })}\n\n`);
}

/** How many messages wait unread for the viewer, across their conversations. */
export function unreadEvent(count: number) {
	return encoder.encode(`event: unread\ndata: ${JSON.stringify({ count })}\n\n`);
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
		if (event.type === 'notification') {
			const note = parse(event.payload);
			if (note.threadId !== threadId) return;
			if (note.readBy) {
				if (note.readBy !== viewer.id && note.readAt && ready) send(readEvent(note.readAt));
				return;
			}
		}
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

/**
 * The viewer's unread count, live, as server-sent events (`event: unread`, `{ count }`): once at the start,
 * then whenever a message is posted or read in one of their conversations, from any app process. Counts
 * are re-read from the database (one at a time, the last one winning), so a burst costs one or two reads.
 */
export async function openUnreadStream(
	db: Executor,
	{ viewer, signal, heartbeatMs = 20_000 }: { viewer: { id: string }; signal?: AbortSignal; heartbeatMs?: number }
): Promise<ReadableStream<Uint8Array>> {
	let controller!: ReadableStreamDefaultController<Uint8Array>;
	let done = false;
	let running = false;
	let again = false;
	let last: number | null = null;
	let heartbeat: ReturnType<typeof setInterval> | null = null;
	let unsubscribe: (() => void) | null = null;

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
	const recount = async () => {
		if (done) return;
		if (running) {
			again = true;
			return;
		}
		running = true;
		try {
			do {
				again = false;
				const count = await unreadCount(db, viewer);
				if (count !== last) send(unreadEvent((last = count)));
			} while (again && !done);
		} catch (error) {
			console.error('[messages] unread stream could not count:', error);
			stop();
		} finally {
			running = false;
		}
	};

	let ready = false;
	unsubscribe = await listen(messagesChannel, (event) => {
		if (event.type === 'closing') return stop();
		if (event.type === 'notification' && !parse(event.payload).people?.includes(viewer.id)) return;
		if (ready) void recount();
	});
	return new ReadableStream<Uint8Array>({
		start(c) {
			controller = c;
			send(encoder.encode('retry: 5000\n\n'));
			if (signal?.aborted) return stop();
			signal?.addEventListener('abort', stop);
			heartbeat = setInterval(() => send(encoder.encode(': keep-alive\n\n')), heartbeatMs);
			ready = true;
			void recount();
		},
		cancel() {
			stop();
		}
	});
}
