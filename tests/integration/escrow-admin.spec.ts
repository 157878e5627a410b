/**
 * The books on the desk: escrow totals per currency from the ledger, reconciled against the processor's balance
 * (the stand-in's), a difference flagged when money moves at the processor behind the ledger's back, the totals
 * kept through a processor outage, and orders whose own books do not balance or whose money is stuck.
 */
import { randomUUID } from 'node:crypto';
import { Ajv2020 } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import { and, eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { TEST_CARDS } from '../../docker/standins/stripe-controller';
import { order, payment } from '../../src/lib/server/db/schema';
import { createCommission, createUser, createWorkroom, type Person } from '../factories';
import { awardQuote, insertQuote } from '../factories/quotes';
import { testDb } from './db';
import { newClient, signIn, type Client } from './http';
import { stripeControl, stripeStandin } from './stripe';

const { db, pool } = testDb();
afterAll(() => pool.end());

const control = stripeControl();
afterEach(() => control.clearFaults());

type Row = {
	currency: string;
	heldMinor: number;
	releasedMinor: number;
	refundedMinor: number;
	feesMinor: number;
	processorBalanceMinor: number | null;
	difference: number | null;
};
type Escrow = { currencies: Row[]; processorAvailable: boolean };

function sdk() {
	const env = stripeStandin().env;
	return new Stripe(env.STRIPE_SECRET_KEY, {
		host: env.STRIPE_API_HOST,
		port: Number(env.STRIPE_API_PORT),
		protocol: 'http',
		maxNetworkRetries: 0
	});
}

async function signedIn(person: Person): Promise<Client> {
	const client = newClient();
	expect((await signIn(client, person.email, person.password)).status).toBe(303);
	return client;
}

let admin: Client;
const ajv = new Ajv2020({ strict: false, allErrors: true });
addFormats.default(ajv);
let validateEscrow: ReturnType<typeof ajv.compile>;

beforeAll(async () => {
	admin = await signedIn(await createUser(db, { role: 'admin' }));
	const document = (await (await newClient().get('/api/v1/openapi.json')).json()) as Record<string, unknown>;
	ajv.addSchema({ ...document, $id: 'https://tackline.invalid/openapi.json' });
	validateEscrow = ajv.getSchema(
		'https://tackline.invalid/openapi.json#/paths/~1api~1v1~1admin~1escrow/get/responses/200/content/application~1json/schema'
	)!;
});

async function escrow(): Promise<Escrow> {
	const response = await admin.json('GET', '/api/v1/admin/escrow');
	expect(response.status).toBe(200);
	const body = (await response.json()) as Escrow;
	expect(validateEscrow(body), JSON.stringify(validateEscrow.errors)).toBe(true);
	return body;
}

/** The euro row; a currency nobody has paid in yet is all zeros. */
const eur = (body: Escrow): Row =>
	body.currencies.find((c) => c.currency === 'EUR') ?? {
		currency: 'EUR',
		heldMinor: 0,
		releasedMinor: 0,
		refundedMinor: 0,
		feesMinor: 0,
		processorBalanceMinor: body.processorAvailable ? 0 : null,
		difference: body.processorAvailable ? 0 : null
	};

async function until<T>(read: () => Promise<T>, done: (value: T) => boolean, timeoutMs = 8000): Promise<T> {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const value = await read();
		if (done(value) || Date.now() > deadline) return value;
		await new Promise((resolve) => setTimeout(resolve, 50));
	}
}

/** An order paid through the hosted page with the card that works, funded by the signed webhook. */
async function paidOrder(priceMinor: number) {
	const customer = await createUser(db, { name: 'Jory Nance' });
	const tailor = await createWorkroom(db);
	const made = await createCommission(db, { customerId: customer.id, status: 'open' });
	const q = await insertQuote(db, { commissionId: made.id, tailorId: tailor.id, priceMinor });
	const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
	const client = await signedIn(customer);
	const started = await client.json('POST', `/api/v1/orders/${orderId}/checkout`);
	expect(started.status).toBe(201);
	const { url } = (await started.json()) as { url: string };
	expect((await control.pay(url, TEST_CARDS.success)).status).toBe(303);
	const [funded] = await until(
		() => db.select({ status: order.status }).from(order).where(eq(order.id, orderId)),
		([row]) => row.status === 'funded'
	);
	expect(funded.status).toBe('funded');
	const [charge] = await db
		.select({ processorId: payment.processorId })
		.from(payment)
		.where(and(eq(payment.orderId, orderId), eq(payment.kind, 'charge')));
	return { orderId, chargeId: charge.processorId };
}

