/**
 * The API document against the running server: it is served and valid, and real answers — successes and
 * errors — fit the response schemas it documents for them.
 */
import { Validator } from '@seriousme/openapi-schema-validator';
import { Ajv2020 } from 'ajv/dist/2020.js';
import Stripe from 'stripe';
import addFormats from 'ajv-formats';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCommission, createMeasurementProfile, createUser, createWorkroom, type Person } from '../factories';
import { solid } from '../factories/images';
import { createFundedOrder } from '../factories/fittings';
import { awardQuote, createQuotingWorkroom, insertQuote } from '../factories/quotes';
import { openThread } from '../../src/lib/server/messages/threads';
import { notification, searchOutbox } from '../../src/lib/server/db/schema';
import { testDb } from './db';
import { baseUrl, newClient, signIn, type Client } from './http';
import { stripeStandin } from './stripe';

const { db, pool } = testDb();
afterAll(() => pool.end());

type Document = {
	openapi: string;
	paths: Record<string, Record<string, { operationId: string; summary: string; responses: Record<string, unknown> }>>;
};

let document: Document;
const ajv = new Ajv2020({ strict: false, allErrors: true });
addFormats.default(ajv);
const documentId = 'https://tackline.invalid/api/v1/openapi.json';

beforeAll(async () => {
	const response = await newClient().get('/api/v1/openapi.json');
	expect(response.status).toBe(200);
	document = (await response.json()) as Document;
	ajv.addSchema({ ...document, $id: documentId });
});

const pointer = (...parts: string[]) => parts.map((p) => p.replaceAll('~', '~0').replaceAll('/', '~1')).join('/');

/** Checks a value against the schema at `#/…` in the document. */
function expectFits(body: unknown, where: string, ...parts: string[]) {
	const validate = ajv.getSchema(`${documentId}#/${pointer(...parts)}`);
	expect(validate, `${where} has a JSON schema`).toBeDefined();
	const valid = validate!(body);
	expect(validate!.errors ?? [], `${where}: ${JSON.stringify(body).slice(0, 400)}`).toEqual([]);
	expect(valid).toBe(true);
	return body;
}

/** Checks a real answer against the schema the document gives for that operation and status. */
async function expectDocumented(response: Response, method: string, path: string) {
	const status = String(response.status);
	const operation = document.paths[path]?.[method.toLowerCase()];
	expect(operation, `${method} ${path} is documented`).toBeDefined();
	expect(Object.keys(operation.responses), `${method} ${path} documents ${status}`).toContain(status);
	const body: unknown = await response.json();
	return expectFits(
		body,
		`${method} ${path} ${status}`,
		...['paths', path, method.toLowerCase(), 'responses', status, 'content', 'application/json', 'schema']
	);
}

async function signedIn(role: 'customer' | 'tailor' | Person): Promise<Client> {
	const person = typeof role === 'string' ? await createUser(db, { role }) : role;
	const client = newClient();
	expect((await signIn(client, person.email, person.password)).status).toBe(303);
	return client;
}

describe('GET /api/v1/openapi.json', () => {
	it('serves a valid OpenAPI 3.1 document, with an ETag that answers 304', async () => {
		const result = await new Validator().validate(structuredClone(document));
		expect(result.errors ?? []).toEqual([]);
		expect(result.valid).toBe(true);
		const client = newClient();
		const first = await client.get('/api/v1/openapi.json');
		expect(first.headers.get('content-type')).toMatch(/^application\/json/);
		const etag = first.headers.get('etag');
		expect(etag).toMatch(/^".+"$/);
		const again = await fetch(first.url, { headers: { 'if-none-match': etag!, 'x-forwarded-for': client.address } });
		expect(again.status).toBe(304);
	});
});

