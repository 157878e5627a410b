/**
 * Paying for an order: checkout through the processor's hosted page, the signed webhook funding the order
 * exactly once (ledger, payment row, the stand-in's balance), declined cards leaving it unpaid with their
 * message, replays and forged or stale signatures changing nothing, and the return page showing the truth
 * before any webhook arrives.
 */
import { and, eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import {
	auditEvent,
	ledgerEntry,
	order,
	payment,
	processedWebhookEvent,
	tailorProfile
} from '../../src/lib/server/db/schema';
import { TEST_CARDS } from '../../docker/standins/stripe-controller';
import { createCommission, createUser, createWorkroom, type Person } from '../factories';
import { awardQuote, insertQuote } from '../factories/quotes';
import { testDb } from './db';
import { baseUrl, newClient, signIn, type Client } from './http';
import { waitForMail } from './inbox';
import { stripeControl, stripeStandin } from './stripe';

const { db, pool } = testDb();
afterAll(() => pool.end());

const control = stripeControl();
afterEach(() => control.clearFaults());

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

/** An order awaiting payment (accepted quote written directly) and its customer signed in. */
async function unpaidOrder(priceMinor = 48_250) {
	const customer = await createUser(db, { name: 'Tamsin Hocking' });
	const tailor = await createWorkroom(db);
	const made = await createCommission(db, { customerId: customer.id, status: 'open' });
	const q = await insertQuote(db, { commissionId: made.id, tailorId: tailor.id, priceMinor });
	const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
	return { orderId, priceMinor, customer, tailor, commissionId: made.id, client: await signedIn(customer) };
}

async function checkout(client: Client, orderId: string) {
	const response = await client.json('POST', `/api/v1/orders/${orderId}/checkout`);
	const body = (await response.json()) as { url?: string; error?: { code: string } };
	return { status: response.status, body };
}

const statusOf = async (orderId: string) =>
	(await db.select({ status: order.status }).from(order).where(eq(order.id, orderId)))[0].status;

async function until<T>(read: () => Promise<T>, done: (value: T) => boolean, timeoutMs = 8000): Promise<T> {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const value = await read();
		if (done(value) || Date.now() > deadline) return value;
		await new Promise((resolve) => setTimeout(resolve, 50));
	}
}

const entriesOf = (orderId: string) =>
	db
		.select({
			account: ledgerEntry.account,
			amountMinor: ledgerEntry.amountMinor,
			currency: ledgerEntry.currency,
			transactionId: ledgerEntry.transactionId,
			paymentId: ledgerEntry.paymentId
		})
		.from(ledgerEntry)
		.where(eq(ledgerEntry.orderId, orderId));

const chargesOf = (orderId: string) =>
	db
		.select({ id: payment.id, status: payment.status, amountMinor: payment.amountMinor, reason: payment.failureReason })
		.from(payment)
		.where(and(eq(payment.orderId, orderId), eq(payment.kind, 'charge')));

async function platformAvailable(currency = 'eur') {
	const balance = await sdk().balance.retrieve();
	return balance.available.find((b) => b.currency === currency)?.amount ?? 0;
}

/** Posts an event's JSON to the webhook endpoint as Stripe would, signed with `secret` at `timestamp`. */
async function deliver(
	payload: string,
	{ secret = stripeStandin().env.STRIPE_WEBHOOK_SECRET, timestamp = Math.floor(Date.now() / 1000) } = {}
) {
	const header = Stripe.webhooks.generateTestHeaderString({ payload, secret, timestamp });
	return fetch(`${baseUrl}/api/v1/webhooks/stripe`, {
		method: 'POST',
		headers: { 'content-type': 'application/json', 'stripe-signature': header },
		body: payload
	});
}

/** The stand-in's event as it was sent (without its delivery log). */
async function eventJson(type: string, orderId: string) {
	const events = await control.events(type);
	const found = events.find((e) => {
		const object = (e as unknown as { data: { object: { metadata?: Record<string, string> } } }).data.object;
		return object.metadata?.order_id === orderId;
	});
	if (!found) throw new Error(`No ${type} for ${orderId}`);

	const { deliveries, ...event } = found;
	return JSON.stringify(event);
}