describe('GET /api/v1/admin/escrow', () => {
	it('answers the totals per currency in the documented shape, and the processor agrees with the seeded books', async () => {
		const body = await escrow();
		expect(body.processorAvailable).toBe(true);
		// The demo seed's orders were paid in euros through the processor, so there is money to reconcile.
		expect(body.currencies.length).toBeGreaterThan(0);
		expect(eur(body).heldMinor).toBeGreaterThan(0);
		expect(eur(body).releasedMinor).toBeGreaterThan(0);
		for (const row of body.currencies) {
			expect(Object.keys(row).sort()).toEqual(
				[
					'currency',
					'difference',
					'feesMinor',
					'heldMinor',
					'processorBalanceMinor',
					'refundedMinor',
					'releasedMinor'
				].sort()
			);
			expect(row.difference).toBe(row.processorBalanceMinor! - (row.heldMinor + row.feesMinor));
			expect(row.difference, `${row.currency} reconciles`).toBe(0);
		}
	});

	it('moves held money and the processor’s balance together when a customer pays', async () => {
		const before = eur(await escrow());
		await paidOrder(61_275);
		const after = eur(await escrow());
		expect(after.heldMinor - before.heldMinor).toBe(61_275);
		expect(after.processorBalanceMinor! - before.processorBalanceMinor!).toBe(61_275);
		expect(after.difference).toBe(0);
	});

	it('flags money that left the processor without the ledger knowing, on the API and the desk page', async () => {
		const { chargeId } = await paidOrder(30_000);
		const before = eur(await escrow());
		// A refund made at the processor directly, not through Tackline: the ledger never hears of it.
		await sdk().refunds.create({ charge: chargeId, amount: 1_234 }, { idempotencyKey: randomUUID() });
		const after = eur(await escrow());
		expect(after.heldMinor).toBe(before.heldMinor);
		expect(after.difference).toBe(before.difference! - 1_234);
		expect(after.difference).not.toBe(0);

		const page = await admin.get('/desk/escrow');
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('The books and the processor disagree');
		expect(html).toMatch(/Difference of -?€12\.34|Difference of −€12\.34/);
	});

	it('still shows the ledger’s totals while the processor is away, with the balance marked unavailable', async () => {
		const healthy = await escrow();
		await control.setFaults({ errorRate: 1, errorStatus: 503, paths: ['GET /v1/balance'] });
		const away = await escrow();
		expect(away.processorAvailable).toBe(false);
		expect(away.currencies.map((c) => c.currency)).toEqual(
			healthy.currencies
				.filter((c) => c.heldMinor || c.releasedMinor || c.refundedMinor || c.feesMinor)
				.map((c) => c.currency)
		);
		for (const row of away.currencies) {
			expect(row.processorBalanceMinor).toBeNull();
			expect(row.difference).toBeNull();
		}
		expect(eur(away).heldMinor).toBe(eur(healthy).heldMinor);
		const html = await (await admin.get('/desk/escrow')).text();
		expect(html).toContain('The payment processor is not answering');
		expect(html).toContain('Balance unavailable');
	});

	it('is for administrators only: 401 without a session, 403 for customers and tailors', async () => {
		expect((await newClient().json('GET', '/api/v1/admin/escrow')).status).toBe(401);
		const customer = await signedIn(await createUser(db));
		const refused = await customer.json('GET', '/api/v1/admin/escrow');
		expect(refused.status).toBe(403);
		expect(await refused.text()).not.toContain('heldMinor');
		const tailor = await signedIn(await createUser(db, { role: 'tailor' }));
		expect((await tailor.json('GET', '/api/v1/admin/escrow')).status).toBe(403);
	});
});

describe('the desk page', () => {
	it('gives a card only to currencies with money in them', async () => {
		const body = await escrow();
		const html = await (await admin.get('/desk/escrow')).text();
		const cards = [...html.matchAll(/id="currency-([A-Z]{3})"/g)].map((m) => m[1]);
		expect(cards).toContain('EUR');
		const withMoney = body.currencies
			.filter((c) => c.heldMinor || c.releasedMinor || c.refundedMinor || c.feesMinor || c.processorBalanceMinor)
			.map((c) => c.currency);
		expect(cards.sort()).toEqual(withMoney.sort());
		expect(html).not.toContain('No money yet');
	});

	it('lists an order whose processor payment the ledger never recorded, and money stuck for over an hour', async () => {
		const { orderId: unrecorded } = await paidOrder(20_000);
		await db.insert(payment).values({
			orderId: unrecorded,
			kind: 'release_transfer',
			processorId: `tr_unrecorded_${randomUUID()}`,
			amountMinor: 18_000,
			currency: 'EUR',
			status: 'succeeded',
			idempotencyKey: `release:${unrecorded}`
		});
		const { orderId: stuck } = await paidOrder(15_000);
		await db
			.update(order)
			.set({ releaseRequestedAt: new Date(Date.now() - 2 * 3_600_000) })
			.where(eq(order.id, stuck));

		const html = await (await admin.get('/desk/escrow')).text();
		const books = html.slice(html.indexOf('Orders whose books do not balance'), html.indexOf('Money waiting to move'));
		expect(books).toContain(`/orders/${unrecorded}`);
		expect(books).toContain('went through at the processor but is not in the ledger');
		expect(books).not.toContain(`/orders/${stuck}`);
		const waiting = html.slice(html.indexOf('Money waiting to move'));
		expect(waiting).toContain(`/orders/${stuck}`);
		expect(waiting).toContain('€150 still in escrow');
		expect(waiting).not.toContain(`/orders/${unrecorded}`);
	});

	it('is linked from the desk’s front page', async () => {
		const html = await (await admin.get('/desk')).text();
		expect(html).toContain('href="/desk/escrow"');
	});
});
