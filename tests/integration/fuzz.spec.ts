/**
 * Malformed and hostile input over every form action, endpoint and page found under src/routes, as an
 * anonymous visitor and as each demo role: whatever arrives, the answer is never a 5xx, and under /api
 * every refusal is the JSON error shape.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, newClient, signIn, type Client } from './http';

const routesDir = join(import.meta.dirname, '../../src/routes');

function filesNamed(dir: string, name: string): string[] {
	return readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
		entry.isDirectory() ? filesNamed(join(dir, entry.name), name) : entry.name === name ? [join(dir, entry.name)] : []
	);
}

/** The address of a route folder, with a sample value for each parameter. */
function addressOf(file: string) {
	const segments = relative(routesDir, join(file, '..'))
		.split(sep)
		.filter((segment) => segment && !/^\(.*\)$/.test(segment))
		.map((segment) => (segment.startsWith('[...') ? 'no/such/thing' : segment.startsWith('[') ? 'sample-1' : segment));
	return '/' + segments.join('/');
}

type Target = { kind: 'action' | 'endpoint' | 'page'; method: string; path: string };

function discoverTargets(): Target[] {
	const targets: Target[] = [];
	for (const file of filesNamed(routesDir, '+page.server.ts')) {
		const source = readFileSync(file, 'utf8');
		const actions = source.split(/export const actions\b/)[1];
		if (!actions) continue;
		for (const [, name] of actions.matchAll(/^\t(\w+):\s*async/gm)) {
			const path = addressOf(file);
			targets.push({ kind: 'action', method: 'POST', path: name === 'default' ? path : `${path}?/${name}` });
		}
	}
	for (const file of filesNamed(routesDir, '+server.ts')) {
		const source = readFileSync(file, 'utf8');
		for (const [, method] of source.matchAll(
			/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE|fallback)\b/g
		)) {
			for (const m of method === 'fallback' ? ['GET', 'POST', 'DELETE'] : [method]) {
				targets.push({ kind: 'endpoint', method: m, path: addressOf(file) });
			}
		}
	}
	for (const file of filesNamed(routesDir, '+page.svelte'))
		targets.push({ kind: 'page', method: 'GET', path: addressOf(file) });
	return targets;
}

const targets = discoverTargets();
const actors = ['anonymous', 'customer', 'tailor', 'admin'] as const;
type Actor = (typeof actors)[number];
const sessions = new Map<Actor, Client>();

const fieldNames = [
	'email',
	'password',
	'name',
	'role',
	'units',
	'timeZone',
	'reason',
	'userId',
	'redirectTo',
	'currentPassword',
	'newPassword',
	'confirmPassword',
	'garment',
	'unit',
	'width',
	'pieces'
];
const nasty = [
	'\u0000',
	'a\u0000b',
	'a\r\nb',
	'\u3000',
	'/\t/evil.example',
	'/\\evil.example',
	'%00',
	'../../etc/passwd',
	'<script>alert(1)</script>',
	"' or 1=1 --",
	'\ud800',
	'9'.repeat(40),
	'-1',
	'NaN'
];
const shortValue = fc.oneof(
	fc.string({ maxLength: 30 }),
	fc.string({ unit: 'binary', maxLength: 30 }),
	fc.constantFrom(...nasty),
	fc.uuid()
);
const value = fc.oneof(shortValue, fc.constant('x'.repeat(70_000)));
const fields = fc.dictionary(fc.oneof(fc.constantFrom(...fieldNames), fc.string({ maxLength: 8 })), value, {
	maxKeys: 6
});
const bodyKind = fc.constantFrom(
	'urlencoded',
	'multipart',
	'broken-multipart',
	'text',
	'json',
	'json-broken',
	'none',
	'octet',
	'odd-type'
);
const query = fc.dictionary(fc.constantFrom('q', 'after', 'role', 'redirectTo', 'unit', '/x', 'x'), shortValue, {
	maxKeys: 3
});