describe('paying with a card that works', () => {
	let world: Awaited<ReturnType<typeof unpaidOrder>>;
	let before: number;

	beforeAll(async () => {
		world = await unpaidOrder();
		before = await platformAvailable();
	});

	it('opens one hosted payment page however often the customer clicks', async () => {
		const first = await checkout(world.client, world.orderId);
		expect(first.status, JSON.stringify(first.body)).toBe(201);
		expect(first.body.url).toMatch(new RegExp(`^${stripeStandin().url}/c/pay/cs_`));
		const again = await checkout(world.client, world.orderId);
		expect(again).toEqual(first);
		const session = await sdk().checkout.sessions.retrieve(first.body.url!.split('/').pop()!, {
			expand: ['line_items']
		});
		expect(session).toMatchObject({
			mode: 'payment',
			amount_total: world.priceMinor,
			currency: 'eur',
			customer_email: world.customer.email,
			metadata: { order_id: world.orderId }
		});
		expect(session.line_items?.data[0]?.amount_total).toBe(world.priceMinor);
		expect(session.success_url).toBe(`${baseUrl}/orders/${world.orderId}/paid?session_id={CHECKOUT_SESSION_ID}`);
	});

	it('funds the order once the webhook arrives: ledger, payment row, balance', async () => {
		const { body } = await checkout(world.client, world.orderId);
		const paid = await control.pay(body.url!, TEST_CARDS.success);
		expect(paid.status).toBe(303);
		expect(paid.location).toMatch(new RegExp(`/orders/${world.orderId}/paid\\?session_id=cs_`));
		expect(
			await until(
				() => statusOf(world.orderId),
				(s) => s === 'funded'
			)
		).toBe('funded');

		const entries = await entriesOf(world.orderId);
		expect(entries).toHaveLength(2);
		expect(entries.reduce((sum, e) => sum + e.amountMinor, 0)).toBe(0);
		expect(Object.fromEntries(entries.map((e) => [e.account, e.amountMinor]))).toEqual({
			customer_payments: -world.priceMinor,
			escrow: world.priceMinor
		});
		const charges = await chargesOf(world.orderId);
		expect(charges).toEqual([expect.objectContaining({ status: 'succeeded', amountMinor: world.priceMinor })]);
		expect(entries.every((e) => e.paymentId === charges[0].id)).toBe(true);
		expect(await platformAvailable()).toBe(before + world.priceMinor);

		const view = await world.client.json('GET', `/api/v1/orders/${world.orderId}`);
		expect(view.status).toBe(200);
		expect(await view.json()).toMatchObject({
			id: world.orderId,
			status: 'funded',
			priceMinor: world.priceMinor,
			platformFeeMinor: 4825,
			currency: 'EUR',
			money: {
				chargedMinor: world.priceMinor,
				heldMinor: world.priceMinor,
				advancedMinor: 0,
				releasedMinor: 0,
				refundedMinor: 0,
				feeMinor: 0
			}
		});
		const page = await world.client.get(paid.location!.replace(baseUrl, ''));
		expect(page.status).toBe(200);
		expect(await page.text()).toContain('Paid — thank you');
		const funded = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, world.orderId), eq(auditEvent.action, 'order.funded')));
		expect(funded).toHaveLength(1);
		const receipt = await waitForMail(world.customer.email);
		expect(receipt.subject).toMatch(/^Payment received for/);
		expect(receipt.text).toContain('€482.50');
		// Both notices lead to the order page, where the payment, the progress and the fittings are.
		expect(receipt.text).toContain(`/orders/${world.orderId}`);
		const startNow = await waitForMail(world.tailor.email);
		expect(startNow.subject).toMatch(/is paid — you can start$/);
		expect(startNow.text).toContain('€434.25');
		expect(startNow.text).toContain(`/orders/${world.orderId}`);
	});

	it('refuses a new checkout for a paid order', async () => {
		const again = await checkout(world.client, world.orderId);
		expect(again.status).toBe(409);
		expect(again.body.error?.code).toBe('conflict');
	});

	it('applies 100 replays of each paying event once', async () => {
		await control.idle();
		const completed = await eventJson('checkout.session.completed', world.orderId);
		const succeeded = await eventJson('payment_intent.succeeded', world.orderId);
		const before = await platformAvailable();
		const answers = await Promise.all(
			Array.from({ length: 100 }, (_, i) => deliver(i % 2 ? completed : succeeded).then((r) => r.status))
		);
		for (let i = 0; i < 100; i++) expect(answers[i]).toBe(200);
		for (let i = 0; i < 100; i++) expect((await deliver(i % 2 ? succeeded : completed)).status).toBe(200);
		expect(await entriesOf(world.orderId)).toHaveLength(2);
		expect(await chargesOf(world.orderId)).toHaveLength(1);
		expect(await statusOf(world.orderId)).toBe('funded');
		expect(await platformAvailable()).toBe(before);
	});
});

