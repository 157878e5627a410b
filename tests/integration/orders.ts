/**
 * Orders that have really been paid, for the lifecycle tests: a customer and a tailor whose payouts account was
 * onboarded through the Stripe stand-in, an accepted quote, and the customer's card payment on the hosted page
 * with the signed webhook funding the order. Plus reads of the stand-in's balances and transfers.
 */
import { and, eq } from 'drizzle-orm';
import type { Pool } from 'pg';
import PgBoss from 'pg-boss';
import Stripe from 'stripe';
import { expect } from 'vitest';
import type { Executor } from '../../src/lib/server/db/client';
import { ledgerEntry, order, payment, tailorProfile, type PaymentKind } from '../../src/lib/server/db/schema';
import { TEST_CARDS } from '../../docker/standins/stripe-controller';
import { createCommission, createUser, createWorkroom, type Person } from '../factories';
import { awardQuote, insertQuote } from '../factories/quotes';
import { callJson, signedIn, type Client, type JsonBody } from './http';
import { stripeControl, stripeStandin } from './stripe';

export function sdk() {
	const env = stripeStandin().env;
	return new Stripe(env.STRIPE_SECRET_KEY, {
		host: env.STRIPE_API_HOST,
		port: Number(env.STRIPE_API_PORT),
		protocol: 'http',
		maxNetworkRetries: 0
	});
}

export async function until<T>(read: () => Promise<T>, done: (value: T) => boolean, timeoutMs = 15_000): Promise<T> {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const value = await read();
		if (done(value) || Date.now() > deadline) return value;
		await new Promise((resolve) => setTimeout(resolve, 100));
	}
}

/** A tailor whose payouts account exists at the stand-in and has finished onboarding (transfers active). */
export async function payableTailor(db: Executor): Promise<{ person: Person; client: Client; accountId: string }> {
	const person = await createWorkroom(db);
	await db.update(tailorProfile).set({ payoutStatus: 'not_connected' }).where(eq(tailorProfile.userId, person.id));
	const client = await signedIn(person);
	const setUp = await client.post('/workroom/payouts?/setUp');
	expect(setUp.status).toBe(303);
	const onboarded = await stripeControl().onboard(setUp.headers.get('location')!, { name: person.name });
	expect(onboarded.status).toBe(303);
	const profile = await until(
		async () =>
			(
				await db
					.select({ status: tailorProfile.payoutStatus, accountId: tailorProfile.payoutAccountId })
					.from(tailorProfile)
					.where(eq(tailorProfile.userId, person.id))
			)[0],
		(row) => row.status === 'enabled' && row.accountId !== null
	);
	expect(profile.status).toBe('enabled');
	return { person, client, accountId: profile.accountId! };
}

export type PaidOrder = {
	orderId: string;
	commissionId: string;
	quoteId: string;
	priceMinor: number;
	feeMinor: number;
	payoutMinor: number;
	advanceMinor: number;
	customer: Person;
	customerClient: Client;
	tailor: Person;
	tailorClient: Client;
	accountId: string;
};

/** An order accepted and awaiting payment, with both sides signed in (no payment yet). */
export async function unpaidOrder(
	db: Executor,
	{ priceMinor = 52_000, advanceMinor = 0 }: { priceMinor?: number; advanceMinor?: number } = {}
): Promise<PaidOrder> {
	const customer = await createUser(db, { name: 'Ottilie Penhallow' });
	const tailor = await payableTailor(db);
	const made = await createCommission(db, { customerId: customer.id, status: 'open', title: 'Linen summer suit' });
	const q = await insertQuote(db, { commissionId: made.id, tailorId: tailor.person.id, priceMinor });
	const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
	if (advanceMinor) await db.update(order).set({ advanceMinor }).where(eq(order.id, orderId));
	const [row] = await db
		.select({ fee: order.platformFeeMinor, payout: order.tailorPayoutMinor })
		.from(order)
		.where(eq(order.id, orderId));
	return {
		orderId,
		commissionId: made.id,
		quoteId: q.id,
		priceMinor,
		feeMinor: row.fee,
		payoutMinor: row.payout,
		advanceMinor,
		customer,
		customerClient: await signedIn(customer),
		tailor: tailor.person,
		tailorClient: tailor.client,
		accountId: tailor.accountId
	};
}

