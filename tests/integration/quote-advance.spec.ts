/**
 * The fabric advance on the quote's side: at most 30 % of the price and only when the tailor sources the fabric,
 * checked the same way by the API, the quote form and the database; shown in the comparison and the acceptance,
 * and carried onto the order.
 */
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { order, quote } from '../../src/lib/server/db/schema';
import { createCommission, createUser, type Person } from '../factories';
import { createQuotingWorkroom } from '../factories/quotes';
import { testDb } from './db';
import { newClient, signIn, type Client } from './http';

// The acceptance reads the fee rate through the app's settings module.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = testDb();
afterAll(() => pool.end());

const day = 86_400_000;
const later = (days: number) => new Date(Date.now() + days * day).toISOString().slice(0, 10);

async function signedIn(person: Person) {
	const client = newClient();
	expect((await signIn(client, person.email, person.password)).status).toBe(303);
	return client;
}

async function api(client: Client, method: string, path: string, body?: unknown) {
	const response = await client.json(method, path, body);
	const text = await response.text();
	// Read loosely: each test asserts the shape it relies on.
	// eslint-disable-next-line @typescript-eslint/no-explicit-any
	return { status: response.status, body: (text ? JSON.parse(text) : null) as Record<string, any> };
}

function terms(overrides: Record<string, unknown> = {}) {
	return {
		priceMinor: 18_500,
		currency: 'EUR',
		deliveryDate: later(30),
		fittings: 2,
		fabricIncluded: true,
		message: 'Wool-silk from the Merrowgate mill; I buy it once you approve the swatch.',
		validUntil: later(10),
		...overrides
	};
}

async function scene() {
	const customer = await createUser(db, { name: 'Elowen Pascoe' });
	const commission = await createCommission(db, {
		customerId: customer.id,
		status: 'open',
		dateNeeded: later(60),
		expiresAt: new Date(Date.now() + 20 * day)
	});
	const tailor = await createQuotingWorkroom(db);
	return {
		customer,
		commission,
		tailor,
		owner: await signedIn(customer),
		quoting: await signedIn(tailor),
		url: `/api/v1/commissions/${commission.id}/quotes`
	};
}

const issuePaths = (body: Record<string, { issues: { path: string }[] }>) => body.error.issues.map((i) => i.path);

describe('the advance through the API', () => {
	it('defaults to none, and answers the same quote shape with advanceMinor beside the other fields', async () => {
		const s = await scene();
		const sent = await api(s.quoting, 'POST', s.url, terms());
		expect(sent.status, JSON.stringify(sent.body)).toBe(201);
		expect(sent.body).toMatchObject({ priceMinor: 18_500, fabricIncluded: true, advanceMinor: 0, status: 'sent' });
		for (const key of [
			'id',
			'commissionId',
			'tailorId',
			'currency',
			'deliveryDate',
			'fittings',
			'validUntil',
			'warnings'
		])
			expect(sent.body).toHaveProperty(key);
		const read = await api(s.owner, 'GET', `/api/v1/quotes/${sent.body.id}`);
		expect(read.body.advanceMinor).toBe(0);
	});

	it('takes an advance of exactly 30 % of the price and refuses one minor unit more, naming the limit', async () => {
		const s = await scene();
		// 30 % of 185.00 is 55.50.
		const over = await api(s.quoting, 'POST', s.url, terms({ advanceMinor: 5_551 }));
		expect(over.status).toBe(400);
		expect(issuePaths(over.body)).toEqual(['advanceMinor']);
		expect(over.body.error.issues[0].message).toMatch(/at most 30 % of the price: €55\.50/);
		expect(await db.select().from(quote).where(eq(quote.commissionId, s.commission.id))).toHaveLength(0);

		const exact = await api(s.quoting, 'POST', s.url, terms({ advanceMinor: 5_550 }));
		expect(exact.status, JSON.stringify(exact.body)).toBe(201);
		expect(exact.body.advanceMinor).toBe(5_550);
		const [row] = await db.select().from(quote).where(eq(quote.id, exact.body.id));
		expect(row.advanceMinor).toBe(5_550);
	});

	it('refuses an advance when the customer supplies the fabric, and malformed amounts', async () => {
		const s = await scene();
		const noFabric = await api(s.quoting, 'POST', s.url, terms({ fabricIncluded: false, advanceMinor: 1_000 }));
		expect(noFabric.status).toBe(400);
		expect(noFabric.body.error.issues[0]).toMatchObject({
			path: 'advanceMinor',
			message: expect.stringMatching(/only when you source the fabric/)
		});
		for (const advanceMinor of [-1, 12.5, '1000', null]) {
			const refused = await api(s.quoting, 'POST', s.url, terms({ advanceMinor }));
			expect(refused.status, String(advanceMinor)).toBe(400);
			expect(issuePaths(refused.body)).toContain('advanceMinor');
		}
		// No advance with no fabric is simply a quote.
		const plain = await api(s.quoting, 'POST', s.url, terms({ fabricIncluded: false, advanceMinor: 0 }));
		expect(plain.status).toBe(201);
	});

	it('checks a change against the quote’s other terms', async () => {
		const s = await scene();
		const sent = await api(s.quoting, 'POST', s.url, terms({ advanceMinor: 5_000 }));
		expect(sent.status).toBe(201);
		const url = `/api/v1/quotes/${sent.body.id}`;

		const fabricOut = await api(s.quoting, 'PATCH', url, { fabricIncluded: false });
		expect(fabricOut.status).toBe(400);
		expect(fabricOut.body.error.issues[0].message).toMatch(/only when you source the fabric/);
		const cheaper = await api(s.quoting, 'PATCH', url, { priceMinor: 10_000 });
		expect(cheaper.status).toBe(400);
		expect(cheaper.body.error.issues[0].message).toMatch(/at most 30 % of the price: €30 here/);
		const both = await api(s.quoting, 'PATCH', url, { fabricIncluded: false, advanceMinor: 100 });
		expect(both.status).toBe(400);
		expect((await db.select().from(quote).where(eq(quote.id, sent.body.id)))[0].advanceMinor).toBe(5_000);

		const lowered = await api(s.quoting, 'PATCH', url, { advanceMinor: 2_000 });
		expect(lowered.status, JSON.stringify(lowered.body)).toBe(200);
		expect(lowered.body).toMatchObject({ advanceMinor: 2_000, priceMinor: 18_500 });
		const dropped = await api(s.quoting, 'PATCH', url, { fabricIncluded: false, advanceMinor: 0 });
		expect(dropped.status).toBe(200);
		expect(dropped.body).toMatchObject({ advanceMinor: 0, fabricIncluded: false });
	});
});

