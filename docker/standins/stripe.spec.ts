// The Stripe stand-in driven through the real `stripe` SDK, as the app drives it, with webhooks received
// and verified by `stripe.webhooks.constructEvent` on a local receiver.
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { newWebhookSecret, startStripeStandin, type StripeStandin } from './stripe';
import { StripeStandinController, TEST_CARDS } from './stripe-controller';
import { decodeForm } from './stripe-form';

let standin: StripeStandin;
let control: StripeStandinController;
let stripe: Stripe;
let receiver: Server;
const secret = newWebhookSecret();
/** Every delivery the receiver saw: verified events, or why verification failed. */
const received: { event?: Stripe.Event; error?: string; status: number }[] = [];
/** The receiver answers 500 to the first `failNext` deliveries. */
let failNext = 0;

beforeAll(async () => {
	receiver = createServer((req, res) => {
		const chunks: Buffer[] = [];
		req.on('data', (c: Buffer) => chunks.push(c));
		req.on('end', () => {
			const raw = Buffer.concat(chunks).toString('utf8');
			if (failNext > 0) {
				failNext -= 1;
				received.push({ status: 500 });
				return res.writeHead(500).end('try later');
			}
			try {
				const event = stripe.webhooks.constructEvent(raw, String(req.headers['stripe-signature']), secret);
				received.push({ event, status: 200 });
				res.writeHead(200).end('ok');
			} catch (error) {
				received.push({ error: (error as Error).message, status: 400 });
				res.writeHead(400).end('bad signature');
			}
		});
	});
	await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
	const receiverUrl = `http://127.0.0.1:${(receiver.address() as AddressInfo).port}/webhooks`;
	standin = await startStripeStandin({ port: 0, webhooks: [{ url: receiverUrl, secret }], webhookRetryBaseMs: 20 });
	control = new StripeStandinController(standin.url);
	stripe = new Stripe(standin.secretKey, {
		host: '127.0.0.1',
		port: standin.port,
		protocol: 'http',
		maxNetworkRetries: 0,
		telemetry: false
	});
});
afterAll(async () => {
	await standin.stop();
	await new Promise((resolve) => receiver.close(resolve));
});
afterEach(async () => {
	await control.clearFaults();
	failNext = 0;
});

const balanceOf = (balance: Stripe.Balance, currency: string) => ({
	available: balance.available.find((b) => b.currency === currency)?.amount ?? 0,
	pending: balance.pending.find((b) => b.currency === currency)?.amount ?? 0
});

async function onboardedAccount(email = 'ines@workroom.test') {
	const account = await stripe.accounts.create({
		type: 'express',
		country: 'GB',
		email,
		capabilities: { transfers: { requested: true } },
		metadata: { workroom: 'w-1' }
	});
	const link = await stripe.accountLinks.create({
		account: account.id,
		type: 'account_onboarding',
		refresh_url: 'http://localhost:3000/workroom/payouts/refresh',
		return_url: 'http://localhost:3000/workroom/payouts/done'
	});
	expect((await control.onboard(link.url)).location).toBe('http://localhost:3000/workroom/payouts/done');
	return account;
}

async function paidSession(amount = 24000, currency = 'gbp', orderId = 'ord_1') {
	const session = await stripe.checkout.sessions.create({
		mode: 'payment',
		customer_email: 'ada@example.test',
		line_items: [
			{ quantity: 1, price_data: { currency, unit_amount: amount, product_data: { name: 'Linen shift dress' } } }
		],
		metadata: { orderId },
		payment_intent_data: { transfer_group: orderId, metadata: { orderId } },
		success_url: 'http://localhost:3000/orders/x/paid?session={CHECKOUT_SESSION_ID}',
		cancel_url: 'http://localhost:3000/orders/x'
	});
	const paid = await control.pay(session.url!, TEST_CARDS.success);
	expect(paid.status).toBe(303);
	const done = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent.latest_charge'] });
	const pi = done.payment_intent as Stripe.PaymentIntent;
	return { session: done, pi, charge: pi.latest_charge as Stripe.Charge };
}

