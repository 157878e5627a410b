import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { createCommission, createUser, createWorkroom } from '../../../../tests/factories';
import { awardQuote, insertQuote } from '../../../../tests/factories/quotes';
import { createDb } from '../db/client';
import { ledgerEntry, order } from '../db/schema';
import { reconcile, stuckMoney, totalsByCurrency, unbalancedOrders, unbalancedTransactions } from './escrow';
import { moneyOf, post, recordPayment } from './ledger';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 3 });
afterAll(() => pool.end());

/** Postgres' own words, wherever drizzle wrapped them. */
function causeOf(error: unknown): string {
	const parts: string[] = [];
	for (let e: unknown = error; e && typeof e === 'object'; e = (e as { cause?: unknown }).cause)
		parts.push(String((e as { message?: unknown }).message));
	return parts.join(' | ');
}

/** An accepted quote's order, awaiting payment. */
async function newOrder(priceMinor = 50_000) {
	const customer = await createUser(db);
	const tailor = await createWorkroom(db);
	const { id } = await createCommission(db, { customerId: customer.id, status: 'open' });
	const q = await insertQuote(db, { commissionId: id, tailorId: tailor.id, priceMinor });
	const { orderId } = await awardQuote(db, { commissionId: id, quoteId: q.id, customerId: customer.id });
	return orderId;
}

/** The customer's payment, as the webhook records it: a charge row and customer_payments → escrow. */
async function fund(orderId: string, amountMinor: number, currency = 'EUR') {
	await db.transaction(async (tx) => {
		const paymentId = await recordPayment(tx, {
			orderId,
			kind: 'charge',
			processorId: `ch_test_${randomUUID()}`,
			amountMinor,
			currency,
			status: 'succeeded',
			idempotencyKey: `charge:${orderId}`
		});
		await post(tx, {
			orderId,
			currency,
			kind: 'charge',
			idempotencyKey: `charge:${orderId}`,
			paymentId,
			postings: [
				{ account: 'customer_payments', amountMinor: -amountMinor },
				{ account: 'escrow', amountMinor }
			]
		});
	});
}

/** A release as the lifecycle posts it: a transfer to the tailor and the fee kept, both out of escrow. */
async function release(orderId: string, payoutMinor: number, feeMinor: number, currency = 'EUR') {
	await db.transaction(async (tx) => {
		const paymentId = await recordPayment(tx, {
			orderId,
			kind: 'release_transfer',
			processorId: `tr_test_${randomUUID()}`,
			amountMinor: payoutMinor,
			currency,
			status: 'succeeded',
			idempotencyKey: `release:${orderId}`
		});
		await post(tx, {
			orderId,
			currency,
			kind: 'release',
			idempotencyKey: `release:${orderId}`,
			paymentId,
			postings: [
				{ account: 'escrow', amountMinor: -(payoutMinor + feeMinor) },
				{ account: 'tailor_payouts', amountMinor: payoutMinor },
				{ account: 'platform_fees', amountMinor: feeMinor }
			]
		});
	});
}

