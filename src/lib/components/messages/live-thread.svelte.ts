import type { MessageView } from '$lib/types/messages';

export type LiveStatus = 'connecting' | 'live' | 'reconnecting';

const byTime = (a: MessageView, b: MessageView) =>
	a.createdAt === b.createdAt ? (a.id < b.id ? -1 : 1) : a.createdAt < b.createdAt ? -1 : 1;

/**
 * A conversation kept up to date over server-sent events. The browser reconnects by itself and sends the
 * last event id; if the stream is refused or closed, this reconnects with `?after=` the newest message held,
 * so nothing is missed. Messages are merged by id: arriving twice (the send answer and the stream) is harmless.
 */
export class LiveThread {
	messages = $state<MessageView[]>([]);
	status = $state<LiveStatus>('connecting');
	#source: EventSource | null = null;
	#retry: ReturnType<typeof setTimeout> | null = null;
	#failures = 0;
	#stopped = false;

	constructor(
		private readonly threadId: string,
		initial: MessageView[],
		private readonly onIncoming: (message: MessageView) => void = () => {}
	) {
		this.messages = [...initial].sort(byTime);
	}

	get newestId() {
		return this.messages.at(-1)?.id ?? null;
	}

	/** Adds messages not yet held, in time order; answers those that were new. */
	merge(incoming: MessageView[]) {
		const fresh = incoming.filter((m) => !this.messages.some((held) => held.id === m.id));
		if (fresh.length) this.messages = [...this.messages, ...fresh].sort(byTime);
		return fresh;
	}

	/** The viewer's own messages sent up to `readAt` and not yet marked, marked read then. */
	markRead(readAt: string) {
		if (!this.messages.some((m) => m.mine && !m.readAt && m.createdAt <= readAt)) return;
		this.messages = this.messages.map((m) => (m.mine && !m.readAt && m.createdAt <= readAt ? { ...m, readAt } : m));
	}

	start() {
		this.#stopped = false;
		this.#open();
	}

	stop() {
		this.#stopped = true;
		if (this.#retry) clearTimeout(this.#retry);
		this.#source?.close();
		this.#source = null;
	}

	#open() {
		if (this.#stopped) return;
		const after = this.newestId;
		const url = `/api/v1/threads/${this.threadId}/events${after ? `?after=${after}` : ''}`;
		const source = new EventSource(url);
		this.#source = source;
		source.addEventListener('open', () => {
			this.status = 'live';
			this.#failures = 0;
		});
		source.addEventListener('message', (event: MessageEvent<string>) => {
			const message = JSON.parse(event.data) as MessageView;
			for (const fresh of this.merge([message])) if (!fresh.mine) this.onIncoming(fresh);
		});
		// The other side read the conversation: what the viewer had sent by then shows as read.
		source.addEventListener('read', (event: MessageEvent<string>) => {
			const { readAt } = JSON.parse(event.data) as { readAt: string };
			this.markRead(readAt);
		});
		source.addEventListener('error', () => {
			if (source.readyState === EventSource.CONNECTING) {
				this.status = 'reconnecting';
				return;
			}
			// Closed for good (refused, or the server went away mid-answer): start again from what we hold.
			source.close();
			this.status = 'reconnecting';
			this.#failures += 1;
			const delay = Math.min(30_000, 1000 * 2 ** Math.min(this.#failures, 5));
			this.#retry = setTimeout(() => this.#open(), delay);
		});
	}
}