describe('form decoding', () => {
	it('reads bracket nesting, indexed and pushed arrays', () => {
		expect(
			decodeForm(
				'line_items[0][price_data][currency]=usd&line_items[0][quantity]=2&line_items[1][quantity]=1&expand[]=a&expand[]=b.c&metadata[k]=v%20w'
			)
		).toEqual({
			line_items: [{ price_data: { currency: 'usd' }, quantity: '2' }, { quantity: '1' }],
			expand: ['a', 'b.c'],
			metadata: { k: 'v w' }
		});
	});
});

describe('customers and errors', () => {
	it('creates, retrieves, lists and deletes a customer with Stripe ids and shapes', async () => {
		const customer = await stripe.customers.create({
			email: 'ada@example.test',
			name: 'Ada',
			metadata: { user: 'u1' }
		});
		expect(customer).toMatchObject({
			object: 'customer',
			email: 'ada@example.test',
			metadata: { user: 'u1' },
			livemode: false
		});
		expect(customer.id).toMatch(/^cus_[A-Za-z0-9]{14}$/);
		expect((await stripe.customers.retrieve(customer.id)).id).toBe(customer.id);
		const list = await stripe.customers.list({ email: 'ada@example.test', limit: 1 });
		expect(list).toMatchObject({ object: 'list', url: '/v1/customers', has_more: false });
		expect(list.data.map((c) => c.id)).toEqual([customer.id]);
		expect(await stripe.customers.del(customer.id)).toEqual({ id: customer.id, object: 'customer', deleted: true });
	});

	it('answers a missing object with 404 resource_missing, an unknown parameter and a bad key with their errors', async () => {
		const missing = await stripe.customers.retrieve('cus_nope').catch((e: unknown) => e);
		expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
		expect(missing).toMatchObject({ statusCode: 404, code: 'resource_missing', param: 'id' });
		const unknown = await stripe.customers
			.create({ colour: 'red' } as Stripe.CustomerCreateParams)
			.catch((e: unknown) => e);
		expect(unknown).toMatchObject({ statusCode: 400, code: 'parameter_unknown', param: 'colour' });
		const badKey = new Stripe('sk_test_wrong', {
			host: '127.0.0.1',
			port: standin.port,
			protocol: 'http',
			maxNetworkRetries: 0
		});
		expect(await badKey.balance.retrieve().catch((e: unknown) => e)).toBeInstanceOf(
			Stripe.errors.StripeAuthenticationError
		);
	});
});

describe('Connect Express accounts', () => {
	it('starts restricted; the onboarding page completes it and sends account.updated', async () => {
		const account = await stripe.accounts.create({
			type: 'express',
			country: 'GB',
			capabilities: { transfers: { requested: true } }
		});
		expect(account).toMatchObject({
			object: 'account',
			type: 'express',
			charges_enabled: false,
			payouts_enabled: false,
			details_submitted: false,
			default_currency: 'gbp'
		});
		expect(account.id).toMatch(/^acct_/);
		const link = await stripe.accountLinks.create({
			account: account.id,
			type: 'account_onboarding',
			refresh_url: 'http://localhost:3000/refresh',
			return_url: 'http://localhost:3000/return'
		});
		expect(link).toMatchObject({ object: 'account_link' });
		expect(link.expires_at - link.created).toBe(300);
		expect((await fetch(link.url)).status).toBe(200);
		const done = await control.onboard(link.url, { name: 'Ines Tailoring' });
		expect(done).toMatchObject({ status: 303, location: 'http://localhost:3000/return' });
		// A used link sends the person to refresh_url.
		expect((await control.onboard(link.url)).location).toBe('http://localhost:3000/refresh');

		const after = await stripe.accounts.retrieve(account.id);
		expect(after).toMatchObject({
			charges_enabled: true,
			payouts_enabled: true,
			details_submitted: true,
			capabilities: { transfers: 'active' }
		});
		expect(after.requirements?.currently_due).toEqual([]);
		const event = await control.waitForEvent((e) => e.type === 'account.updated' && e.account === account.id);
		expect(event.data.previous_attributes).toMatchObject({ charges_enabled: false });
	});
});