function body(kind: string, data: Record<string, string>): { body?: BodyInit; type?: string } {
	const encoded = new URLSearchParams(data).toString();
	switch (kind) {
		case 'urlencoded':
			return { body: encoded, type: 'application/x-www-form-urlencoded' };
		case 'multipart': {
			const form = new FormData();
			for (const [key, item] of Object.entries(data)) form.append(key, item);
			return { body: form };
		}
		case 'broken-multipart':
			return {
				body: `--b\r\ncontent-disposition: form-data; name="x"\r\n\r\n${encoded}`,
				type: 'multipart/form-data; boundary=b'
			};
		case 'text':
			return { body: encoded, type: 'text/plain' };
		case 'json':
			return { body: JSON.stringify(data), type: 'application/json' };
		case 'json-broken':
			return { body: `{"a":${encoded}`, type: 'application/json' };
		case 'octet':
			return { body: new TextEncoder().encode(encoded) };
		case 'odd-type':
			return { body: encoded, type: 'application/x-unknown; charset=nonsense' };
		default:
			return {};
	}
}

async function send(
	target: Target,
	actor: Actor,
	kind: string,
	data: Record<string, string>,
	search: Record<string, string>
) {
	const { body: payload, type } = target.method === 'GET' ? {} : body(kind, data);
	const params = new URLSearchParams(search).toString();
	const url = baseUrl + target.path + (params ? (target.path.includes('?') ? '&' : '?') + params : '');
	const cookie = [...(sessions.get(actor)?.jar ?? [])].map(([name, item]) => `${name}=${item}`).join('; ');
	const response = await fetch(url, {
		method: target.method,
		body: payload,
		redirect: 'manual',
		headers: {
			origin: baseUrl,
			accept: kind === 'json' ? 'application/json' : 'text/html',
			'x-forwarded-for': `198.51.100.${Math.floor(Math.random() * 254) + 1}`,
			...(type ? { 'content-type': type } : {}),
			...(cookie ? { cookie } : {})
		}
	});
	const contentType = response.headers.get('content-type') ?? '';
	// An event stream stays open for as long as the client listens: its status and headers are the answer.
	if (contentType.startsWith('text/event-stream')) {
		await response.body?.cancel();
		return { status: response.status, text: '', contentType };
	}
	const text = await response.text();
	return { status: response.status, text, contentType };
}

function check(target: Target, result: Awaited<ReturnType<typeof send>>) {
	const label = `${target.method} ${target.path} → ${result.status}`;
	expect(result.status, label).toBeLessThan(500);
	// 431: Node's HTTP parser refuses an oversized query before any of our code runs.
	if (target.path.startsWith('/api/') && result.status >= 400 && result.status !== 431) {
		expect(result.contentType, label).toContain('application/json');
		expect(JSON.parse(result.text).error.code, label).toBeTypeOf('string');
	}
}

// Signing out as a demo user would end the session the other runs use.
const applies = (target: Target, actor: Actor) => !(actor !== 'anonymous' && target.path.startsWith('/sign-out'));

describe('fuzzing every action, endpoint and page', () => {
	beforeAll(async () => {
		for (const actor of actors) {
			if (actor === 'anonymous') continue;
			const client = newClient();
			expect((await signIn(client, `${actor}@tackline.test`, 'tackline-demo')).status).toBe(303);
			sessions.set(actor, client);
		}
	});

	it('finds the routes to fuzz in src/routes', () => {
		const kinds = new Set(targets.map((t) => t.kind));
		expect(kinds).toEqual(new Set(['action', 'endpoint', 'page']));
		expect(targets.some((t) => t.path === '/sign-in?/password')).toBe(true);
		expect(targets.some((t) => t.path === '/api/v1/layouts' && t.method === 'POST')).toBe(true);
	});

	it('answers every route and actor without a 5xx for a text/plain body and a NUL in every field', async () => {
		for (const target of targets) {
			for (const actor of actors.filter((a) => applies(target, a))) {
				check(target, await send(target, actor, 'text', { name: 'x' }, { q: '\u0000' }));
				check(
					target,
					await send(target, actor, 'urlencoded', Object.fromEntries(fieldNames.map((f) => [f, 'a\u0000b'])), {})
				);
			}
		}
	}, 120_000);

	it('answers random bodies, content types and query strings without a 5xx', async () => {
		const target = fc.constantFrom(...targets);
		const actor = fc.constantFrom(...actors);
		await fc.assert(
			fc.asyncProperty(target, actor, bodyKind, fields, query, async (t, a, kind, data, search) => {
				if (!applies(t, a)) return;
				check(t, await send(t, a, kind, data, search));
			}),
			{ numRuns: 300 }
		);
	}, 120_000);
});
