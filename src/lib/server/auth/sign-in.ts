import type { RequestEvent } from '@sveltejs/kit';
import { signIn } from '.';

/** Hands already-validated fields to Auth.js, whose sign-in action reads the request body itself. */
export function callAuthSignIn(event: RequestEvent, fields: Record<string, string>) {
	const body = new FormData();
	for (const [key, value] of Object.entries(fields)) body.set(key, value);
	const headers = new Headers(event.request.headers);
	headers.delete('content-type');
	headers.delete('content-length');
	const request = new Request(event.request.url, { method: 'POST', headers, body });
	return signIn({ ...event, request });
}