describe('the advance on the pages and the order', () => {
	it('is shown in the comparison and the acceptance, and copied onto the order', async () => {
		const s = await scene();
		const sent = await api(s.quoting, 'POST', s.url, terms({ advanceMinor: 4_000 }));
		expect(sent.status).toBe(201);

		const page = await (await s.owner.get(`/commissions/${s.commission.id}`)).text();
		expect(page).toContain('Advance');
		expect(page).toContain('€40');
		expect(page).toContain('when you approve the fabric');

		const confirming = await (await s.owner.get(`/commissions/${s.commission.id}?accept=${sent.body.id}`)).text();
		expect(confirming).toMatch(/€40(<!--[^>]*-->)? of that is an advance for the fabric/);

		const accepted = await api(s.owner, 'POST', `/api/v1/quotes/${sent.body.id}/accept`);
		expect(accepted.status, JSON.stringify(accepted.body)).toBe(201);
		expect(accepted.body).toMatchObject({ priceMinor: 18_500, advanceMinor: 4_000 });
		const [row] = await db.select().from(order).where(eq(order.id, accepted.body.orderId));
		expect(row).toMatchObject({ advanceMinor: 4_000, priceMinor: 18_500 });
		expect(row.advanceMinor).toBeLessThanOrEqual(row.tailorPayoutMinor);
	});

	it('the database refuses an advance beyond 30 % or without fabric, whatever the code does', async () => {
		const s = await scene();
		const sent = await api(s.quoting, 'POST', s.url, terms());
		const over = db.update(quote).set({ advanceMinor: 5_551 }).where(eq(quote.id, sent.body.id));
		await expect(over).rejects.toThrow();
		await db.update(quote).set({ fabricIncluded: false }).where(eq(quote.id, sent.body.id));
		const noFabric = db.update(quote).set({ advanceMinor: 100 }).where(eq(quote.id, sent.body.id));
		await expect(noFabric).rejects.toThrow();
	});
});

describe('the advance in the quote form', () => {
	const form = (overrides: Record<string, string> = {}) => ({
		price: '185',
		deliveryDate: later(30),
		fittings: '2',
		fabricIncluded: 'on',
		message: 'Wool-silk, bought once you approve it.',
		validUntil: later(10),
		...overrides
	});

	it('refuses more than 30 % beside the field and keeps what was typed', async () => {
		const s = await scene();
		const response = await s.quoting.post(`/commissions/${s.commission.id}/quote?/send`, form({ advance: '55.51' }));
		expect(response.status).toBe(400);
		const html = await response.text();
		expect(html).toContain('id="advance-error"');
		expect(html).toMatch(/at most 30 % of the price: €55\.50/);
		expect(html).toMatch(/name="advance"[^>]*value="55\.51"|value="55\.51"[^>]*name="advance"/);
		expect(await db.select().from(quote).where(eq(quote.commissionId, s.commission.id))).toHaveLength(0);
	});

	it('sends the advance in the commission’s currency, and none when the fabric is not included', async () => {
		const s = await scene();
		const sent = await s.quoting.post(`/commissions/${s.commission.id}/quote?/send`, form({ advance: '55.50' }));
		expect(sent.status).toBe(303);
		const [row] = await db.select().from(quote).where(eq(quote.commissionId, s.commission.id));
		expect(row.advanceMinor).toBe(5_550);

		// Unticking the fabric hides the advance; a value left in the hidden field is not sent on.
		const edited = await s.quoting.post(
			`/commissions/${s.commission.id}/quote?/edit`,
			form({ fabricIncluded: '', advance: '20' })
		);
		expect(edited.status).toBe(303);
		const [after] = await db.select().from(quote).where(eq(quote.id, row.id));
		expect(after).toMatchObject({ fabricIncluded: false, advanceMinor: 0 });
	});
});
