import type { Executor } from '../db';
import { forPayment, isParty } from '../orders/payment';
import type { OrderStatus } from '../db/schema';
import { PaymentError } from './errors';
import { lastFailure, moneyOf, type OrderMoney } from './ledger';

export { startCheckout, returnPath, type PayingActor } from './checkout';
export { handleEvent, stateOf, syncFromSession, syncOrder, type EventOutcome, type PaymentState } from './events';
export { PaymentError, errorStatus, type PaymentErrorCode } from './errors';
export { moneyOf, type OrderMoney } from './ledger';
export * as schemas from './schemas';
export * as escrow from './escrow';

/** `GET /api/v1/orders/{id}`: the order with its money as the ledger has it. */
export type OrderView = {
	id: string;
	commissionId: string;
	customerId: string;
	tailorId: string;
	status: OrderStatus;
	priceMinor: number;
	platformFeeMinor: number;
	tailorPayoutMinor: number;
	currency: string;
	dueDate: string;
	fundedAt: string | null;
	money: OrderMoney;
	lastPaymentFailure: { message: string; at: string } | null;
};

/** The order for either of its parties or an admin; anyone else is told there is no such order. */
export async function orderView(
	db: Executor,
	{ orderId, viewer }: { orderId: string; viewer: { id: string; role: string } }
): Promise<OrderView> {
	const row = await forPayment(db, { orderId });
	if (!row || !(isParty(row, viewer.id) || viewer.role === 'admin'))
		throw new PaymentError('not_found', 'There is no such order.');
	const failure = row.fundedAt ? null : await lastFailure(db, row.id);
	return {
		id: row.id,
		commissionId: row.commissionId,
		customerId: row.customerId,
		tailorId: row.tailorId,
		status: row.status,
		priceMinor: row.priceMinor,
		platformFeeMinor: row.platformFeeMinor,
		tailorPayoutMinor: row.tailorPayoutMinor,
		currency: row.currency,
		dueDate: row.dueDate,
		fundedAt: row.fundedAt?.toISOString() ?? null,
		money: await moneyOf(db, row.id),
		lastPaymentFailure: failure && { message: failure.message, at: failure.at.toISOString() }
	};
}
