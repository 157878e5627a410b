import { and, inArray, isNotNull, lt, or, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { order } from '../db/schema';

/** What the books page shows of an order beside its money. */
export type OrderForBooks = {
	id: string;
	commissionId: string;
	status: string;
	currency: string;
	priceMinor: number;
	platformFeeMinor: number;
	advanceMinor: number;
	releaseRequestedAt: Date | null;
	refundRequestedAt: Date | null;
};

const booksColumns = {
	id: order.id,
	commissionId: order.commissionId,
	status: order.status,
	currency: order.currency,
	priceMinor: order.priceMinor,
	platformFeeMinor: order.platformFeeMinor,
	advanceMinor: order.advanceMinor,
	releaseRequestedAt: order.releaseRequestedAt,
	refundRequestedAt: order.refundRequestedAt
};

/** These orders, for the books; unknown ids are left out. */
export async function forBooks(db: Executor, ids: string[]): Promise<OrderForBooks[]> {
	if (ids.length === 0) return [];
	return db.select(booksColumns).from(order).where(inArray(order.id, ids));
}

/**
 * Of these orders, those whose release or refund was asked for before `before`, oldest request first. The caller
 * passes the orders that still hold money, so what comes back is money that should have moved and has not.
 */
export async function moneyRequestedBefore(
	db: Executor,
	{ ids, before }: { ids: string[]; before: Date }
): Promise<OrderForBooks[]> {
	if (ids.length === 0) return [];
	return db
		.select(booksColumns)
		.from(order)
		.where(
			and(
				inArray(order.id, ids),
				or(
					and(isNotNull(order.releaseRequestedAt), lt(order.releaseRequestedAt, before)),
					and(isNotNull(order.refundRequestedAt), lt(order.refundRequestedAt, before))
				)
			)
		)
		.orderBy(sql`least(${order.releaseRequestedAt}, ${order.refundRequestedAt})`);
}