describe('Checkout and the hosted payment page', () => {
	it('pays with 4242…: session complete, payment intent succeeded, charge and balance', async () => {
		const before = balanceOf(await stripe.balance.retrieve(), 'gbp');
		const session = await stripe.checkout.sessions.create({
			mode: 'payment',
			customer_email: 'ada@example.test',
			line_items: [
				{ quantity: 1, price_data: { currency: 'gbp', unit_amount: 18500, product_data: { name: 'Wool skirt' } } }
			],
			metadata: { orderId: 'ord_pay' },
			payment_intent_data: { transfer_group: 'ord_pay', metadata: { orderId: 'ord_pay' } },
			success_url: 'http://localhost:3000/orders/ord_pay/paid?session={CHECKOUT_SESSION_ID}',
			cancel_url: 'http://localhost:3000/orders/ord_pay'
		});
		expect(session).toMatchObject({
			object: 'checkout.session',
			status: 'open',
			payment_status: 'unpaid',
			amount_total: 18500,
			currency: 'gbp',
			payment_intent: null
		});
		expect(session.id).toMatch(/^cs_test_/);
		const page = await (await fetch(session.url!)).text();
		expect(page).toContain('name="card"');
		expect(page).toContain('185.00 GBP');

		const paid = await control.pay(session.url!, TEST_CARDS.success);
		expect(paid).toMatchObject({
			status: 303,
			location: `http://localhost:3000/orders/ord_pay/paid?session=${session.id}`
		});

		const done = await stripe.checkout.sessions.retrieve(session.id, {
			expand: ['line_items', 'payment_intent.latest_charge']
		});
		expect(done).toMatchObject({
			status: 'complete',
			payment_status: 'paid',
			customer_details: { email: 'ada@example.test' }
		});
		expect(done.line_items?.data[0]).toMatchObject({
			object: 'item',
			amount_total: 18500,
			description: 'Wool skirt',
			quantity: 1
		});
		const pi = done.payment_intent as Stripe.PaymentIntent;
		expect(pi).toMatchObject({
			object: 'payment_intent',
			status: 'succeeded',
			amount: 18500,
			amount_received: 18500,
			transfer_group: 'ord_pay',
			metadata: { orderId: 'ord_pay' }
		});
		const charge = pi.latest_charge as Stripe.Charge;
		expect(charge).toMatchObject({
			object: 'charge',
			status: 'succeeded',
			paid: true,
			captured: true,
			amount: 18500,
			amount_refunded: 0,
			transfer_group: 'ord_pay',
			payment_intent: pi.id
		});
		expect((await stripe.charges.retrieve(charge.id)).balance_transaction).toMatch(/^txn_/);
		const after = balanceOf(await stripe.balance.retrieve(), 'gbp');
		expect(after.available + after.pending - before.available - before.pending).toBe(18500);

		// Paying twice is not possible: the page says it is paid.
		expect((await control.pay(session.url!, TEST_CARDS.success)).status).toBe(402);
		const types = (await control.events())
			.filter(
				(e) => (e.data.object as { id: string }).id === session.id || (e.data.object as { id: string }).id === pi.id
			)
			.map((e) => e.type);
		expect(types).toEqual(
			expect.arrayContaining(['payment_intent.created', 'payment_intent.succeeded', 'checkout.session.completed'])
		);
	});

	it('declines 4000…0002 and 4000…9995 with their messages, leaves the session open, then pays on retry', async () => {
		const session = await stripe.checkout.sessions.create({
			mode: 'payment',
			line_items: [
				{ quantity: 2, price_data: { currency: 'usd', unit_amount: 5000, product_data: { name: 'Shirt' } } }
			],
			success_url: 'http://localhost:3000/ok',
			cancel_url: 'http://localhost:3000/cancel'
		});
		const declined = await control.pay(session.url!, TEST_CARDS.declined, { email: 'bo@example.test' });
		expect(declined.status).toBe(402);
		expect(declined.html).toContain('Your card was declined.');
		expect(declined.html).toContain('href="http://localhost:3000/cancel"');
		let pi = await stripe.paymentIntents.retrieve(
			(await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string
		);
		expect(pi.status).toBe('requires_payment_method');
		expect(pi.last_payment_error).toMatchObject({
			type: 'card_error',
			code: 'card_declined',
			decline_code: 'generic_decline'
		});
		expect(await stripe.charges.retrieve(pi.latest_charge as string)).toMatchObject({
			status: 'failed',
			paid: false,
			failure_code: 'card_declined'
		});

		const poor = await control.pay(session.url!, TEST_CARDS.insufficientFunds, { email: 'bo@example.test' });
		expect(poor.html).toContain('Your card has insufficient funds.');
		pi = await stripe.paymentIntents.retrieve(pi.id);
		expect(pi.last_payment_error).toMatchObject({ code: 'card_declined', decline_code: 'insufficient_funds' });
		expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
		expect(
			(await control.events('payment_intent.payment_failed')).filter(
				(e) => (e.data.object as { id: string }).id === pi.id
			)
		).toHaveLength(2);

		expect((await control.pay(session.url!, TEST_CARDS.success, { email: 'bo@example.test' })).location).toBe(
			'http://localhost:3000/ok'
		);
		pi = await stripe.paymentIntents.retrieve(pi.id);
		expect(pi).toMatchObject({ status: 'succeeded', amount_received: 10000, receipt_email: 'bo@example.test' });
		expect((await stripe.charges.list({ payment_intent: pi.id })).data.map((c) => c.status)).toEqual([
			'succeeded',
			'failed',
			'failed'
		]);
	});

	it('refuses a three-decimal amount that does not end in 0, and an empty total', async () => {
		const session = (unit_amount: number, currency: string) =>
			stripe.checkout.sessions
				.create({
					mode: 'payment',
					line_items: [{ quantity: 1, price_data: { currency, unit_amount, product_data: { name: 'Coat' } } }],
					success_url: 'http://localhost:3000/ok'
				})
				.catch((e: unknown) => e);
		expect(await session(12345, 'kwd')).toMatchObject({ statusCode: 400, param: 'line_items' });
		expect(await session(12340, 'kwd')).toMatchObject({
			object: 'checkout.session',
			amount_total: 12340,
			currency: 'kwd'
		});
		expect(await session(0, 'usd')).toMatchObject({ statusCode: 400, code: 'amount_too_small' });
		expect(await session(1000, 'usd')).toMatchObject({ status: 'open' });
		expect(
			await stripe.checkout.sessions
				.create({ mode: 'payment', success_url: 'http://localhost:3000/ok' })
				.catch((e: unknown) => e)
		).toMatchObject({ statusCode: 400, code: 'parameter_missing', param: 'line_items' });
	});

	it('expires an open session and refuses to expire it again', async () => {
		const session = await stripe.checkout.sessions.create({
			mode: 'payment',
			line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 900, product_data: { name: 'Hem' } } }],
			success_url: 'http://localhost:3000/ok'
		});
		expect((await stripe.checkout.sessions.expire(session.id)).status).toBe('expired');
		expect(await stripe.checkout.sessions.expire(session.id).catch((e: unknown) => e)).toMatchObject({
			statusCode: 400
		});
		expect(await (await fetch(session.url!)).text()).toContain('expired');
	});
});