describe('cards that fail', () => {
	for (const [name, card, message] of [
		['a declined card', TEST_CARDS.declined, /declined/i],
		['a card without funds', TEST_CARDS.insufficientFunds, /insufficient funds/i]
	] as const) {
		it(`leaves the order unpaid after ${name}, with the reason on its page`, async () => {
			const world = await unpaidOrder(30_000);
			const before = await platformAvailable();
			const { body } = await checkout(world.client, world.orderId);
			const refused = await control.pay(body.url!, card);
			expect(refused.status).toBe(402);
			expect(refused.html).toMatch(message);
			const failure = await until(
				() => chargesOf(world.orderId),
				(rows) => rows.length > 0
			);
			expect(failure).toEqual([expect.objectContaining({ status: 'failed', reason: expect.stringMatching(message) })]);
			await control.idle();
			expect(await statusOf(world.orderId)).toBe('awaiting_payment');
			expect(await entriesOf(world.orderId)).toHaveLength(0);
			expect(await platformAvailable()).toBe(before);

			const view = (await (await world.client.json('GET', `/api/v1/orders/${world.orderId}`)).json()) as {
				lastPaymentFailure: { message: string } | null;
				money: { chargedMinor: number };
			};
			expect(view.lastPaymentFailure?.message).toMatch(message);
			expect(view.money.chargedMinor).toBe(0);
			const page = await world.client.get(`/orders/${world.orderId}/paid?cancelled=1`);
			const html = await page.text();
			expect(html).toContain('did not go through');
			expect(html).toMatch(message);
			expect(html).toContain('Try again');

			// The same page then takes a working card.
			const retry = await control.pay(body.url!, TEST_CARDS.success);
			expect(retry.status).toBe(303);
			expect(
				await until(
					() => statusOf(world.orderId),
					(s) => s === 'funded'
				)
			).toBe('funded');
		});
	}
});

describe('webhooks that are not to be trusted', () => {
	it('answers 400 to a bad signature, an old timestamp or none, and changes nothing', async () => {
		const world = await unpaidOrder(22_000);
		await control.setFaults({ dropWebhooks: 1 });
		const { body } = await checkout(world.client, world.orderId);
		expect((await control.pay(body.url!, TEST_CARDS.success)).status).toBe(303);
		await control.idle();
		const completed = await eventJson('checkout.session.completed', world.orderId);
		const eventId = (JSON.parse(completed) as { id: string }).id;

		const forged = await deliver(completed, { secret: 'whsec_not_the_real_one' });
		expect(forged.status).toBe(400);
		expect(((await forged.json()) as { error: { code: string } }).error.code).toBe('invalid_signature');
		expect((await deliver(completed, { timestamp: Math.floor(Date.now() / 1000) - 301 })).status).toBe(400);
		const unsigned = await fetch(`${baseUrl}/api/v1/webhooks/stripe`, {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: completed
		});
		expect(unsigned.status).toBe(400);
		const altered = completed.replace(String(world.priceMinor), String(world.priceMinor - 1));
		const signedOriginal = Stripe.webhooks.generateTestHeaderString({
			payload: completed,
			secret: stripeStandin().env.STRIPE_WEBHOOK_SECRET
		});
		const tampered = await fetch(`${baseUrl}/api/v1/webhooks/stripe`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', 'stripe-signature': signedOriginal },
			body: altered
		});
		expect(tampered.status).toBe(400);

		expect(await statusOf(world.orderId)).toBe('awaiting_payment');
		expect(await entriesOf(world.orderId)).toHaveLength(0);
		expect(
			await db.select().from(processedWebhookEvent).where(eq(processedWebhookEvent.eventId, eventId))
		).toHaveLength(0);

		// The genuine delivery, for contrast.
		expect((await deliver(completed)).status).toBe(200);
		expect(await statusOf(world.orderId)).toBe('funded');
	});

	it('acknowledges event types it does not use', async () => {
		const payload = JSON.stringify({
			id: 'evt_unused_type_1',
			object: 'event',
			type: 'customer.created',
			data: { object: { id: 'cus_x', object: 'customer' } },
			created: Math.floor(Date.now() / 1000),
			livemode: false,
			api_version: '2025-01-01'
		});
		const response = await deliver(payload);
		expect(response.status).toBe(200);
		expect(await response.json()).toMatchObject({ outcome: 'ignored' });
	});

	it('is not held to the per-address API limit: the processor sends from few addresses, in bursts', async () => {
		const payload = JSON.stringify({
			id: 'evt_unused_type_burst',
			object: 'event',
			type: 'customer.updated',
			data: { object: { id: 'cus_y', object: 'customer' } },
			created: Math.floor(Date.now() / 1000),
			livemode: false,
			api_version: '2025-01-01'
		});
		// The public API allows 600 a minute per address.
		const statuses: number[] = [];
		for (let batch = 0; batch < 13; batch++)
			statuses.push(...(await Promise.all(Array.from({ length: 50 }, () => deliver(payload).then((r) => r.status)))));
		expect(statuses.filter((status) => status !== 200)).toEqual([]);
	});
});

