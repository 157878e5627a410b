// Conversations through the built server: the JSON API, the live stream (server-sent events fed by
// PostgreSQL LISTEN/NOTIFY), the pages and their form actions, photo attachments and the unread digest.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { freePort, startServer, stopProcess, uploadBodySizeLimit, waitForHealth } from '../../scripts/lib/local';
import { message } from '../../src/lib/server/db/schema';
import * as messages from '../../src/lib/server/messages';
import { createCommission, createUser, createWorkroom, type Person } from '../factories';
import { solid } from '../factories/images';
import { testDb } from './db';
import { headersOf, openEvents } from './events';
import { baseUrl, newClient, signIn, type Client } from './http';
import { settledMailTo, waitForMail } from './inbox';

// The digest worker is called here as the job would call it; it reads ORIGIN and the queue's settings.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = testDb();
afterAll(() => pool.end());

async function signedIn(person: Person) {
	const client = newClient();
	const response = await signIn(client, person.email, person.password);
	expect(response.status).toBe(303);
	return client;
}

type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- each test asserts the shape it relies on

async function api(client: Client, method: string, path: string, body?: unknown) {
	const response = await client.json(method, path, body);
	const text = await response.text();
	return { status: response.status, body: (text ? JSON.parse(text) : null) as Json };
}

let customer: Person;
let tailor: Person;
let customerClient: Client;
let tailorClient: Client;
let threadId: string;
let commissionId: string;

beforeAll(async () => {
	customer = await createUser(db, { name: 'Wenna Polglase' });
	tailor = await createWorkroom(db, { profile: { shopName: 'Gull Yard Workroom' } });
	commissionId = (await createCommission(db, { customerId: customer.id, title: 'Linen trousers for the summer' })).id;
	[customerClient, tailorClient] = await Promise.all([signedIn(customer), signedIn(tailor)]);
	// The tailor opens the conversation with a question, through the ask page's form action.
	const asked = await tailorClient.post(`/messages/ask/${commissionId}?/ask`, {
		body: 'Would you like the pockets on the side seams?'
	});
	expect(asked.status).toBe(303);
	threadId = asked.headers.get('location')!.split('/').at(-1)!;
	expect(threadId).toMatch(/^[0-9a-f-]{36}$/);
});

