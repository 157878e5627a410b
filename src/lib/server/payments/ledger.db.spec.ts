import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCommission, createUser, createWorkroom } from '../../../../tests/factories';
import { awardQuote, insertQuote } from '../../../../tests/factories/quotes';
import { createDb } from '../db/client';
import { ledgerEntry } from '../db/schema';
import { moneyOf, post, recordPayment } from './ledger';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

let orderId: string;
beforeAll(async () => {
	const customer = await createUser(db);
	const tailor = await createWorkroom(db);
	const { id } = await createCommission(db, { customerId: customer.id, status: 'open' });
	const q = await insertQuote(db, { commissionId: id, tailorId: tailor.id, priceMinor: 50_000 });
	({ orderId } = await awardQuote(db, { commissionId: id, quoteId: q.id, customerId: customer.id }));
});

/** Postgres' own words, wherever drizzle wrapped them. */
function causeOf(error: unknown): string {
	const parts: string[] = [];
	for (let e: unknown = error; e && typeof e === 'object'; e = (e as { cause?: unknown }).cause)
		parts.push(String((e as { message?: unknown }).message));
	return parts.join(' | ');
}

const entry = (transactionId: string, account: 'escrow' | 'customer_payments', amountMinor: number, key: string) => ({
	transactionId,
	orderId,
	account,
	amountMinor,
	currency: 'EUR',
	kind: 'charge',
	idempotencyKey: key
});

describe('the ledger in the database', () => {
	it('refuses, at commit, a transaction whose entries do not sum to zero', async () => {
		const tx = randomUUID();
		const attempt = db.transaction(async (t) => {
			await t.insert(ledgerEntry).values(entry(tx, 'customer_payments', -50_000, `test-unbalanced:${tx}`));
			await t.insert(ledgerEntry).values(entry(tx, 'escrow', 49_999, `test-unbalanced:${tx}`));
		});
		await expect(attempt).rejects.toSatisfy((e: unknown) => /does not sum to zero/.test(causeOf(e)));
		expect(await db.select().from(ledgerEntry).where(eq(ledgerEntry.transactionId, tx))).toHaveLength(0);
	});

	it('accepts entries inserted one by one that balance by the end of the transaction', async () => {
		const tx = randomUUID();
		await db.transaction(async (t) => {
			await t.insert(ledgerEntry).values(entry(tx, 'customer_payments', -1_000, `test-balanced:${tx}`));
			await t.insert(ledgerEntry).values(entry(tx, 'escrow', 1_000, `test-balanced:${tx}`));
		});
		expect(await db.select().from(ledgerEntry).where(eq(ledgerEntry.transactionId, tx))).toHaveLength(2);
	});

	it('keeps entries append-only', async () => {
		const [row] = await db
			.select({ id: ledgerEntry.id })
			.from(ledgerEntry)
			.where(eq(ledgerEntry.orderId, orderId))
			.limit(1);
		const update = db.update(ledgerEntry).set({ amountMinor: 7 }).where(eq(ledgerEntry.id, row.id));
		await expect(update).rejects.toSatisfy((e: unknown) => /append-only/.test(causeOf(e)));
		const remove = db.delete(ledgerEntry).where(eq(ledgerEntry.id, row.id));
		await expect(remove).rejects.toSatisfy((e: unknown) => /append-only/.test(causeOf(e)));
	});

	it('refuses an unbalanced posting before it reaches the database', async () => {
		await expect(
			post(db, {
				orderId,
				currency: 'EUR',
				kind: 'charge',
				idempotencyKey: 'test-code-check',
				postings: [
					{ account: 'customer_payments', amountMinor: -10 },
					{ account: 'escrow', amountMinor: 9 }
				]
			})
		).rejects.toThrow(/does not sum to zero/);
	});

	it('reads an order’s money by account and by the transfer that carried it', async () => {
		// A fresh order's worth of movements, written as the payment flows will: charge, advance, release, fee.
		const customer = await createUser(db);
		const tailor = await createWorkroom(db);
		const { id } = await createCommission(db, { customerId: customer.id, status: 'open' });
		const q = await insertQuote(db, { commissionId: id, tailorId: tailor.id, priceMinor: 40_000 });
		const { orderId: o } = await awardQuote(db, { commissionId: id, quoteId: q.id, customerId: customer.id });
		await db.transaction(async (t) => {
			const charge = await recordPayment(t, {
				orderId: o,
				kind: 'charge',
				processorId: `ch_test_${o}`,
				amountMinor: 40_000,
				currency: 'EUR',
				status: 'succeeded',
				idempotencyKey: `charge:${o}`
			});
			await post(t, {
				orderId: o,
				currency: 'EUR',
				kind: 'charge',
				idempotencyKey: `charge:${o}`,
				paymentId: charge,
				postings: [
					{ account: 'customer_payments', amountMinor: -40_000 },
					{ account: 'escrow', amountMinor: 40_000 }
				]
			});
			const advance = await recordPayment(t, {
				orderId: o,
				kind: 'advance_transfer',
				processorId: `tr_test_adv_${o}`,
				amountMinor: 9_000,
				currency: 'EUR',
				status: 'succeeded',
				idempotencyKey: `advance:${o}`
			});
			await post(t, {
				orderId: o,
				currency: 'EUR',
				kind: 'transfer',
				idempotencyKey: `advance:${o}`,
				paymentId: advance,
				postings: [
					{ account: 'escrow', amountMinor: -9_000 },
					{ account: 'tailor_payouts', amountMinor: 9_000 }
				]
			});
		});
		expect(await moneyOf(db, o)).toEqual({
			chargedMinor: 40_000,
			heldMinor: 31_000,
			advancedMinor: 9_000,
			releasedMinor: 0,
			refundedMinor: 0,
			feeMinor: 0
		});
		// A second record of the same processor object changes nothing.
		expect(
			await recordPayment(db, {
				orderId: o,
				kind: 'charge',
				processorId: `ch_test_${o}`,
				amountMinor: 40_000,
				currency: 'EUR',
				status: 'succeeded',
				idempotencyKey: `charge:${o}`
			})
		).toBeNull();
	});
});