describe('transfers, reversals and refunds move the balance', () => {
	it('transfers from a charge, reverses part of it, refunds part and then all, with balances to the cent', async () => {
		const account = await onboardedAccount();
		const start = balanceOf(await stripe.balance.retrieve(), 'gbp');
		const { charge } = await paidSession(24000, 'gbp', 'ord_money');
		const transfer = await stripe.transfers.create({
			amount: 20000,
			currency: 'gbp',
			destination: account.id,
			source_transaction: charge.id,
			transfer_group: 'ord_money',
			metadata: { orderId: 'ord_money' }
		});
		expect(transfer).toMatchObject({
			object: 'transfer',
			amount: 20000,
			amount_reversed: 0,
			destination: account.id,
			source_transaction: charge.id,
			transfer_group: 'ord_money',
			reversed: false
		});
		expect(transfer.id).toMatch(/^tr_/);
		const connected = () => stripe.balance.retrieve({}, { stripeAccount: account.id });
		expect(balanceOf(await connected(), 'gbp').available).toBe(20000);
		let platform = balanceOf(await stripe.balance.retrieve(), 'gbp');
		expect(platform.available + platform.pending - start.available - start.pending).toBe(4000);

		// More than is left of the charge is refused.
		expect(
			await stripe.transfers
				.create({ amount: 4001, currency: 'gbp', destination: account.id, source_transaction: charge.id })
				.catch((e: unknown) => e)
		).toMatchObject({ statusCode: 400, code: 'amount_too_large' });

		const reversal = await stripe.transfers.createReversal(transfer.id, { amount: 5000 });
		expect(reversal).toMatchObject({ object: 'transfer_reversal', amount: 5000, transfer: transfer.id });
		const reversed = await stripe.transfers.retrieve(transfer.id);
		expect(reversed).toMatchObject({ amount_reversed: 5000, reversed: false });
		expect(reversed.reversals.data.map((r) => r.id)).toEqual([reversal.id]);
		expect(balanceOf(await connected(), 'gbp').available).toBe(15000);

		const partial = await stripe.refunds.create({ payment_intent: charge.payment_intent as string, amount: 3000 });
		expect(partial).toMatchObject({ object: 'refund', amount: 3000, status: 'succeeded', charge: charge.id });
		expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ amount_refunded: 3000, refunded: false });
		expect(await stripe.refunds.create({ charge: charge.id, amount: 999999 }).catch((e: unknown) => e)).toMatchObject({
			statusCode: 400,
			code: 'amount_too_large',
			param: 'amount'
		});
		const rest = await stripe.refunds.create({ charge: charge.id });
		expect(rest.amount).toBe(21000);
		expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ amount_refunded: 24000, refunded: true });
		expect(await stripe.refunds.create({ charge: charge.id }).catch((e: unknown) => e)).toMatchObject({
			code: 'charge_already_refunded'
		});

		// 24000 in, 20000 out, 5000 back, 24000 refunded: 24000 − 20000 + 5000 − 24000 = −15000.
		platform = balanceOf(await stripe.balance.retrieve(), 'gbp');
		expect(platform.available + platform.pending - start.available - start.pending).toBe(-15000);
		const refundedEvent = await control.waitForEvent(
			(e) => e.type === 'charge.refunded' && (e.data.object as unknown as Stripe.Charge).amount_refunded === 24000
		);
		expect(refundedEvent.data.previous_attributes).toEqual({ amount_refunded: 3000, refunded: false });
		expect((await stripe.transfers.list({ transfer_group: 'ord_money' })).data.map((t) => t.id)).toEqual([transfer.id]);
	});

	it('keeps charged funds pending until they are available; a transfer from the charge takes from pending', async () => {
		await control.setAvailabilityDelay(3600);
		try {
			const account = await onboardedAccount('pending@workroom.test');
			const start = balanceOf(await stripe.balance.retrieve(), 'jpy');
			const { charge } = await paidSession(50000, 'jpy', 'ord_jpy');
			let now = balanceOf(await stripe.balance.retrieve(), 'jpy');
			expect(now.pending - start.pending).toBe(50000);
			expect(now.available - start.available).toBe(0);
			// Without a source transaction, only available funds can be sent.
			expect(
				await stripe.transfers
					.create({ amount: 40000, currency: 'jpy', destination: account.id })
					.catch((e: unknown) => e)
			).toMatchObject({ statusCode: 400, code: 'balance_insufficient' });
			await stripe.transfers.create({
				amount: 40000,
				currency: 'jpy',
				destination: account.id,
				source_transaction: charge.id
			});
			now = balanceOf(await stripe.balance.retrieve(), 'jpy');
			expect(now.pending - start.pending).toBe(10000);
			await control.settle();
			now = balanceOf(await stripe.balance.retrieve(), 'jpy');
			expect(now.pending).toBe(0);
			expect(now.available - start.available - start.pending).toBe(10000);
		} finally {
			await control.setAvailabilityDelay(0);
		}
	});

	it('refuses a transfer to an account whose onboarding is not finished', async () => {
		const account = await stripe.accounts.create({ type: 'express', capabilities: { transfers: { requested: true } } });
		const { charge } = await paidSession(1000, 'usd', 'ord_x');
		expect(
			await stripe.transfers
				.create({ amount: 500, currency: 'usd', destination: account.id, source_transaction: charge.id })
				.catch((e: unknown) => e)
		).toMatchObject({ statusCode: 400, code: 'insufficient_capabilities_for_transfer', param: 'destination' });
	});
});