/** Pays an unpaid order on the hosted page with the working test card and waits for the webhook to fund it. */
export async function pay(db: Executor, o: PaidOrder) {
	const started = await callJson(o.customerClient, 'POST', `/api/v1/orders/${o.orderId}/checkout`);
	expect(started.status, JSON.stringify(started.body)).toBe(201);
	const paid = await stripeControl().pay(started.body.url as string, TEST_CARDS.success);
	expect(paid.status).toBe(303);
	expect(
		await until(
			() => statusOf(db, o.orderId),
			(s) => s === 'funded'
		)
	).toBe('funded');
}

export async function paidOrder(db: Executor, options: { priceMinor?: number; advanceMinor?: number } = {}) {
	const o = await unpaidOrder(db, options);
	await pay(db, o);
	return o;
}

export const statusOf = async (db: Executor, orderId: string) =>
	(await db.select({ status: order.status }).from(order).where(eq(order.id, orderId)))[0].status;

export async function view(client: Client, orderId: string): Promise<JsonBody> {
	const answer = await callJson(client, 'GET', `/api/v1/orders/${orderId}`);
	expect(answer.status).toBe(200);
	return answer.body;
}

/** Waits until the order's view satisfies `done` (the money jobs run in the server). */
export function viewUntil(client: Client, orderId: string, done: (v: JsonBody) => boolean, timeoutMs = 20_000) {
	return until(() => view(client, orderId), done, timeoutMs);
}

/** Posts a step, delivers by pickup: the order is `delivered`. */
export async function deliver(o: PaidOrder) {
	const step = await callJson(o.tailorClient, 'POST', `/api/v1/orders/${o.orderId}/progress`, {
		step: 'sewing',
		note: 'Seams pressed and overlocked.'
	});
	expect(step.status).toBe(201);
	const delivered = await callJson(o.tailorClient, 'POST', `/api/v1/orders/${o.orderId}/deliver`, {
		method: 'pickup'
	});
	expect(delivered.status, JSON.stringify(delivered.body)).toBe(200);
	return delivered.body;
}

/** What the stand-in holds for the platform in `currency` (available and pending), in minor units. */
export async function platformBalance(currency = 'eur') {
	const balance = await sdk().balance.retrieve();
	const sum = (list: Stripe.Balance.Available[]) =>
		list.filter((b) => b.currency === currency).reduce((total, b) => total + b.amount, 0);
	return sum(balance.available) + sum(balance.pending);
}

/** What a connected account holds in `currency` (available and pending). */
export async function accountBalance(accountId: string, currency = 'eur') {
	const balance = await sdk().balance.retrieve({}, { stripeAccount: accountId });
	const sum = (list: Stripe.Balance.Available[]) =>
		list.filter((b) => b.currency === currency).reduce((total, b) => total + b.amount, 0);
	return sum(balance.available) + sum(balance.pending);
}

/** The stand-in's transfers for the order (its transfer group). */
export async function transfersOf(orderId: string) {
	return (await sdk().transfers.list({ transfer_group: orderId, limit: 100 })).data;
}

export async function paymentsOf(db: Executor, orderId: string, kind: PaymentKind) {
	return db
		.select({ processorId: payment.processorId, amountMinor: payment.amountMinor, key: payment.idempotencyKey })
		.from(payment)
		.where(and(eq(payment.orderId, orderId), eq(payment.kind, kind)));
}

/** Every ledger transaction of the order sums to zero; returns the order's entries. */
export async function balancedLedger(db: Executor, orderId: string) {
	const entries = await db
		.select({ transactionId: ledgerEntry.transactionId, amountMinor: ledgerEntry.amountMinor })
		.from(ledgerEntry)
		.where(eq(ledgerEntry.orderId, orderId));
	const sums = new Map<string, number>();
	for (const e of entries) sums.set(e.transactionId, (sums.get(e.transactionId) ?? 0) + e.amountMinor);
	for (const sum of sums.values()) expect(sum).toBe(0);
	return entries;
}

/** held + advanced + released + refunded + fee = charged, for the view's money. */
export function moneyAddsUp(money: JsonBody) {
	expect(
		money.heldMinor + money.advancedMinor + money.releasedMinor + money.refundedMinor + money.feeMinor,
		JSON.stringify(money)
	).toBe(money.chargedMinor);
}

/** Runs a queue's job now (as its cron would), through pg-boss like the app's own sends. */
export async function runJobNow(pool: Pool, name: string) {
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL });
	await boss.send(name, {}, { db: { executeSql: (text, values) => pool.query(text, values) } });
}
