import type { RequestEvent } from '@sveltejs/kit';
import { signIn, signOut } from '.';
import { publicOrigin } from './origin';

/**
 * Auth.js builds its own URLs (and the links it mails) from the Host / X-Forwarded-* headers; it is
 * only ever called from here, with those headers replaced by the configured origin.
 */
function pinnedEvent(event: RequestEvent, body?: FormData): RequestEvent {
	const origin = new URL(publicOrigin());
	const headers = new Headers();
	const cookie = event.request.headers.get('cookie');
	if (cookie) headers.set('cookie', cookie);
	headers.set('host', origin.host);
	headers.set('x-forwarded-proto', origin.protocol);
	const url = new URL(event.url.pathname + event.url.search, origin);
	const request = new Request(url, { method: 'POST', headers, body: body ?? new FormData() });
	return { ...event, url, request };
}

/**
 * Hands already-validated fields to Auth.js, whose sign-in action reads the request body itself.
 * Asking for a link sets no cookie in the browser (Auth.js would set its callback-URL cookie), so the
 * answer is the same whether or not a link was made.
 */
export function callAuthSignIn(event: RequestEvent, fields: Record<string, string>) {
	const body = new FormData();
	for (const [key, value] of Object.entries(fields)) body.set(key, value);
	const pinned = pinnedEvent(event, body);
	if (fields.providerId !== 'credentials') pinned.cookies = { ...event.cookies, set: () => {} };
	return signIn(pinned);
}

export function callAuthSignOut(event: RequestEvent) {
	return signOut(pinnedEvent(event));
}
