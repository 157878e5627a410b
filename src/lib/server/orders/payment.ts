import { and, eq } from 'drizzle-orm';
import type { Executor } from '../db';
import { order, type Order } from '../db/schema';

/** The columns paying for an order needs. */
const payColumns = {
	id: order.id,
	commissionId: order.commissionId,
	customerId: order.customerId,
	tailorId: order.tailorId,
	status: order.status,
	priceMinor: order.priceMinor,
	platformFeeMinor: order.platformFeeMinor,
	tailorPayoutMinor: order.tailorPayoutMinor,
	currency: order.currency,
	dueDate: order.dueDate,
	checkoutSessionId: order.checkoutSessionId,
	fundedAt: order.fundedAt
};
export type PayableOrder = Pick<Order, keyof typeof payColumns>;

/** The order as payment sees it, locked for the rest of the caller's transaction when `lock` is set. */
export async function forPayment(
	db: Executor,
	{ orderId, lock = false }: { orderId: string; lock?: boolean }
): Promise<PayableOrder | null> {
	const query = db.select(payColumns).from(order).where(eq(order.id, orderId)).limit(1);
	const [row] = lock ? await query.for('update') : await query;
	return row ?? null;
}

/** Remembers the Checkout Session the customer was sent to, so a second click can reuse it. */
export async function noteCheckoutSession(
	db: Executor,
	{ orderId, sessionId }: { orderId: string; sessionId: string }
) {
	await db
		.update(order)
		.set({ checkoutSessionId: sessionId })
		.where(and(eq(order.id, orderId), eq(order.status, 'awaiting_payment')));
}

/**
 * `awaiting_payment → funded`, guarded by the status so only the first of any number of callers moves it:
 * returns the order when this call funded it, null when it was not awaiting payment.
 */
export async function markFunded(
	db: Executor,
	{ orderId, now = new Date() }: { orderId: string; now?: Date }
): Promise<PayableOrder | null> {
	const [row] = await db
		.update(order)
		.set({ status: 'funded', fundedAt: now, updatedAt: now })
		.where(and(eq(order.id, orderId), eq(order.status, 'awaiting_payment')))
		.returning(payColumns);
	return row ?? null;
}

/** Whether the viewer is the order's customer or tailor. */
export function isParty(row: Pick<Order, 'customerId' | 'tailorId'>, viewerId: string) {
	return row.customerId === viewerId || row.tailorId === viewerId;
}

/** The orders whose Checkout Session this is (at most one). */
export async function bySession(db: Executor, sessionId: string): Promise<PayableOrder | null> {
	const [row] = await db.select(payColumns).from(order).where(eq(order.checkoutSessionId, sessionId)).limit(1);
	return row ?? null;
}

/** The whole order row, for the jobs that move its money; locked for the caller's transaction when `lock` is set. */
export async function forMoney(
	db: Executor,
	{ orderId, lock = false }: { orderId: string; lock?: boolean }
): Promise<Order | null> {
	const query = db.select().from(order).where(eq(order.id, orderId)).limit(1);
	const [row] = lock ? await query.for('update') : await query;
	return row ?? null;
}