describe('idempotency', () => {
	it('replays the stored answer for the same key and body, and refuses the key with another body', async () => {
		const account = await onboardedAccount('idem@workroom.test');
		const { charge } = await paidSession(10000, 'gbp', 'ord_idem');
		const params = {
			amount: 9000,
			currency: 'gbp',
			destination: account.id,
			source_transaction: charge.id,
			transfer_group: 'ord_idem'
		};
		const first = await stripe.transfers.create(params, { idempotencyKey: 'release:ord_idem' });
		const again = await stripe.transfers.create(params, { idempotencyKey: 'release:ord_idem' });
		expect(again.id).toBe(first.id);
		expect(again.lastResponse.headers['idempotent-replayed']).toBe('true');
		expect(first.lastResponse.headers['idempotent-replayed']).toBeUndefined();
		expect((await stripe.transfers.list({ transfer_group: 'ord_idem' })).data).toHaveLength(1);

		const other = await stripe.transfers
			.create({ ...params, amount: 8000 }, { idempotencyKey: 'release:ord_idem' })
			.catch((e: unknown) => e);
		expect(other).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
		expect(other).toMatchObject({ statusCode: 400, type: 'StripeIdempotencyError' });
	});
});

describe('concurrency and reading back', () => {
	it('makes one transfer from twenty parallel requests with the same key', async () => {
		const account = await onboardedAccount('parallel@workroom.test');
		const { charge } = await paidSession(7000, 'gbp', 'ord_parallel');
		const params = {
			amount: 6000,
			currency: 'gbp',
			destination: account.id,
			source_transaction: charge.id,
			transfer_group: 'ord_parallel'
		};
		const results = await Promise.all(
			Array.from({ length: 20 }, () => stripe.transfers.create(params, { idempotencyKey: 'release:ord_parallel' }))
		);
		expect(new Set(results.map((t) => t.id)).size).toBe(1);
		expect((await stripe.transfers.list({ transfer_group: 'ord_parallel' })).data).toHaveLength(1);
		expect(balanceOf(await stripe.balance.retrieve({}, { stripeAccount: account.id }), 'gbp').available).toBe(6000);
	});

	it('pages lists, expands inside them and lists events by type', async () => {
		await paidSession(1100, 'eur', 'ord_list_a');
		await paidSession(1200, 'eur', 'ord_list_b');
		const page = await stripe.paymentIntents.list({ limit: 1, expand: ['data.latest_charge'] });
		expect(page).toMatchObject({ object: 'list', has_more: true, url: '/v1/payment_intents' });
		expect((page.data[0].latest_charge as Stripe.Charge).object).toBe('charge');
		expect(page.data[0].amount).toBe(1200);
		const next = await stripe.paymentIntents.list({ limit: 1, starting_after: page.data[0].id });
		expect(next.data[0].amount).toBe(1100);
		const events = await stripe.events.list({ type: 'checkout.session.completed', limit: 2 });
		expect(events.data.map((e) => (e.data.object as Stripe.Checkout.Session).metadata?.orderId)).toEqual([
			'ord_list_b',
			'ord_list_a'
		]);
	});
});

