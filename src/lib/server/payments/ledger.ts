import { randomUUID } from 'node:crypto';
import { and, desc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { ledgerEntry, payment, type LedgerAccount, type PaymentKind } from '../db/schema';

export type Posting = { account: LedgerAccount; amountMinor: number };

/**
 * Posts one ledger transaction: its entries share a transaction id and the business action's idempotency key,
 * and must sum to zero (checked here, and by the database's deferred trigger at commit).
 */
export async function post(
	tx: Executor,
	{
		orderId,
		currency,
		kind,
		idempotencyKey,
		paymentId = null,
		postings
	}: {
		orderId: string;
		currency: string;
		kind: string;
		idempotencyKey: string;
		paymentId?: string | null;
		postings: Posting[];
	}
) {
	const total = postings.reduce((sum, p) => sum + p.amountMinor, 0);
	if (total !== 0) throw new Error(`Ledger transaction ${idempotencyKey} does not sum to zero (${total})`);
	const transactionId = randomUUID();
	await tx.insert(ledgerEntry).values(
		postings.map((p) => ({
			transactionId,
			orderId,
			account: p.account,
			amountMinor: p.amountMinor,
			currency,
			kind,
			idempotencyKey,
			paymentId
		}))
	);
	return transactionId;
}

/** An order's money as the ledger has it, in minor units of its currency. */
export type OrderMoney = {
	chargedMinor: number;
	heldMinor: number;
	advancedMinor: number;
	releasedMinor: number;
	refundedMinor: number;
	feeMinor: number;
};

/**
 * Charged is what entered from the customer, held what escrow holds, refunded what went back, fee what the
 * platform kept; what reached the tailor splits by the transfer that carried it: an advance, or a release.
 */
export async function moneyOf(db: Executor, orderId: string): Promise<OrderMoney> {
	const rows = await db
		.select({
			account: ledgerEntry.account,
			kind: payment.kind,
			total: sql<string>`sum(${ledgerEntry.amountMinor})`
		})
		.from(ledgerEntry)
		.leftJoin(payment, eq(payment.id, ledgerEntry.paymentId))
		.where(eq(ledgerEntry.orderId, orderId))
		.groupBy(ledgerEntry.account, payment.kind);
	const money: OrderMoney = {
		chargedMinor: 0,
		heldMinor: 0,
		advancedMinor: 0,
		releasedMinor: 0,
		refundedMinor: 0,
		feeMinor: 0
	};
	for (const row of rows) {
		const amount = Number(row.total);
		if (row.account === 'customer_payments') money.chargedMinor -= amount;
		else if (row.account === 'escrow') money.heldMinor += amount;
		else if (row.account === 'customer_refunds') money.refundedMinor += amount;
		else if (row.account === 'platform_fees') money.feeMinor += amount;
		else if (row.account === 'tailor_payouts') {
			// A reversal takes back an advance (the only transfer reversed before disputes exist).
			if (row.kind === 'advance_transfer' || row.kind === 'reversal') money.advancedMinor += amount;
			else money.releasedMinor += amount;
		}
	}
	return money;
}

/** The processor id of the order's charge (`charge:<order>`), once one has been taken. */
export async function chargeOf(db: Executor, orderId: string): Promise<string | null> {
	return (await paymentByKey(db, `charge:${orderId}`))?.processorId ?? null;
}

/** Records a processor object for an order; a second record under the same key or id changes nothing. */
export async function recordPayment(
	tx: Executor,
	values: {
		orderId: string;
		kind: PaymentKind;
		processorId: string;
		amountMinor: number;
		currency: string;
		status: 'pending' | 'succeeded' | 'failed';
		idempotencyKey: string;
		failureReason?: string | null;
	}
): Promise<string | null> {
	const [row] = await tx
		.insert(payment)
		.values({ ...values, failureReason: values.failureReason ?? null })
		.onConflictDoNothing()
		.returning({ id: payment.id });
	return row?.id ?? null;
}

/** Why the customer's latest card attempt on the order failed, when the latest attempt did fail. */
export async function lastFailure(db: Executor, orderId: string): Promise<{ message: string; at: Date } | null> {
	const [row] = await db
		.select({ status: payment.status, message: payment.failureReason, at: payment.createdAt })
		.from(payment)
		.where(and(eq(payment.orderId, orderId), eq(payment.kind, 'charge')))
		.orderBy(desc(payment.createdAt))
		.limit(1);
	if (!row || row.status !== 'failed') return null;
	return { message: row.message ?? 'The card was declined.', at: row.at };
}

/** The processor object recorded under a business action's key, or null when none is yet. */
export async function paymentByKey(db: Executor, idempotencyKey: string) {
	const [row] = await db
		.select({
			id: payment.id,
			processorId: payment.processorId,
			amountMinor: payment.amountMinor,
			status: payment.status
		})
		.from(payment)
		.where(eq(payment.idempotencyKey, idempotencyKey))
		.limit(1);
	return row ?? null;
}

/** Whether a ledger transaction was posted under this key. */
export async function posted(db: Executor, idempotencyKey: string): Promise<boolean> {
	const [row] = await db
		.select({ id: ledgerEntry.id })
		.from(ledgerEntry)
		.where(eq(ledgerEntry.idempotencyKey, idempotencyKey))
		.limit(1);
	return Boolean(row);
}