describe('the messages API', () => {
	it('posts, lists newest first with paging, counts unread and marks read', async () => {
		const posted = await api(customerClient, 'POST', `/api/v1/threads/${threadId}/messages`, {
			body: 'Yes please, deep ones.'
		});
		expect(posted.status).toBe(201);
		expect(posted.body).toMatchObject({ threadId, authorId: customer.id, mine: true, body: 'Yes please, deep ones.' });
		expect(posted.body.attachments).toEqual([]);
		await api(customerClient, 'POST', `/api/v1/threads/${threadId}/messages`, { body: 'And a button fly.' });

		const page = await api(tailorClient, 'GET', `/api/v1/threads/${threadId}/messages?limit=2`);
		expect(page.status).toBe(200);
		expect(page.body.items.map((m: Json) => m.body)).toEqual(['And a button fly.', 'Yes please, deep ones.']);
		expect(page.body.items[0].mine).toBe(false);
		const older = await api(
			tailorClient,
			'GET',
			`/api/v1/threads/${threadId}/messages?limit=2&cursor=${page.body.nextCursor}`
		);
		expect(older.body.items.map((m: Json) => m.body)).toEqual(['Would you like the pockets on the side seams?']);
		expect(older.body.nextCursor).toBeNull();

		const inbox = await api(tailorClient, 'GET', '/api/v1/threads');
		expect(inbox.status).toBe(200);
		expect(inbox.body.items[0]).toMatchObject({
			id: threadId,
			unreadCount: 2,
			commission: { id: commissionId, title: 'Linen trousers for the summer' },
			otherParty: { name: 'Wenna P.', role: 'customer' }
		});
		const header = await (await tailorClient.get('/messages')).text();
		expect(header).toContain('aria-label="Messages, 2 unread"');

		expect((await api(tailorClient, 'POST', `/api/v1/threads/${threadId}/read`)).body).toEqual({ marked: 2 });
		expect((await api(tailorClient, 'GET', '/api/v1/threads')).body.items[0].unreadCount).toBe(0);
		const read = await api(customerClient, 'GET', `/api/v1/threads/${threadId}/messages?limit=1`);
		expect(read.body.items[0].readAt).not.toBeNull();
	});

	it('answers 401 to the anonymous, 404 to everyone outside the thread and 400 to bad input', async () => {
		const [otherCustomer, otherTailor] = await Promise.all([
			createUser(db).then(signedIn),
			createWorkroom(db).then(signedIn)
		]);
		const anonymous = newClient();
		expect((await api(anonymous, 'GET', `/api/v1/threads/${threadId}/messages`)).status).toBe(401);
		expect((await api(anonymous, 'GET', '/api/v1/threads')).status).toBe(401);
		for (const stranger of [otherCustomer, otherTailor]) {
			const list = await api(stranger, 'GET', `/api/v1/threads/${threadId}/messages`);
			expect(list.status).toBe(404);
			expect(list.body.error.code).toBe('not_found');
			expect((await api(stranger, 'POST', `/api/v1/threads/${threadId}/messages`, { body: 'Hi' })).status).toBe(404);
			expect((await openEvents(stranger, threadId)).response.status).toBe(404);
			expect((await api(stranger, 'GET', '/api/v1/threads')).body.items).toEqual([]);
		}
		const empty = await api(customerClient, 'POST', `/api/v1/threads/${threadId}/messages`, { body: '   ' });
		expect(empty.status).toBe(400);
		expect(empty.body.error.issues[0].path).toBe('body');
		const long = await api(customerClient, 'POST', `/api/v1/threads/${threadId}/messages`, { body: 'x'.repeat(4001) });
		expect(long.status).toBe(400);
		const extra = await api(customerClient, 'POST', `/api/v1/threads/${threadId}/messages`, {
			body: 'Hi',
			html: '<b>'
		});
		expect(extra.status).toBe(400);
		expect((await api(customerClient, 'GET', `/api/v1/threads/${threadId}/messages?cursor=nope`)).status).toBe(400);
	});

	it('takes a photo as a multipart attachment and shows it to the participants only', async () => {
		const form = new FormData();
		form.set('body', 'This is the linen I have in mind.');
		form.set('altText', 'A swatch of red linen');
		form.set('file', new Blob([new Uint8Array(await solid(640, 480).png().toBuffer())]), 'swatch.png');
		const response = await fetch(`${baseUrl}/api/v1/threads/${threadId}/messages`, {
			method: 'POST',
			headers: headersOf(customerClient),
			body: form
		});
		expect(response.status).toBe(201);
		const posted = (await response.json()) as Json;
		expect(posted.attachments).toHaveLength(1);
		expect(posted.attachments[0]).toMatchObject({ width: 640, height: 480, altText: 'A swatch of red linen' });

		const thumb = await tailorClient.get(posted.attachments[0].thumbUrl);
		expect(thumb.status).toBe(200);
		expect(thumb.headers.get('content-type')).toBe('image/webp');
		const stranger = await signedIn(await createUser(db));
		expect((await stranger.get(posted.attachments[0].url)).status).toBe(404);
	});
});

describe('the live stream', () => {
	it('delivers a posted message to the other participant, and resumes from Last-Event-ID', async () => {
		const stream = await openEvents(customerClient, threadId);
		expect(stream.response.status).toBe(200);
		expect(stream.response.headers.get('content-type')).toContain('text/event-stream');

		const first = await api(tailorClient, 'POST', `/api/v1/threads/${threadId}/messages`, {
			body: 'Fitting on Tuesday?'
		});
		const event = await stream.next();
		expect(event.id).toBe(first.body.id);
		expect(event.event).toBe('message');
		expect(JSON.parse(event.data)).toMatchObject({ id: first.body.id, body: 'Fitting on Tuesday?', mine: false });
		stream.close();

		// While the customer is away, two more arrive; reconnecting with the last id received sends both, in order.
		const second = await api(tailorClient, 'POST', `/api/v1/threads/${threadId}/messages`, { body: 'Or Wednesday.' });
		const third = await api(tailorClient, 'POST', `/api/v1/threads/${threadId}/messages`, { body: 'Either suits me.' });
		const resumed = await openEvents(customerClient, threadId, { lastEventId: first.body.id });
		expect((await resumed.next()).id).toBe(second.body.id);
		expect((await resumed.next()).id).toBe(third.body.id);
		// …and keeps going live after the catch-up.
		const fourth = await api(tailorClient, 'POST', `/api/v1/threads/${threadId}/messages`, { body: 'Ten o’clock.' });
		expect((await resumed.next()).id).toBe(fourth.body.id);
		resumed.close();

		const viaQuery = await openEvents(customerClient, threadId, { after: second.body.id });
		expect((await viaQuery.next()).id).toBe(third.body.id);
		viaQuery.close();
	});
});

