/** The person's own unread-count stream: anyone signed in and not suspended; it names no one else's data. */
import { baseUrl, type Client } from '../http';
import type { Row } from './matrix';

/** The stream never ends by itself: keep its status and first bytes, then hang up. */
async function firstBytes(client: Client, path: string) {
	const cookie = [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ');
	const abort = new AbortController();
	const response = await fetch(baseUrl + path, {
		headers: { origin: baseUrl, 'x-forwarded-for': client.address, ...(cookie ? { cookie } : {}) },
		signal: abort.signal,
		redirect: 'manual'
	});
	const reader = response.body?.getReader();
	const first = reader ? await reader.read() : { value: undefined };
	abort.abort();
	return new Response(first.value ? new TextDecoder().decode(first.value) : '', {
		status: response.status,
		headers: response.headers
	});
}

export const liveMessageRows: Row[] = [
	{
		name: 'GET /api/v1/threads/events',
		arrange: () => Promise.resolve({ secrets: [] }),
		send: (client) => firstBytes(client, '/api/v1/threads/events'),
		expect: {
			anonymous: 401,
			owner: 200,
			otherCustomer: 200,
			tailor: 200,
			tailorOnboarding: 200,
			admin: 200,
			suspended: 401
		}
	}
];
