import { and, eq, or } from 'drizzle-orm';
import type { OrderSummary } from '$lib/types/order';
import * as audit from '../audit';
import type { Executor } from '../db';
import { order } from '../db/schema';
import { platformFeeBasisPoints } from '../services/platform-fee';
import { splitPrice } from './fee';

export { rateText, splitPrice, type FeeSplit } from './fee';
export * as lifecycle from './lifecycle';
export {
	agreeCancellation,
	approveFabric,
	autoRelease,
	cancel,
	confirmDelivery,
	declineCancellation,
	markDelivered,
	markReady,
	onUnpaidCancelled,
	openCancellationRequest,
	postProgress,
	progressOf,
	releaseDue,
	requestAlteration,
	statusWords,
	stepWords,
	type CancelOutcome,
	type CancellationRequest,
	type DeliveryInput,
	type OrderActor,
	type ProgressInput,
	type ProgressPhoto
} from './lifecycle';
export { OrderError, orderErrorStatus, type OrderErrorCode, type OrderIssue } from './errors';

const summaryColumns = {
	id: order.id,
	commissionId: order.commissionId,
	quoteId: order.quoteId,
	customerId: order.customerId,
	tailorId: order.tailorId,
	status: order.status,
	priceMinor: order.priceMinor,
	platformFeeMinor: order.platformFeeMinor,
	tailorPayoutMinor: order.tailorPayoutMinor,
	advanceMinor: order.advanceMinor,
	platformFeeBasisPoints: order.platformFeeBasisPoints,
	currency: order.currency,
	dueDate: order.dueDate,
	createdAt: order.createdAt
};

/** The fee rate new orders are made with (`PLATFORM_FEE_PERCENT`, default 10 %), in basis points. */
export const currentFeeBasisPoints = platformFeeBasisPoints;

export type NewOrderInput = {
	commissionId: string;
	quoteId: string;
	customerId: string;
	tailorId: string;
	priceMinor: number;
	currency: string;
	dueDate: string;
	/** The materials advance the quote asked for (0 or none: no advance). */
	advanceMinor?: number;
	actor: { id: string; ip?: string | null };
};

/**
 * The order for an accepted quote, awaiting payment, with the fee at today's rate and the payout that makes
 * up the price. Call it inside the acceptance's transaction; the unique commission and quote keys make a
 * second order for either impossible (the caller turns that violation into a conflict).
 */
export async function createOrder(tx: Executor, input: NewOrderInput): Promise<OrderSummary> {
	const split = splitPrice(input.priceMinor, input.currency, platformFeeBasisPoints());
	const [row] = await tx
		.insert(order)
		.values({
			commissionId: input.commissionId,
			quoteId: input.quoteId,
			customerId: input.customerId,
			tailorId: input.tailorId,
			priceMinor: split.priceMinor,
			platformFeeMinor: split.platformFeeMinor,
			tailorPayoutMinor: split.tailorPayoutMinor,
			platformFeeBasisPoints: split.platformFeeBasisPoints,
			currency: input.currency,
			dueDate: input.dueDate,
			advanceMinor: input.advanceMinor ?? 0,
			status: 'awaiting_payment'
		})
		.returning(summaryColumns);
	await audit.record(tx, {
		actorId: input.actor.id,
		ip: input.actor.ip,
		action: 'order.created',
		subjectType: 'order',
		subjectId: row.id,
		data: {
			commissionId: input.commissionId,
			quoteId: input.quoteId,
			priceMinor: split.priceMinor,
			platformFeeMinor: split.platformFeeMinor,
			tailorPayoutMinor: split.tailorPayoutMinor,
			platformFeeBasisPoints: split.platformFeeBasisPoints,
			advanceMinor: input.advanceMinor ?? 0,
			currency: input.currency
		}
	});
	return row;
}

/**
 * The order as one of its two parties sees it — by order id or by commission id — or null for anyone else
 * (who is told nothing about it).
 */
export async function getForParty(
	db: Executor,
	{ viewerId, orderId, commissionId }: { viewerId: string; orderId?: string; commissionId?: string }
): Promise<OrderSummary | null> {
	const which = orderId ? eq(order.id, orderId) : commissionId ? eq(order.commissionId, commissionId) : null;
	if (!which) return null;
	const [row] = await db
		.select(summaryColumns)
		.from(order)
		.where(and(which, or(eq(order.customerId, viewerId), eq(order.tailorId, viewerId))))
		.limit(1);
	return row ?? null;
}
/**
 * The order for one of its two parties, or for an admin (who reads orders to settle disputes); null for anyone
 * else, as for an order that does not exist.
 */
export async function getForViewer(
	db: Executor,
	{ viewer, orderId }: { viewer: { id: string; role: string }; orderId: string }
): Promise<OrderSummary | null> {
	if (viewer.role !== 'admin') return getForParty(db, { viewerId: viewer.id, orderId });
	const [row] = await db.select(summaryColumns).from(order).where(eq(order.id, orderId)).limit(1);
	return row ?? null;
}

export * as orderSchemas from './schemas';
