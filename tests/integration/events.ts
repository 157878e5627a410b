/** Server-sent events as a test reads them: one event at a time, the way EventSource does. */
import { baseUrl, type Client } from './http';

export type Event = { id: string | null; event: string | null; data: string };

export function headersOf(client: Client, extra: Record<string, string> = {}) {
	const cookie = [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ');
	return { origin: baseUrl, 'x-forwarded-for': client.address, ...(cookie ? { cookie } : {}), ...extra };
}

/** Opens a thread's event stream as `client`; `next()` waits for the next event with data. */
export async function openEvents(
	client: Client,
	threadId: string,
	options: { lastEventId?: string; after?: string; server?: string } = {}
) {
	const abort = new AbortController();
	const query = options.after ? `?after=${options.after}` : '';
	const response = await fetch(`${options.server ?? baseUrl}/api/v1/threads/${threadId}/events${query}`, {
		headers: headersOf(client, {
			accept: 'text/event-stream',
			...(options.lastEventId ? { 'last-event-id': options.lastEventId } : {})
		}),
		signal: abort.signal
	});
	const reader = response.body!.getReader();
	const decoder = new TextDecoder();
	let buffer = '';
	const comments: string[] = [];

	async function next(timeoutMs = 10_000): Promise<Event> {
		const deadline = Date.now() + timeoutMs;
		for (;;) {
			const end = buffer.indexOf('\n\n');
			if (end >= 0) {
				const block = buffer.slice(0, end);
				buffer = buffer.slice(end + 2);
				const lines = block.split('\n');
				comments.push(...lines.filter((line) => line.startsWith(':')));
				const field = (name: string) =>
					lines.filter((line) => line.startsWith(`${name}:`)).map((line) => line.slice(name.length + 1).trimStart());
				const data = field('data');
				if (data.length) return { id: field('id')[0] ?? null, event: field('event')[0] ?? null, data: data.join('\n') };
				continue;
			}
			const left = deadline - Date.now();
			if (left <= 0) throw new Error('no event in time');
			const chunk = await Promise.race([
				reader.read(),
				new Promise<never>((_, reject) => setTimeout(() => reject(new Error('no event in time')), left))
			]);
			if (chunk.done) throw new Error('the stream ended');
			buffer += decoder.decode(chunk.value, { stream: true });
		}
	}

	return { response, next, comments, close: () => abort.abort() };
}