describe('real answers fit the documented schemas', () => {
	it('public reads: garments, health, places, a tailor’s workroom', async () => {
		const client = newClient();
		const garments = await expectDocumented(await client.get('/api/v1/garments?unit=in'), 'GET', '/api/v1/garments');
		expect((garments as unknown[]).length).toBeGreaterThan(0);
		await expectDocumented(await client.get('/api/v1/health'), 'GET', '/api/v1/health');
		const places = await expectDocumented(await client.get('/api/v1/places?q=Merrow'), 'GET', '/api/v1/places');
		expect((places as { items: unknown[] }).items.length).toBeGreaterThan(0);
		const tailor = await createWorkroom(db, { onboarded: true });
		await expectDocumented(await client.get(`/api/v1/tailors/${tailor.id}`), 'GET', '/api/v1/tailors/{id}');
	});

	it('drafting: a draft, a layout and an estimate', async () => {
		const client = newClient();
		// The working dressmaker's trouser method (common practice), in inches.
		const draft = await client.json('POST', '/api/v1/drafts', {
			garment: 'wide-leg-trousers',
			unit: 'in',
			measurements: { hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
			options: { length: 45.5 },
			fabric: { width: 60 }
		});
		const body = (await expectDocumented(draft, 'POST', '/api/v1/drafts')) as { pieces: unknown[] };
		expect(body.pieces.length).toBeGreaterThan(0);
		const layout = await client.json('POST', '/api/v1/layouts', {
			width: 150,
			unit: 'cm',
			pieces: [{ w: 40, h: 60, quantity: 2 }]
		});
		await expectDocumented(layout, 'POST', '/api/v1/layouts');
		const estimate = await client.json('POST', '/api/v1/quotes/estimate', {
			currency: 'EUR',
			garment: 'straight-skirt',
			fabric: { supply: 'tailor', pricePerUnitMinor: 1800, per: 'm', length: 1.2 },
			hourlyRateMinor: 3000
		});
		await expectDocumented(estimate, 'POST', '/api/v1/quotes/estimate');
	});

	it('a customer’s profile and commission', async () => {
		const client = await signedIn('customer');
		const profile = await client.json('POST', '/api/v1/measurement-profiles', {
			label: 'Me',
			unit: 'cm',
			values: { hip_girth: 98, waist_girth: 76 }
		});
		expect(profile.status).toBe(201);
		await expectDocumented(profile, 'POST', '/api/v1/measurement-profiles');
		await expectDocumented(
			await client.json('GET', '/api/v1/measurement-profiles'),
			'GET',
			'/api/v1/measurement-profiles'
		);
		const created = await client.json('POST', '/api/v1/commissions', {
			garment: 'straight-skirt',
			title: 'A charcoal wool skirt',
			budget: { minMinor: 12000, maxMinor: 20000, currency: 'EUR' },
			location: { lat: 51.5, lng: -0.12 }
		});
		expect(created.status).toBe(201);
		const { id } = (await expectDocumented(created, 'POST', '/api/v1/commissions')) as { id: string };
		await expectDocumented(await client.json('GET', `/api/v1/commissions/${id}`), 'GET', '/api/v1/commissions/{id}');
		await expectDocumented(
			await client.json('GET', `/api/v1/commissions/${id}/photos`),
			'GET',
			'/api/v1/commissions/{id}/photos'
		);
	});

	it('a tailor’s own workroom and portfolio', async () => {
		const client = await signedIn('tailor');
		const saved = await client.json('PUT', '/api/v1/workroom', {
			name: 'Cable Street Cutters',
			location: { placeId: 'local:merrowgate-loomside' },
			serviceRadiusKm: 10,
			capacity: 2
		});
		await expectDocumented(saved, 'PUT', '/api/v1/workroom');
		const item = await client.json('POST', '/api/v1/workroom/portfolio', { caption: 'Linen trousers' });
		await expectDocumented(item, 'POST', '/api/v1/workroom/portfolio');
		await expectDocumented(await client.json('GET', '/api/v1/workroom/portfolio'), 'GET', '/api/v1/workroom/portfolio');
	});

	it('quotes: sent, read, listed, changed, declined and accepted; the awarded tailor’s commission', async () => {
		const customer = await createUser(db, { role: 'customer' });
		const made = await createCommission(db, { customerId: customer.id, status: 'open' });
		const workroom = await createQuotingWorkroom(db);
		const tailor = await signedIn(workroom);
		const owner = await signedIn(customer);
		const seen = (await expectDocumented(
			await tailor.json('GET', `/api/v1/commissions/${made.id}`),
			'GET',
			'/api/v1/commissions/{id}'
		)) as { budget: { currency: string }; measurements?: unknown };
		expect(seen).not.toHaveProperty('measurements');

		const sent = await tailor.json('POST', `/api/v1/commissions/${made.id}/quotes`, {
			priceMinor: 8200,
			currency: seen.budget.currency,
			deliveryDate: new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10),
			fittings: 1,
			fabricIncluded: false,
			message: 'Cut from your own wool, with one fitting in the Merrowgate workroom.',
			validUntil: new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10)
		});
		expect(sent.status).toBe(201);
		const quote = (await expectDocumented(sent, 'POST', '/api/v1/commissions/{id}/quotes')) as { id: string };
		await expectDocumented(await owner.json('GET', `/api/v1/quotes/${quote.id}`), 'GET', '/api/v1/quotes/{id}');
		await expectDocumented(
			await tailor.json('PATCH', `/api/v1/quotes/${quote.id}`, { fittings: 2 }),
			'PATCH',
			'/api/v1/quotes/{id}'
		);

		const other = await insertQuote(db, { commissionId: made.id, tailorId: (await createWorkroom(db)).id });
		const declined = await owner.json('POST', `/api/v1/quotes/${other.id}/decline`, { reason: 'Too far away.' });
		expect(declined.status).toBe(200);
		expect(await expectDocumented(declined, 'POST', '/api/v1/quotes/{id}/decline')).toMatchObject({
			id: other.id,
			status: 'declined',
			declineReason: 'Too far away.'
		});
		const list = (await expectDocumented(
			await owner.json('GET', `/api/v1/commissions/${made.id}/quotes`),
			'GET',
			'/api/v1/commissions/{id}/quotes'
		)) as { items: unknown[] };
		expect(list.items).toHaveLength(2);

		const accepted = await owner.json('POST', `/api/v1/quotes/${quote.id}/accept`);
		expect(accepted.status).toBe(201);
		const order = (await expectDocumented(accepted, 'POST', '/api/v1/quotes/{id}/accept')) as Record<string, number>;
		expect(order.platformFeeMinor + order.tailorPayoutMinor).toBe(order.priceMinor);
		await expectDocumented(
			await owner.json('POST', `/api/v1/quotes/${quote.id}/accept`),
			'POST',
			'/api/v1/quotes/{id}/accept'
		);
		const awarded = await expectDocumented(
			await tailor.json('GET', `/api/v1/commissions/${made.id}`),
			'GET',
			'/api/v1/commissions/{id}'
		);
		expect(awarded).toMatchObject({ status: 'awarded', measurements: { values: { waist_girth: expect.any(Number) } } });
		await expectDocumented(
			await owner.json('POST', `/api/v1/quotes/${quote.id}/withdraw`),
			'POST',
			'/api/v1/quotes/{id}/withdraw'
		);
	});

	it('messages: the inbox, a page, a message sent as JSON and with a photo, marking read, the live stream', async () => {
		const customer = await createUser(db, { role: 'customer' });
		const made = await createCommission(db, { customerId: customer.id, status: 'open' });
		const workroom = await createQuotingWorkroom(db);
		const tailor = await signedIn(workroom);
		const owner = await signedIn(customer);
		await openThread(db, { commissionId: made.id, tailorId: workroom.id });

		const inbox = (await expectDocumented(await owner.json('GET', '/api/v1/threads'), 'GET', '/api/v1/threads')) as {
			items: { id: string; commission: { id: string } }[];
		};
		const thread = inbox.items.find((item) => item.commission.id === made.id);
		expect(thread, 'the conversation is in the customer’s inbox').toBeDefined();
		const path = `/api/v1/threads/${thread!.id}`;

		const first = (await expectDocumented(
			await owner.json('POST', `${path}/messages`, { body: 'Just below it, please.' }),
			'POST',
			'/api/v1/threads/{id}/messages'
		)) as { id: string };
		const form = new FormData();
		form.set('body', 'The cloth I have in mind.');
		form.set('altText', 'A swatch of red wool');
		form.set('file', new Blob([new Uint8Array(await solid(320, 240).png().toBuffer())]), 'swatch.png');
		const cookie = [...owner.jar].map(([name, value]) => `${name}=${value}`).join('; ');
		const withPhoto = await fetch(`${baseUrl}${path}/messages`, {
			method: 'POST',
			headers: { origin: baseUrl, 'x-forwarded-for': owner.address, cookie },
			body: form
		});
		expect(withPhoto.status).toBe(201);
		const photo = (await expectDocumented(withPhoto, 'POST', '/api/v1/threads/{id}/messages')) as {
			id: string;
			attachments: unknown[];
		};
		expect(photo.attachments).toHaveLength(1);

		const page = (await expectDocumented(
			await tailor.json('GET', `${path}/messages?limit=1`),
			'GET',
			'/api/v1/threads/{id}/messages'
		)) as { items: unknown[]; nextCursor: string | null };
		expect(page.items).toHaveLength(1);
		expect(page.nextCursor, 'an older page follows').not.toBeNull();
		const read = await expectDocumented(await tailor.json('POST', `${path}/read`), 'POST', '/api/v1/threads/{id}/read');
		expect(read).toEqual({ marked: 2 });

		// The live stream: documented as text/event-stream, each event's data a Message.
		expect(
			Object.keys((document.paths['/api/v1/threads/{id}/events'].get.responses['200'] as { content: object }).content)
		).toEqual(['text/event-stream']);
		const abort = new AbortController();
		const tailorCookie = [...tailor.jar].map(([name, value]) => `${name}=${value}`).join('; ');
		const stream = await fetch(`${baseUrl}${path}/events?after=${first.id}`, {
			headers: { 'x-forwarded-for': tailor.address, cookie: tailorCookie, accept: 'text/event-stream' },
			signal: abort.signal
		});
		try {
			expect(stream.status).toBe(200);
			expect(stream.headers.get('content-type')).toMatch(/^text\/event-stream/);
			const reader = stream.body!.getReader();
			const decoder = new TextDecoder();
			let buffer = '';
			while (!/^data: .*\n\n/m.test(buffer)) {
				const chunk = await reader.read();
				expect(chunk.done, 'an event before the stream ends').toBe(false);
				buffer += decoder.decode(chunk.value, { stream: true });
			}
			const data = buffer.match(/^data: (.*)$/m)![1];
			const event = expectFits(JSON.parse(data), 'an event’s data', 'components', 'schemas', 'Message');
			expect(event).toMatchObject({ id: photo.id });
		} finally {
			abort.abort();
		}

		await expectDocumented(
			await tailor.json('GET', '/api/v1/threads/00000000-0000-4000-8000-000000000000/messages'),
			'GET',
			'/api/v1/threads/{id}/messages'
		);
		await expectDocumented(
			await tailor.json('POST', `${path}/messages`, { body: '' }),
			'POST',
			'/api/v1/threads/{id}/messages'
		);
	});

	it('notifications: a page of notices, marking read, and the preferences read and changed', async () => {
		const person = await createUser(db, { role: 'tailor' });
		await db.insert(notification).values(
			[1, 2, 3].map((n) => ({
				userId: person.id,
				event: 'quote_accepted' as const,
				title: `Quote ${n} accepted`,
				body: 'The order waits for payment.',
				href: '/workroom'
			}))
		);
		const client = await signedIn(person);
		const page = (await expectDocumented(
			await client.json('GET', '/api/v1/notifications?limit=2'),
			'GET',
			'/api/v1/notifications'
		)) as { items: { id: string }[]; nextCursor: string };
		expect(page.items).toHaveLength(2);
		await expectDocumented(
			await client.json('GET', `/api/v1/notifications?cursor=${page.nextCursor}`),
			'GET',
			'/api/v1/notifications'
		);
		await expectDocumented(
			await client.json('POST', '/api/v1/notifications/read', { ids: [page.items[0].id] }),
			'POST',
			'/api/v1/notifications/read'
		);
		await expectDocumented(
			await client.json('POST', '/api/v1/notifications/read', { all: true }),
			'POST',
			'/api/v1/notifications/read'
		);
		const preferences = '/api/v1/account/notification-preferences';
		await expectDocumented(await client.json('GET', preferences), 'GET', preferences);
		await expectDocumented(
			await client.json('PUT', preferences, { events: [{ event: 'quote_declined', email: false }] }),
			'PUT',
			preferences
		);
		const refused = await client.json('PUT', preferences, { events: [{ event: 'released', inApp: false }] });
		expect(refused.status).toBe(422);
		await expectDocumented(refused, 'PUT', preferences);
	});

	it('search near me: a tailor’s open commissions and the workrooms near a point', async () => {
		// A spot of its own, far from the demo city, so the lists hold what this test made.
		const spot = { lat: 44.61, lng: -0.92 };
		const workroom = await createWorkroom(db, { profile: { lat: spot.lat, lng: spot.lng, serviceRadiusKm: 30 } });
		// Noted for the search sync as a workroom change is; the publishing below asks for the run.
		await db.insert(searchOutbox).values({ kind: 'workroom', entityId: workroom.id });
		const tailor = await signedIn(workroom);
		// Published through the API, as a customer would: that asks the sync job to run, and one run drains every note.
		const person = await createUser(db, { role: 'customer' });
		const profile = await createMeasurementProfile(db, {
			ownerId: person.id,
			unit: 'cm',
			valuesMm: { waist_girth: 740, hip_girth: 1000, waist_to_hip: 205, waist_to_floor: 1040 }
		});
		const customer = await signedIn(person);
		const created = await customer.json('POST', '/api/v1/commissions', {
			garment: 'straight-skirt',
			title: 'A bottle-green linen skirt',
			styleNotes: 'Just below the knee, with a back vent.',
			measurementProfileId: profile.id,
			fabricSource: 'tailor_sources',
			budget: { minMinor: 9000, maxMinor: 14000, currency: 'EUR' },
			dateNeeded: new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10),
			location: { lat: spot.lat + 0.02, lng: spot.lng, name: 'Testbury', country: 'FR' },
			handover: 'pickup'
		});
		expect(created.status).toBe(201);
		const made = (await created.json()) as { id: string };
		expect((await customer.json('POST', `/api/v1/commissions/${made.id}/publish`)).status).toBe(200);
		const anonymous = newClient();

		// The sync job fills the index in the background.
		const found = async (read: () => Promise<Response>, id: string) => {
			const until = Date.now() + 20_000;
			for (;;) {
				const response = await read();
				const body = (await response.clone().json()) as { items?: { id: string }[] };
				if (body.items?.some((item) => item.id === id) || Date.now() > until) return response;
				await new Promise((resolve) => setTimeout(resolve, 250));
			}
		};
		const commissions = await found(() => tailor.json('GET', '/api/v1/commissions?limit=5'), made.id);
		expect(commissions.status).toBe(200);
		expect(commissions.headers.get('x-search-source')).toMatch(/^(index|database)$/);
		const page = (await expectDocumented(commissions, 'GET', '/api/v1/commissions')) as {
			items: { id: string; photo: unknown; sizeBand: unknown[] }[];
			near: { lat: number; lng: number };
		};
		expect(page.items.map((item) => item.id)).toContain(made.id);
		expect(page.near.lat).toBeCloseTo(spot.lat, 1);

		const tailors = await found(
			() => anonymous.get(`/api/v1/tailors?near=${spot.lat},${spot.lng}&radiusKm=10`),
			workroom.id
		);
		expect(tailors.status).toBe(200);
		const list = (await expectDocumented(tailors, 'GET', '/api/v1/tailors')) as {
			items: { id: string; servesYou: boolean }[];
		};
		expect(list.items.find((item) => item.id === workroom.id)).toMatchObject({ servesYou: true });

		await expectDocumented(await anonymous.get('/api/v1/tailors?near=north'), 'GET', '/api/v1/tailors');
		await expectDocumented(await tailor.json('GET', '/api/v1/commissions?sort=oldest'), 'GET', '/api/v1/commissions');
		await expectDocumented(await customer.json('GET', '/api/v1/commissions'), 'GET', '/api/v1/commissions');
	});

	it('orders: read by either party, checkout by the customer, and the processor’s events', async () => {
		const customer = await createUser(db, { role: 'customer' });
		const tailorRoom = await createWorkroom(db);
		const made = await createCommission(db, { customerId: customer.id, status: 'open' });
		const quote = await insertQuote(db, { commissionId: made.id, tailorId: tailorRoom.id, priceMinor: 31_500 });
		const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: quote.id, customerId: customer.id });
		const owner = await signedIn(customer);
		const tailor = await signedIn(tailorRoom);

		const read = (await expectDocumented(
			await owner.json('GET', `/api/v1/orders/${orderId}`),
			'GET',
			'/api/v1/orders/{id}'
		)) as { status: string; priceMinor: number; money: Record<string, number> };
		expect(read).toMatchObject({ status: 'awaiting_payment', priceMinor: 31_500, money: { chargedMinor: 0 } });
		await expectDocumented(await tailor.json('GET', `/api/v1/orders/${orderId}`), 'GET', '/api/v1/orders/{id}');

		const started = await owner.json('POST', `/api/v1/orders/${orderId}/checkout`);
		expect(started.status).toBe(201);
		const checkout = (await expectDocumented(started, 'POST', '/api/v1/orders/{id}/checkout')) as { url: string };
		expect(checkout.url).toMatch(/^https?:\/\//);
		const refused = await tailor.json('POST', `/api/v1/orders/${orderId}/checkout`);
		expect(refused.status).toBe(403);
		await expectDocumented(refused, 'POST', '/api/v1/orders/{id}/checkout');
		const stranger = await signedIn('customer');
		const hidden = await stranger.json('GET', `/api/v1/orders/${orderId}`);
		expect(hidden.status).toBe(404);
		await expectDocumented(hidden, 'GET', '/api/v1/orders/{id}');

		const forged = await fetch(`${baseUrl}/api/v1/webhooks/stripe`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', 'stripe-signature': `t=${Math.floor(Date.now() / 1000)},v1=00` },
			body: JSON.stringify({ id: 'evt_forged', object: 'event', type: 'checkout.session.completed', data: {} })
		});
		expect(forged.status).toBe(400);
		await expectDocumented(forged, 'POST', '/api/v1/webhooks/stripe');
		// A signed event of a type the site does not use is acknowledged and changes nothing.
		const payload = JSON.stringify({
			id: `evt_unused_${orderId.slice(0, 8)}`,
			object: 'event',
			type: 'customer.created',
			created: Math.floor(Date.now() / 1000),
			data: { object: { id: 'cus_local', object: 'customer' } }
		});
		const secret = stripeStandin().env.STRIPE_WEBHOOK_SECRET;
		const signed = await fetch(`${baseUrl}/api/v1/webhooks/stripe`, {
			method: 'POST',
			headers: {
				'content-type': 'application/json',
				'stripe-signature': Stripe.webhooks.generateTestHeaderString({ payload, secret })
			},
			body: payload
		});
		expect(signed.status).toBe(200);
		expect(await expectDocumented(signed, 'POST', '/api/v1/webhooks/stripe')).toEqual({
			received: true,
			outcome: 'ignored'
		});
	});

	it('fittings: offered, listed, booked, refused too late, cancelled and done', async () => {
		const o = await createFundedOrder(db, { tailorZone: 'Europe/London', customerZone: 'Asia/Tokyo' });
		const tailor = await signedIn({ ...o.tailor, role: 'tailor', name: '' });
		const customer = await signedIn({ ...o.customer, role: 'customer', name: '' });
		const path = '/api/v1/orders/{id}/fittings';
		const start = new Date(Date.now() + 5 * 86_400_000).toISOString().slice(0, 10) + 'T11:00';
		const offered = await tailor.json('POST', `/api/v1/orders/${o.orderId}/fittings`, {
			timeZone: 'Europe/London',
			slots: [{ start, durationMinutes: 30, placeKind: 'public_place', address: 'Harbour Library, Quay Street' }]
		});
		expect(offered.status).toBe(201);
		const { items } = (await expectDocumented(offered, 'POST', path)) as { items: { id: string }[] };
		await expectDocumented(await customer.json('GET', `/api/v1/orders/${o.orderId}/fittings`), 'GET', path);
		const booked = await customer.json('POST', `/api/v1/fittings/${items[0].id}/book`);
		expect(booked.status).toBe(200);
		await expectDocumented(booked, 'POST', '/api/v1/fittings/{id}/book');
		const wrongRole = await tailor.json('POST', `/api/v1/fittings/${items[0].id}/book`);
		expect(wrongRole.status).toBe(403);
		await expectDocumented(wrongRole, 'POST', '/api/v1/fittings/{id}/book');
		const notYet = await tailor.json('POST', `/api/v1/fittings/${items[0].id}/done`);
		expect(notYet.status).toBe(409);
		await expectDocumented(notYet, 'POST', '/api/v1/fittings/{id}/done');
		const cancelled = await tailor.json('POST', `/api/v1/fittings/${items[0].id}/cancel`, { reason: 'Unwell' });
		expect(cancelled.status).toBe(200);
		await expectDocumented(cancelled, 'POST', '/api/v1/fittings/{id}/cancel');
	});

	it('errors: 400, 401, 403, 404 and 415 carry the documented error body', async () => {
		const anonymous = newClient();
		const bad = await anonymous.json('POST', '/api/v1/drafts', { garment: 'ball-gown', unit: 'furlong' });
		expect(bad.status).toBe(400);
		const error = (await expectDocumented(bad, 'POST', '/api/v1/drafts')) as { error: { issues: unknown[] } };
		expect(error.error.issues.length).toBeGreaterThan(0);
		await expectDocumented(await anonymous.get('/api/v1/garments?unit=furlong'), 'GET', '/api/v1/garments');
		await expectDocumented(await anonymous.get('/api/v1/workroom'), 'GET', '/api/v1/workroom');
		const customer = await signedIn('customer');
		await expectDocumented(await customer.json('GET', '/api/v1/workroom'), 'GET', '/api/v1/workroom');
		await expectDocumented(
			await customer.json('GET', '/api/v1/measurement-profiles/00000000-0000-4000-8000-000000000000'),
			'GET',
			'/api/v1/measurement-profiles/{id}'
		);
		const unsupported = await anonymous.post('/api/v1/layouts', { width: '150' });
		expect(unsupported.status).toBe(415);
		await expectDocumented(unsupported, 'POST', '/api/v1/layouts');
	});
});