describe('webhooks', () => {
	it('signs each event so constructEvent verifies it, and the wrong secret does not', async () => {
		received.length = 0;
		const customer = await stripe.customers.create({ email: 'hook@example.test' });
		const account = await onboardedAccount('hook@workroom.test');
		expect(await control.idle()).toBe(true);
		const events = received.filter((r) => r.event).map((r) => r.event!);
		const updated = events.find((e) => e.type === 'account.updated');
		expect(updated).toMatchObject({
			object: 'event',
			api_version: expect.any(String),
			account: account.id,
			data: { object: { id: account.id, charges_enabled: true } }
		});
		expect(updated!.id).toMatch(/^evt_/);
		expect(received.every((r) => r.status === 200)).toBe(true);
		expect(customer.id).toMatch(/^cus_/);

		const [event] = await control.events('account.updated');
		const payload = JSON.stringify(event);
		const header = stripe.webhooks.generateTestHeaderString({ payload, secret });
		expect(stripe.webhooks.constructEvent(payload, header, secret).id).toBe(event.id);
		expect(() => stripe.webhooks.constructEvent(payload, header, newWebhookSecret())).toThrow(
			Stripe.errors.StripeSignatureVerificationError
		);
	});

	it('retries with back-off while the endpoint answers 500, then delivers', async () => {
		received.length = 0;
		failNext = 2;
		await paidSession(3000, 'gbp', 'ord_retry');
		expect(await control.idle()).toBe(true);
		const [completed] = (await control.events('checkout.session.completed')).filter(
			(e) => (e.data.object as unknown as Stripe.Checkout.Session).metadata?.orderId === 'ord_retry'
		);
		const deliveries = completed.deliveries;
		expect(received.filter((r) => r.status === 500)).toHaveLength(2);
		expect(received.some((r) => r.event?.id === completed.id)).toBe(true);
		const attempts = (await control.events()).flatMap((e) => e.deliveries).flatMap((d) => d.attempts);
		expect(attempts.filter((a) => a.status === 500)).toHaveLength(2);
		expect(deliveries.every((d) => d.state === 'delivered')).toBe(true);
		expect(completed.pending_webhooks).toBe(0);
	});

	it('drops or duplicates deliveries on demand, and resends an event', async () => {
		await control.setFaults({ duplicateWebhooks: 1 });
		received.length = 0;
		const account = await onboardedAccount('dup@workroom.test');
		expect(await control.idle()).toBe(true);
		const updated = received.filter((r) => r.event?.type === 'account.updated' && r.event.account === account.id);
		expect(updated).toHaveLength(2);
		expect(updated[0].event!.id).toBe(updated[1].event!.id);

		await control.setFaults({ dropWebhooks: 1 });
		received.length = 0;
		const dropped = await onboardedAccount('drop@workroom.test');
		expect(await control.idle()).toBe(true);
		expect(received).toHaveLength(0);
		const [event] = (await control.events('account.updated')).filter((e) => e.account === dropped.id);
		expect(event.deliveries.map((d) => d.state)).toEqual(['dropped']);
		await control.clearFaults();
		await control.resend(event.id);
		expect(await control.idle()).toBe(true);
		expect(received.map((r) => r.event?.id)).toEqual([event.id]);
	});
});

