import { asc, eq } from 'drizzle-orm';
import type { PaymentHistoryItem } from '$lib/types/order-page';
import type { Executor } from '../db';
import { payment } from '../db/schema';

/**
 * Every processor object of an order — charges (failed attempts included), transfers, refunds, reversals —
 * oldest first, without the processor's ids or idempotency keys. Callers decide who may see it.
 */
export async function paymentHistory(db: Executor, orderId: string): Promise<PaymentHistoryItem[]> {
	const rows = await db
		.select({
			id: payment.id,
			kind: payment.kind,
			amountMinor: payment.amountMinor,
			currency: payment.currency,
			status: payment.status,
			failureReason: payment.failureReason,
			at: payment.createdAt
		})
		.from(payment)
		.where(eq(payment.orderId, orderId))
		.orderBy(asc(payment.createdAt), asc(payment.id))
		.limit(200);
	return rows.map((row) => ({ ...row, at: row.at.toISOString() }));
}
