import { createHash } from 'node:crypto';

/** A worked-out answer as sent, and whether it may be kept for the same request. */
export type Answer = { status: number; body: string; headers: Record<string, string>; keep: boolean };

/**
 * The answers of pure computations (a draft, a layout, an estimate: with the same build, the same request
 * always gives the same answer), kept by a hash of the request in a bounded least-recently-used map, with
 * identical requests in flight sharing one computation. Each process keeps its own; they cannot disagree,
 * since nothing but the request and the code decides an answer.
 */
export function answerCache({ maxEntries, maxBytes }: { maxEntries: number; maxBytes: number }) {
	const kept = new Map<string, Answer>();
	const pending = new Map<string, Promise<Answer>>();
	let bytes = 0;

	const sizeOf = (answer: Answer) => answer.body.length * 2;

	function remember(key: string, answer: Answer) {
		const size = sizeOf(answer);
		if (size > maxBytes / 8) return; // one huge answer would push out many ordinary ones
		kept.set(key, answer);
		bytes += size;
		for (const [oldest, old] of kept) {
			if (kept.size <= maxEntries && bytes <= maxBytes) break;
			kept.delete(oldest);
			bytes -= sizeOf(old);
		}
	}

	const keyOf = (request: unknown) => createHash('sha256').update(JSON.stringify(request)).digest('base64url');

	/** The kept answer under `key`, now the most recently used (they go to the end). */
	function use(key: string): Answer | undefined {
		const hit = kept.get(key);
		if (hit) {
			kept.delete(key);
			kept.set(key, hit);
		}
		return hit;
	}

	return {
		/** The kept answer for `request`, if there is one, without working anything out. */
		peek(request: unknown): Answer | undefined {
			return use(keyOf(request));
		},
		/** The kept answer for `request`, or the one `work()` gives (kept when it says so). */
		get(request: unknown, work: () => Promise<Answer>): Promise<Answer> {
			const key = keyOf(request);
			const hit = use(key);
			if (hit) return Promise.resolve(hit);
			let running = pending.get(key);
			if (!running) {
				running = work().then((answer) => {
					if (answer.keep) remember(key, answer);
					return answer;
				});
				pending.set(key, running);
				void running.finally(() => pending.delete(key)).catch(() => {});
			}
			return running;
		},
		get size() {
			return kept.size;
		},
		get bytes() {
			return bytes;
		}
	};
}