describe('the database keeps the ledger honest', () => {
	it('refuses a transaction whose entries do not sum to zero, and keeps none of it', async () => {
		const orderId = await newOrder();
		const transactionId = randomUUID();
		const key = `test-unbalanced:${transactionId}`;
		const attempt = db.transaction(async (tx) => {
			await tx.insert(ledgerEntry).values([
				{
					transactionId,
					orderId,
					account: 'customer_payments',
					amountMinor: -10_000,
					currency: 'EUR',
					kind: 'charge',
					idempotencyKey: key
				},
				{
					transactionId,
					orderId,
					account: 'escrow',
					amountMinor: 9_999,
					currency: 'EUR',
					kind: 'charge',
					idempotencyKey: key
				}
			]);
		});
		await expect(attempt).rejects.toSatisfy((e: unknown) => /does not sum to zero/.test(causeOf(e)));
		expect(await db.select().from(ledgerEntry).where(eq(ledgerEntry.transactionId, transactionId))).toEqual([]);
	});

	it('refuses to change or delete an entry', async () => {
		const orderId = await newOrder();
		await fund(orderId, 20_000);
		const [entry] = await db.select().from(ledgerEntry).where(eq(ledgerEntry.orderId, orderId)).limit(1);
		await expect(
			db
				.update(ledgerEntry)
				.set({ amountMinor: entry.amountMinor + 1 })
				.where(eq(ledgerEntry.id, entry.id))
		).rejects.toSatisfy((e: unknown) => /append-only/.test(causeOf(e)));
		await expect(db.delete(ledgerEntry).where(eq(ledgerEntry.id, entry.id))).rejects.toSatisfy((e: unknown) =>
			/append-only/.test(causeOf(e))
		);
		const [after] = await db.select().from(ledgerEntry).where(eq(ledgerEntry.id, entry.id));
		expect(after.amountMinor).toBe(entry.amountMinor);
	});

	it('refuses a balanced transaction that pays out more than the order holds', async () => {
		const orderId = await newOrder();
		await fund(orderId, 30_000);
		const attempt = post(db, {
			orderId,
			currency: 'EUR',
			kind: 'release',
			idempotencyKey: `test-overdraw:${orderId}`,
			postings: [
				{ account: 'escrow', amountMinor: -30_001 },
				{ account: 'tailor_payouts', amountMinor: 30_001 }
			]
		});
		await expect(attempt).rejects.toSatisfy((e: unknown) => /would hold -1 in escrow/.test(causeOf(e)));
		expect((await moneyOf(db, orderId)).heldMinor).toBe(30_000);
	});

	it('refuses a transaction that pays one order’s tailor out of another order’s escrow, though it sums to zero', async () => {
		const [from, to] = [await newOrder(), await newOrder()];
		await fund(to, 10_000);
		const transactionId = randomUUID();
		const key = `test-cross:${transactionId}`;
		const entry = (orderId: string, account: 'escrow' | 'tailor_payouts', amountMinor: number) => ({
			transactionId,
			orderId,
			account,
			amountMinor,
			currency: 'EUR',
			kind: 'release',
			idempotencyKey: key
		});
		const attempt = db.transaction(async (tx) => {
			await tx.insert(ledgerEntry).values([entry(from, 'escrow', -5_000), entry(to, 'tailor_payouts', 5_000)]);
		});
		await expect(attempt).rejects.toSatisfy((e: unknown) => /in escrow/.test(causeOf(e)));
		expect(await db.select().from(ledgerEntry).where(eq(ledgerEntry.transactionId, transactionId))).toEqual([]);
	});

	it('checks escrow at commit, so a transaction may dip below zero on its way', async () => {
		const orderId = await newOrder();
		await db.transaction(async (tx) => {
			// Paid out before the money is in: escrow is -5 000 in between, 0 at commit.
			await post(tx, {
				orderId,
				currency: 'EUR',
				kind: 'release',
				idempotencyKey: `test-dip-out:${orderId}`,
				postings: [
					{ account: 'escrow', amountMinor: -5_000 },
					{ account: 'tailor_payouts', amountMinor: 5_000 }
				]
			});
			await post(tx, {
				orderId,
				currency: 'EUR',
				kind: 'charge',
				idempotencyKey: `test-dip-in:${orderId}`,
				postings: [
					{ account: 'customer_payments', amountMinor: -5_000 },
					{ account: 'escrow', amountMinor: 5_000 }
				]
			});
		});
		expect(await moneyOf(db, orderId)).toMatchObject({ chargedMinor: 5_000, heldMinor: 0, releasedMinor: 5_000 });
		expect(await unbalancedTransactions(db)).toEqual([]);
	});
});

describe('escrow totals and reconciliation', () => {
	it('adds every order’s money up per currency', async () => {
		const before = new Map((await totalsByCurrency(db)).map((t) => [t.currency, t]));
		const orderId = await newOrder(40_000);
		await fund(orderId, 40_000);
		await release(orderId, 36_000, 4_000);
		const other = await newOrder(25_000);
		await fund(other, 25_000, 'SEK');
		const after = new Map((await totalsByCurrency(db)).map((t) => [t.currency, t]));
		const delta = (currency: string, key: 'chargedMinor' | 'heldMinor' | 'releasedMinor' | 'feesMinor') =>
			(after.get(currency)?.[key] ?? 0) - (before.get(currency)?.[key] ?? 0);
		expect([
			delta('EUR', 'chargedMinor'),
			delta('EUR', 'heldMinor'),
			delta('EUR', 'releasedMinor'),
			delta('EUR', 'feesMinor')
		]).toEqual([40_000, 0, 36_000, 4_000]);
		expect([delta('SEK', 'chargedMinor'), delta('SEK', 'heldMinor')]).toEqual([25_000, 25_000]);
		for (const t of after.values())
			expect(t.chargedMinor).toBe(t.heldMinor + t.releasedMinor + t.refundedMinor + t.feesMinor);
	});

	it('reports no difference when the processor holds escrow plus fees, and the amount when it does not', async () => {
		const totals = await totalsByCurrency(db);
		const exact = new Map(totals.map((t) => [t.currency, t.heldMinor + t.feesMinor]));
		const agreed = await reconcile(db, { readBalance: () => Promise.resolve(exact) });
		expect(agreed.processorAvailable).toBe(true);
		expect(agreed.currencies.length).toBeGreaterThan(0);
		for (const c of agreed.currencies) expect(c.difference).toBe(0);

		const eur = exact.get('EUR') ?? 0;
		const off = await reconcile(db, {
			readBalance: () => Promise.resolve(new Map([...exact, ['EUR', eur - 1_250], ['NOK', 700]]))
		});
		expect(off.currencies.find((c) => c.currency === 'EUR')).toMatchObject({
			processorBalanceMinor: eur - 1_250,
			difference: -1_250
		});
		// Money at the processor in a currency the ledger never saw is a difference of its own.
		expect(off.currencies.find((c) => c.currency === 'NOK')).toMatchObject({
			heldMinor: 0,
			feesMinor: 0,
			processorBalanceMinor: 700,
			difference: 700
		});
		// A currency the ledger has and the processor lacks reconciles against zero.
		const missing = await reconcile(db, { readBalance: () => Promise.resolve(new Map<string, number>()) });
		for (const c of missing.currencies) expect(c.difference).toBe(-(c.heldMinor + c.feesMinor));
	});

	it('keeps the totals when the processor is away, with the balance unknown', async () => {
		const outage = Object.assign(new Error('connect ECONNREFUSED'), { type: 'StripeConnectionError' });
		const result = await reconcile(db, {
			readBalance: () => Promise.reject(outage)
		});
		expect(result.processorAvailable).toBe(false);
		expect(result.processorError).toMatch(/ECONNREFUSED/);
		expect(result.currencies.length).toBeGreaterThan(0);
		for (const c of result.currencies) {
			expect(c.processorBalanceMinor).toBeNull();
			expect(c.difference).toBeNull();
			expect(c.chargedMinor).toBe(c.heldMinor + c.releasedMinor + c.refundedMinor + c.feesMinor);
		}
		await expect(reconcile(db, { readBalance: () => Promise.reject(new Error('a bug')) })).rejects.toThrow('a bug');
	});
});