describe('several app instances', () => {
	it('delivers a message posted through one instance to a stream opened on another', async () => {
		const port = await freePort();
		const second = `http://localhost:${port}`;
		const server = startServer({
			DATABASE_URL: process.env.DATABASE_URL!,
			PORT: String(port),
			ORIGIN: second,
			BODY_SIZE_LIMIT: uploadBodySizeLimit
		});
		try {
			await waitForHealth(second, 30_000);
			const stream = await openEvents(customerClient, threadId, { server: second });
			expect(stream.response.status).toBe(200);
			const posted = await api(tailorClient, 'POST', `/api/v1/threads/${threadId}/messages`, {
				body: 'Sent through the first instance.'
			});
			expect((await stream.next()).id).toBe(posted.body.id);
			stream.close();
		} finally {
			await stopProcess(server);
		}
	}, 60_000);
});

describe('the conversation page', () => {
	it('shows bodies escaped and makes only web and mail addresses into safe links', async () => {
		const body =
			'<script>alert("stitch")</script> <img src=x onerror=alert(1)> Swatches: https://example.com/linen?a=1&b=2 ' +
			'or mail cloth@example.org — not javascript:alert(1)';
		expect((await api(tailorClient, 'POST', `/api/v1/threads/${threadId}/messages`, { body })).status).toBe(201);
		const page = await customerClient.get(`/messages/${threadId}`);
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('&lt;script>alert("stitch")&lt;/script>');
		expect(html).not.toContain('<script>alert("stitch")');
		expect(html).not.toContain('<img src=x');
		expect(html).toContain(
			'<a href="https://example.com/linen?a=1&amp;b=2" target="_blank" rel="noopener noreferrer nofollow"'
		);
		expect(html).toContain('href="mailto:cloth@example.org"');
		expect(html).not.toMatch(/href="javascript:/i);
		// Opening the page marked everything read.
		expect((await api(customerClient, 'GET', '/api/v1/threads')).body.items[0].unreadCount).toBe(0);
	});

	it('sends through the form action without JavaScript and keeps the text on a refusal', async () => {
		const sent = await customerClient.post(`/messages/${threadId}?/send`, { body: 'Sent from a plain form.' });
		expect(sent.status).toBe(200);
		expect(await sent.text()).toContain('Sent from a plain form.');
		const latest = await api(tailorClient, 'GET', `/api/v1/threads/${threadId}/messages?limit=1`);
		expect(latest.body.items[0].body).toBe('Sent from a plain form.');

		const refused = await customerClient.post(`/messages/${threadId}?/send`, { body: '  ' });
		expect(refused.status).toBe(400);
		expect(await refused.text()).toContain('Write a message.');
		const stranger = await signedIn(await createUser(db));
		expect((await stranger.post(`/messages/${threadId}?/send`, { body: 'Hello' })).status).toBe(404);
		expect((await stranger.get(`/messages/${threadId}`)).status).toBe(404);
	});

	it('lists conversations in the inbox, and an empty inbox says what will appear', async () => {
		const inbox = await (await customerClient.get('/messages')).text();
		expect(inbox).toContain('Gull Yard Workroom');
		expect(inbox).toContain('Linen trousers for the summer');
		const newcomer = await signedIn(await createUser(db));
		expect(await (await newcomer.get('/messages')).text()).toContain('No conversations yet');
	});
});

describe('the unread-message digest', () => {
	it('mails the recipient once about messages unread for 15 minutes, listing threads and counts only', async () => {
		process.env.ORIGIN ??= baseUrl;
		const person = await createUser(db, { name: 'Morwenna Keast' });
		const other = await createWorkroom(db, { profile: { shopName: 'Harbour Row Tailoring' } });
		const commission = await createCommission(db, { customerId: person.id, title: 'Wool flannel trousers' });
		const thread = await messages.openThread(db, { commissionId: commission.id, tailorId: other.id });
		// Time is driven by the rows: these were written 20 and 17 minutes ago.
		await db.insert(message).values([
			{ threadId: thread.id, authorId: other.id, body: 'private one', createdAt: new Date(Date.now() - 20 * 60_000) },
			{ threadId: thread.id, authorId: other.id, body: 'private two', createdAt: new Date(Date.now() - 17 * 60_000) }
		]);
		await messages.sendDigests(db);
		const mail = await waitForMail(person.email, { subject: '2 messages are waiting for you on Tackline' });
		expect(mail.text).toContain('Harbour Row Tailoring');
		expect(mail.text).toContain('“Wool flannel trousers”');
		expect(mail.text).toContain(`/messages/${thread.id}`);
		expect(mail.text).not.toContain('private');

		await messages.sendDigests(db);
		expect(await settledMailTo(person.email)).toHaveLength(1);
	});
});
