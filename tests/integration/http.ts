/** A tiny HTTP client for integration tests: form posts with the Origin header and a cookie jar. */
import { randomInt } from 'node:crypto';
import { linkIn, subjects, waitForMail } from './inbox';

export const baseUrl = process.env.TACKLINE_BASE_URL ?? 'http://localhost:3000';

/**
 * Each client has its own documentation-range address, so per-address limits do not leak between tests.
 * `base` points it at another server (a second app process on the same database).
 */
export function newClient(address = `198.18.${randomInt(0, 255)}.${randomInt(1, 255)}`, base = baseUrl) {
	const jar = new Map<string, string>();

	function remember(response: Response) {
		for (const header of response.headers.getSetCookie()) {
			const [pair] = header.split(';');
			const index = pair.indexOf('=');
			const name = pair.slice(0, index).trim();
			const value = pair.slice(index + 1).trim();
			if (value === '' || /max-age=0|expires=thu, 01 jan 1970/i.test(header)) jar.delete(name);
			else jar.set(name, value);
		}
	}

	function headers(extra: Record<string, string> = {}) {
		const cookie = [...jar].map(([name, value]) => `${name}=${value}`).join('; ');
		return { origin: baseUrl, 'x-forwarded-for': address, ...(cookie ? { cookie } : {}), ...extra };
	}

	return {
		address,
		base,
		jar,
		async get(path: string) {
			const response = await fetch(base + path, { headers: headers(), redirect: 'manual' });
			remember(response);
			return response;
		},
		async post(path: string, fields: Record<string, string> = {}) {
			const response = await fetch(base + path, {
				method: 'POST',
				headers: headers({ 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html' }),
				body: new URLSearchParams(fields),
				redirect: 'manual'
			});
			remember(response);
			return response;
		},
		/** A JSON API call; `body` is sent as JSON when given. */
		async json(method: string, path: string, body?: unknown, extra: Record<string, string> = {}) {
			const response = await fetch(base + path, {
				method,
				headers: headers({ ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...extra }),
				body: body === undefined ? undefined : JSON.stringify(body),
				redirect: 'manual'
			});
			remember(response);
			return response;
		},
		/** One file as the multipart field `file`. */
		async upload(path: string, bytes: Uint8Array, name = 'photo.png') {
			const body = new FormData();
			body.append('file', new Blob([new Uint8Array(bytes)]), name);
			const response = await fetch(base + path, { method: 'POST', headers: headers(), body, redirect: 'manual' });
			remember(response);
			return response;
		}
	};
}

export type Client = ReturnType<typeof newClient>;

export function uniqueEmail(prefix: string) {
	return `${prefix}.${Date.now().toString(36)}${randomInt(1000, 9999)}@example.test`;
}

/** Posts the sign-up form and nothing more. */
export async function postSignUp(
	client: Client,
	fields: { name?: string; email: string; password?: string; role: 'customer' | 'tailor' }
) {
	return client.post('/sign-up', {
		name: fields.name ?? 'Test Person',
		password: fields.password ?? 'correct horse staple',
		...fields
	});
}

/** Opens an emailed link in the client (the link's path on the server under test). */
export function openLink(client: Client, link: URL) {
	return client.get(link.pathname + link.search);
}

/**
 * A new account as a person makes one: sign up, confirm the address through the mailed link (in
 * another browser), then sign in with the password. Answers the password sign-in's response.
 */
export async function signUp(
	client: Client,
	fields: { name?: string; email: string; password?: string; role: 'customer' | 'tailor' }
) {
	const response = await postSignUp(client, fields);
	if (response.headers.get('location') !== '/sign-up?sent=1') return response;
	const mail = await waitForMail(fields.email, { subject: subjects.confirm });
	await openLink(newClient(), linkIn(mail));
	return signIn(client, fields.email, fields.password ?? 'correct horse staple');
}

export async function signIn(client: Client, email: string, password: string) {
	return client.post('/sign-in?/password', { email, password });
}

// Read loosely: each test asserts the shape it relies on.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type JsonBody = Record<string, any>;

/** A JSON API call as `client`, its answer parsed (null for an empty body). */
export async function callJson(client: Client, method: string, path: string, body?: unknown) {
	const response = await client.json(method, path, body);
	const text = await response.text();
	return { status: response.status, headers: response.headers, body: (text ? JSON.parse(text) : null) as JsonBody };
}

/** A new client signed in with the person's password (each client has its own address). */
export async function signedIn(person: { email: string; password: string }, base = baseUrl) {
	const client = newClient(undefined, base);
	const response = await signIn(client, person.email, person.password);
	if (response.status !== 303) throw new Error(`sign-in as ${person.email} answered ${response.status}`);
	return client;
}