describe('each order’s own books', () => {
	it('lists an order whose money sits on another account, and a payment the ledger never recorded', async () => {
		const parked = await newOrder();
		await fund(parked, 10_000);
		await post(db, {
			orderId: parked,
			currency: 'EUR',
			kind: 'release',
			idempotencyKey: `test-parked:${parked}`,
			postings: [
				{ account: 'escrow', amountMinor: -9_000 },
				{ account: 'tailor_payable', amountMinor: 9_000 }
			]
		});
		const unrecorded = await newOrder();
		await fund(unrecorded, 10_000);
		await recordPayment(db, {
			orderId: unrecorded,
			kind: 'release_transfer',
			processorId: `tr_test_${randomUUID()}`,
			amountMinor: 9_000,
			currency: 'EUR',
			status: 'succeeded',
			idempotencyKey: `release:${unrecorded}`
		});
		const fine = await newOrder();
		await fund(fine, 10_000);
		await release(fine, 9_000, 1_000);

		const { orders, total } = await unbalancedOrders(db, { orderIds: [parked, unrecorded, fine] });
		expect(total).toBe(2);
		const parkedBooks = orders.find((o) => o.orderId === parked);
		expect(parkedBooks?.problems).toEqual([{ kind: 'does_not_add_up', otherMinor: 9_000 }]);
		expect(parkedBooks?.order?.status).toBe('awaiting_payment');
		const unrecordedBooks = orders.find((o) => o.orderId === unrecorded);
		expect(unrecordedBooks?.problems).toEqual([
			expect.objectContaining({ kind: 'payment_without_entries', paymentKind: 'release_transfer', amountMinor: 9_000 })
		]);
		expect(orders.some((o) => o.orderId === fine)).toBe(false);
	});

	it('pages through the whole list', async () => {
		const all = await unbalancedOrders(db, { limit: 1000 });
		const first = await unbalancedOrders(db, { limit: 1 });
		const second = await unbalancedOrders(db, { limit: 1, offset: 1 });
		expect(first.total).toBe(all.total);
		expect(first.orders.map((o) => o.orderId)).toEqual(all.orders.slice(0, 1).map((o) => o.orderId));
		expect(second.orders.map((o) => o.orderId)).toEqual(all.orders.slice(1, 2).map((o) => o.orderId));
	});
});

describe('money waiting to move', () => {
	it('lists releases and refunds asked for over an hour ago whose money is still in escrow', async () => {
		const now = new Date();
		const hoursAgo = (h: number) => new Date(now.getTime() - h * 3_600_000);
		const waiting = await newOrder();
		await fund(waiting, 10_000);
		await db
			.update(order)
			.set({ releaseRequestedAt: hoursAgo(2) })
			.where(eq(order.id, waiting));
		const recent = await newOrder();
		await fund(recent, 10_000);
		await db
			.update(order)
			.set({ releaseRequestedAt: hoursAgo(0.25) })
			.where(eq(order.id, recent));
		const done = await newOrder();
		await fund(done, 10_000);
		await release(done, 9_000, 1_000);
		await db
			.update(order)
			.set({ releaseRequestedAt: hoursAgo(3) })
			.where(eq(order.id, done));
		const refund = await newOrder();
		await fund(refund, 8_000);
		await db
			.update(order)
			.set({ refundRequestedAt: hoursAgo(5) })
			.where(eq(order.id, refund));

		const stuck = await stuckMoney(db, { now });
		const ours = stuck.filter((s) => [waiting, recent, done, refund].includes(s.id));
		expect(ours.map((s) => [s.id, s.waiting, s.heldMinor])).toEqual([
			[refund, 'refund', 8_000],
			[waiting, 'release', 10_000]
		]);
	});
});
