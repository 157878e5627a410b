import type { Executor } from '../db';
import type { DeliveryMethod, OrderStatus, ProgressStepKind } from '../db/schema';
import { openCancellationRequest, progressOf } from '../orders/lifecycle';
import { forMoney, isParty } from '../orders/payment';
import { PaymentError } from './errors';
import { lastFailure, moneyOf, type OrderMoney } from './ledger';

export { startCheckout, returnPath, type PayingActor } from './checkout';
export { handleEvent, stateOf, syncFromSession, syncOrder, type EventOutcome, type PaymentState } from './events';
export { PaymentError, errorStatus, type PaymentErrorCode } from './errors';
export { moneyOf, type OrderMoney } from './ledger';
export { paymentHistory } from './history';
export { runAdvance } from './advance';
export { runRefund } from './refund';
export { runRelease } from './release';
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
	/** The materials advance agreed in the quote (0: none), and when the customer approved the fabric. */
	advanceMinor: number;
	fabricApprovedAt: string | null;
	workStartedAt: string | null;
	readyAt: string | null;
	deliveredAt: string | null;
	delivery: { method: DeliveryMethod; trackingReference: string | null; note: string } | null;
	/** When the money is released on its own; null while no clock runs (not delivered, alteration open, release asked). */
	autoReleaseAt: string | null;
	alteration: { requestedAt: string; note: string } | null;
	releaseRequestedAt: string | null;
	releasedAt: string | null;
	cancellation: {
		cancelledAt: string | null;
		reason: string;
		refundRequestedAt: string | null;
		/** An open request by one side to cancel a paid order, waiting for the other side's answer. */
		request: { by: 'customer' | 'tailor'; at: string; reason: string } | null;
	};
	progress: {
		id: string;
		step: ProgressStepKind;
		note: string;
		recordedAt: string;
		photo: { width: number; height: number; alt: string } | null;
	}[];
};

const iso = (at: Date | null) => at?.toISOString() ?? null;

/** The order for either of its parties or an admin; anyone else is told there is no such order. */
export async function orderView(
	db: Executor,
	{ orderId, viewer }: { orderId: string; viewer: { id: string; role: string } }
): Promise<OrderView> {
	const row = await forMoney(db, { orderId });
	if (!row || !(isParty(row, viewer.id) || viewer.role === 'admin'))
		throw new PaymentError('not_found', 'There is no such order.');
	const failure = row.fundedAt ? null : await lastFailure(db, row.id);
	const request = row.status === 'funded' ? await openCancellationRequest(db, row.id) : null;
	const steps = await progressOf(db, row.id);
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
		lastPaymentFailure: failure && { message: failure.message, at: failure.at.toISOString() },
		advanceMinor: row.advanceMinor,
		fabricApprovedAt: iso(row.fabricApprovedAt),
		workStartedAt: iso(row.workStartedAt),
		readyAt: iso(row.readyAt),
		deliveredAt: iso(row.deliveredAt),
		delivery: row.deliveryMethod
			? { method: row.deliveryMethod, trackingReference: row.trackingReference, note: row.deliveryNote }
			: null,
		autoReleaseAt: iso(row.autoReleaseAt),
		alteration: row.alterationRequestedAt
			? { requestedAt: row.alterationRequestedAt.toISOString(), note: row.alterationNote }
			: null,
		releaseRequestedAt: iso(row.releaseRequestedAt),
		releasedAt: iso(row.releasedAt),
		cancellation: {
			cancelledAt: iso(row.cancelledAt),
			reason: row.cancelReason,
			refundRequestedAt: iso(row.refundRequestedAt),
			request: request && { by: request.by, at: request.at.toISOString(), reason: request.reason }
		},
		progress: steps.map((step) => ({
			id: step.id,
			step: step.kind,
			note: step.note,
			recordedAt: step.recordedAt.toISOString(),
			photo:
				step.photoKey && step.photoWidth && step.photoHeight
					? { width: step.photoWidth, height: step.photoHeight, alt: step.photoAlt }
					: null
		}))
	};
}