describe('the return page before the webhook', () => {
	it('shows the order paid by asking the processor, and the late webhook changes nothing', async () => {
		const world = await unpaidOrder(36_500);
		await control.setFaults({ dropWebhooks: 1 });
		const { body } = await checkout(world.client, world.orderId);
		const paid = await control.pay(body.url!, TEST_CARDS.success);
		expect(paid.status).toBe(303);
		await control.idle();
		expect(await statusOf(world.orderId)).toBe('awaiting_payment');

		const page = await world.client.get(paid.location!.replace(baseUrl, ''));
		expect(page.status).toBe(200);
		expect(await page.text()).toContain('Paid — thank you');
		expect(await statusOf(world.orderId)).toBe('funded');
		expect(await entriesOf(world.orderId)).toHaveLength(2);

		await control.clearFaults();
		const completed = await eventJson('checkout.session.completed', world.orderId);
		expect((await deliver(completed)).status).toBe(200);
		expect(await entriesOf(world.orderId)).toHaveLength(2);
		expect(await chargesOf(world.orderId)).toHaveLength(1);
	});

	it('shows a refused card on the way back, before its webhook, and records it once', async () => {
		const world = await unpaidOrder(17_500);
		await control.setFaults({ dropWebhooks: 1 });
		const { body } = await checkout(world.client, world.orderId);
		expect((await control.pay(body.url!, TEST_CARDS.declined)).status).toBe(402);
		await control.idle();
		expect(await chargesOf(world.orderId)).toEqual([]);

		const html = await (await world.client.get(`/orders/${world.orderId}/paid?cancelled=1`)).text();
		expect(html).toContain('Your last card attempt did not go through');
		expect(html).toMatch(/declined/i);
		await control.clearFaults();
		const failed = await eventJson('payment_intent.payment_failed', world.orderId);
		expect((await deliver(failed)).status).toBe(200);
		expect(await chargesOf(world.orderId)).toEqual([expect.objectContaining({ status: 'failed' })]);
		const audited = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, world.orderId), eq(auditEvent.action, 'order.payment_failed')));
		expect(audited).toHaveLength(1);
		expect(await statusOf(world.orderId)).toBe('awaiting_payment');
	});

	it('says a cancelled payment left the order unpaid and offers to pay', async () => {
		const world = await unpaidOrder(12_000);
		const page = await world.client.get(`/orders/${world.orderId}/paid?cancelled=1`);
		const html = await page.text();
		expect(html).toContain('Nothing was charged');
		expect(html).toContain('?/pay');
		const pay = await world.client.post(`/orders/${world.orderId}/paid?/pay`);
		expect(pay.status).toBe(303);
		expect(pay.headers.get('location')).toMatch(new RegExp(`^${stripeStandin().url}/c/pay/cs_`));
		expect(page.headers.get('content-security-policy')).toContain(`form-action 'self' ${stripeStandin().url}`);
	});
});

describe('tailor payouts', () => {
	it('sets up a connected account once and follows it to enabled', async () => {
		const tailor = await createWorkroom(db, { profile: { payoutStatus: 'not_connected', payoutAccountId: null } });
		const client = await signedIn(tailor);
		const first = await client.post('/workroom/payouts?/setUp');
		expect(first.status).toBe(303);
		const link = first.headers.get('location')!;
		expect(link).toMatch(new RegExp(`^${stripeStandin().url}/setup/e/acct_`));
		const [pending] = await db
			.select({ id: tailorProfile.payoutAccountId, status: tailorProfile.payoutStatus })
			.from(tailorProfile)
			.where(eq(tailorProfile.userId, tailor.id));
		expect(pending.status).toBe('pending');
		const again = await client.post('/workroom/payouts?/setUp');
		expect(again.headers.get('location')).toContain(`/setup/e/${pending.id}/`);

		const onboarded = await control.onboard(link, { name: tailor.shopName });
		expect(onboarded.location).toBe(`${baseUrl}/workroom/payouts?returned=1`);
		const page = await client.get('/workroom/payouts?returned=1');
		expect(await page.text()).toContain('your payouts are ready');
		const [enabled] = await db
			.select({ status: tailorProfile.payoutStatus })
			.from(tailorProfile)
			.where(eq(tailorProfile.userId, tailor.id));
		expect(enabled.status).toBe('enabled');
	});

	it('gives every demo workroom payouts that are ready', async () => {
		const rows = await db
			.select({ status: tailorProfile.payoutStatus, id: tailorProfile.payoutAccountId })
			.from(tailorProfile)
			.where(eq(tailorProfile.slug, 'obi-cut-and-stitch'));
		expect(rows).toEqual([{ status: 'enabled', id: expect.stringMatching(/^acct_/) }]);
		const account = await sdk().accounts.retrieve(rows[0].id);
		expect(account.payouts_enabled).toBe(true);
	});
});