describe('GET /api/docs', () => {
	it('lists every operation of the document, each with its own anchor, grouped under headings', async () => {
		const response = await newClient().get('/api/docs');
		expect(response.status).toBe(200);
		expect(response.headers.get('content-type')).toMatch(/^text\/html/);
		const html = await response.text();
		expect(html.match(/<h1[\s>]/g)).toHaveLength(1);
		const operations = Object.entries(document.paths).flatMap(([path, item]) =>
			Object.entries(item).map(([method, op]) => ({ path, method: method.toUpperCase(), ...op }))
		);
		expect(operations.length).toBeGreaterThan(20);
		for (const op of operations) {
			expect(html, `${op.method} ${op.path}`).toContain(`id="op-${op.operationId}"`);
			expect(html).toContain(`href="#op-${op.operationId}"`);
			expect(html).toContain(op.path);
		}
		for (const tag of [
			'Commissions',
			'Quotes',
			'Messages',
			'Orders and payment',
			'Workrooms',
			'Search',
			'Measurement profiles',
			'Drafting',
			'Places',
			'Service'
		]) {
			expect(html).toMatch(new RegExp(`<h2[^>]*>${tag}</h2>`));
		}
		expect(html).toContain('id="schema-ApiError"');
		expect(html, 'links, anchors and native disclosures only').not.toContain('<script');
	});

	it('reaches a visitor as the page built ahead, with a validator', async () => {
		const response = await newClient().get('/api/docs');
		expect(response.headers.get('cache-control')).toBe('no-cache');
		const etag = response.headers.get('etag');
		expect(etag).toMatch(/^".+"$/);
		const again = await fetch(response.url, { headers: { 'if-none-match': etag! } });
		expect(again.status).toBe(304);
	});
});