describe('faults', () => {
	it('answers every request with 500 at error rate 1, and the SDK with retries sees an API error', async () => {
		await control.setFaults({ errorRate: 1, paths: ['/v1/customers'] });
		const retrying = new Stripe(standin.secretKey, {
			host: '127.0.0.1',
			port: standin.port,
			protocol: 'http',
			maxNetworkRetries: 2
		});
		const error = await retrying.customers.create({ email: 'x@example.test' }).catch((e: unknown) => e);
		expect(error).toBeInstanceOf(Stripe.errors.StripeAPIError);
		expect(error).toMatchObject({ statusCode: 500 });
		// Other paths are untouched.
		expect((await stripe.balance.retrieve()).object).toBe('balance');
		await control.clearFaults();
		expect((await stripe.customers.create({ email: 'x@example.test' })).object).toBe('customer');
	});

	it('carries out a request that times out; the retry with the same key gets the same transfer', async () => {
		const account = await onboardedAccount('timeout@workroom.test');
		const { charge } = await paidSession(6000, 'gbp', 'ord_timeout');
		await control.setFaults({ timeoutRate: 1, paths: ['POST /v1/transfers'], hangMs: 2000 });
		const impatient = new Stripe(standin.secretKey, {
			host: '127.0.0.1',
			port: standin.port,
			protocol: 'http',
			maxNetworkRetries: 0,
			timeout: 300
		});
		const params = {
			amount: 5000,
			currency: 'gbp',
			destination: account.id,
			source_transaction: charge.id,
			transfer_group: 'ord_timeout'
		};
		const error = await impatient.transfers
			.create(params, { idempotencyKey: 'release:ord_timeout' })
			.catch((e: unknown) => e);
		expect(error).toBeInstanceOf(Stripe.errors.StripeConnectionError);
		await control.clearFaults();
		const retried = await stripe.transfers.create(params, { idempotencyKey: 'release:ord_timeout' });
		expect(retried.lastResponse.headers['idempotent-replayed']).toBe('true');
		expect((await stripe.transfers.list({ transfer_group: 'ord_timeout' })).data.map((t) => t.id)).toEqual([
			retried.id
		]);
	});

	it('adds latency when asked', async () => {
		await control.setFaults({ latencyMs: 200 });
		const started = Date.now();
		await stripe.balance.retrieve();
		expect(Date.now() - started).toBeGreaterThanOrEqual(190);
	});
});

describe('state that outlives a restart', () => {
	it('keeps objects, balances and idempotent answers in the state file', async () => {
		const dir = mkdtempSync(join(tmpdir(), 'tackline-stripe-'));
		const stateFile = join(dir, 'stripe.json');
		const open = (secretKey?: string) => startStripeStandin({ port: 0, stateFile, secretKey });
		try {
			const first = await open();
			const client = (s: StripeStandin) =>
				new Stripe(s.secretKey, { host: '127.0.0.1', port: s.port, protocol: 'http', maxNetworkRetries: 0 });
			const customer = await client(first).customers.create({ email: 'kept@example.test' }, { idempotencyKey: 'k1' });
			await first.stop();
			const second = await open(first.secretKey);
			try {
				expect((await client(second).customers.retrieve(customer.id)) as Stripe.Customer).toMatchObject({
					email: 'kept@example.test'
				});
				const again = await client(second).customers.create({ email: 'kept@example.test' }, { idempotencyKey: 'k1' });
				expect(again.id).toBe(customer.id);
				const later = await client(second).customers.create({ email: 'new@example.test' });
				expect((await client(second).customers.list()).data.map((c) => c.id)).toEqual([later.id, customer.id]);
			} finally {
				await second.stop();
			}
		} finally {
			rmSync(dir, { recursive: true, force: true });
		}
	});
});
