import { eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import * as audit from '../audit';
import * as commissions from '../commissions';
import type { Executor } from '../db';
import { processedWebhookEvent } from '../db/schema';
import { enqueue, queueNames } from '../jobs';
import { forPayment, markFunded, type PayableOrder } from '../orders/payment';
import { notify } from '../notifications';
import * as payouts from '../payouts';
import { payments } from '../services/payments';
import { outageAsUnavailable, PaymentError } from './errors';
import { lastFailure, post, recordPayment } from './ledger';
import { orderFundedNotice, paymentReceivedNotice } from './mails';

/** What handling an event did: applied it, found it already handled, or had nothing to do with it. */
export type EventOutcome = 'applied' | 'duplicate' | 'ignored';

/** A successful payment as the processor reports it. */
type Paid = {
	orderId: string;
	paymentIntentId: string;
	chargeId: string;
	amountMinor: number;
	currency: string;
};

const idOf = (value: string | { id: string } | null | undefined) =>
	value == null ? null : typeof value === 'string' ? value : value.id;

/** Claims an event id inside the transaction; false when it was handled before (or is being handled now). */
async function claim(tx: Executor, event: Pick<Stripe.Event, 'id' | 'type'>): Promise<boolean> {
	const rows = await tx
		.insert(processedWebhookEvent)
		.values({ eventId: event.id, type: event.type })
		.onConflictDoNothing()
		.returning({ id: processedWebhookEvent.eventId });
	return rows.length > 0;
}

async function alreadyHandled(db: Executor, eventId: string) {
	const [row] = await db
		.select({ id: processedWebhookEvent.eventId })
		.from(processedWebhookEvent)
		.where(eq(processedWebhookEvent.eventId, eventId))
		.limit(1);
	return Boolean(row);
}

async function mailBothSides(tx: Executor, row: PayableOrder) {
	const commission = await commissions.getForOwner(tx, { id: row.commissionId, ownerId: row.customerId });
	const about = {
		orderId: row.id,
		commissionId: row.commissionId,
		title: commission?.title ?? 'your commission',
		priceMinor: row.priceMinor,
		currency: row.currency
	};
	await notify(tx, paymentReceivedNotice(row.customerId, about));
	await notify(
		tx,
		orderFundedNotice(row.tailorId, { ...about, tailorPayoutMinor: row.tailorPayoutMinor, dueDate: row.dueDate })
	);
}

/**
 * `awaiting_payment → funded`, once: under the order's lock, only an order still awaiting payment moves; the
 * charge is recorded (key `charge:<order>`), the ledger takes the price from customer payments into escrow,
 * and both sides are told. A payment that does not match the order's price and currency is refused and kept
 * in the audit log for someone to look at. Runs inside the caller's transaction.
 */
async function fund(tx: Executor, paid: Paid, via: string): Promise<boolean> {
	const row = await forPayment(tx, { orderId: paid.orderId, lock: true });
	if (row?.status === 'cancelled') return refundLatePayment(tx, row, paid, via);
	if (!row || row.status !== 'awaiting_payment') return false;
	if (paid.amountMinor !== row.priceMinor || paid.currency.toUpperCase() !== row.currency) {
		await audit.record(tx, {
			actorId: null,
			action: 'order.payment_mismatch',
			subjectType: 'order',
			subjectId: row.id,
			data: { ...paid, expectedMinor: row.priceMinor, expectedCurrency: row.currency, via }
		});
		return false;
	}
	const funded = await markFunded(tx, { orderId: row.id });
	if (!funded) return false;
	const key = `charge:${row.id}`;
	const paymentId = await recordPayment(tx, {
		orderId: row.id,
		kind: 'charge',
		processorId: paid.chargeId,
		amountMinor: row.priceMinor,
		currency: row.currency,
		status: 'succeeded',
		idempotencyKey: key
	});
	await post(tx, {
		orderId: row.id,
		currency: row.currency,
		kind: 'charge',
		idempotencyKey: key,
		paymentId,
		postings: [
			{ account: 'customer_payments', amountMinor: -row.priceMinor },
			{ account: 'escrow', amountMinor: row.priceMinor }
		]
	});
	await audit.record(tx, {
		actorId: null,
		action: 'order.funded',
		subjectType: 'order',
		subjectId: row.id,
		data: {
			chargeId: paid.chargeId,
			paymentIntentId: paid.paymentIntentId,
			amountMinor: row.priceMinor,
			currency: row.currency,
			via
		}
	});
	await mailBothSides(tx, funded);
	return true;
}

/**
 * A payment that arrives for an order cancelled before it was paid (the payment page was still open): the
 * charge is recorded and taken into escrow as any payment is, and the `order-refund` job gives it all back.
 * Once per charge: the key `charge:<order>` makes a replay change nothing.
 */
async function refundLatePayment(tx: Executor, row: PayableOrder, paid: Paid, via: string): Promise<boolean> {
	const key = `charge:${row.id}`;
	const currency = paid.currency.toUpperCase();
	const paymentId = await recordPayment(tx, {
		orderId: row.id,
		kind: 'charge',
		processorId: paid.chargeId,
		amountMinor: paid.amountMinor,
		currency,
		status: 'succeeded',
		idempotencyKey: key
	});
	if (!paymentId) return false;
	await post(tx, {
		orderId: row.id,
		currency,
		kind: 'charge',
		idempotencyKey: key,
		paymentId,
		postings: [
			{ account: 'customer_payments', amountMinor: -paid.amountMinor },
			{ account: 'escrow', amountMinor: paid.amountMinor }
		]
	});
	await audit.record(tx, {
		actorId: null,
		action: 'order.late_payment',
		subjectType: 'order',
		subjectId: row.id,
		data: { chargeId: paid.chargeId, amountMinor: paid.amountMinor, currency, via }
	});
	await enqueue(tx, queueNames.orderRefund, { orderId: row.id }, { singletonKey: row.id });
	return true;
}

/** The successful payment behind a PaymentIntent that has succeeded, or null. */
function paidFromIntent(intent: Stripe.PaymentIntent): Paid | null {
	const orderId = intent.metadata?.order_id;
	const chargeId = idOf(intent.latest_charge);
	if (intent.status !== 'succeeded' || !orderId || !chargeId) return null;
	return {
		orderId,
		paymentIntentId: intent.id,
		chargeId,
		amountMinor: intent.amount_received || intent.amount,
		currency: intent.currency
	};
}

/** The successful payment behind a paid Checkout Session (reading its PaymentIntent when not expanded). */
async function paidFromSession(session: Stripe.Checkout.Session): Promise<Paid | null> {
	if (session.payment_status !== 'paid' || !session.payment_intent) return null;
	const intent =
		typeof session.payment_intent === 'string'
			? await payments().paymentIntents.retrieve(session.payment_intent)
			: session.payment_intent;
	const paid = paidFromIntent(intent);
	const orderId = session.metadata?.order_id;
	return paid && orderId === paid.orderId ? paid : null;
}

/**
 * Keeps why a card attempt failed, for the order's page (the order stays unpaid). The failed charge's id makes
 * the record once, whether the webhook or the return page saw it first.
 */
async function recordFailure(tx: Executor, intent: Stripe.PaymentIntent) {
	const orderId = intent.metadata?.order_id;
	const error = intent.last_payment_error;
	const chargeId = error?.charge ?? idOf(intent.latest_charge);
	if (!orderId || !chargeId || !error) return false;
	const row = await forPayment(tx, { orderId, lock: true });
	if (!row) return false;
	const message = error.message ?? 'The card was declined.';
	const recorded = await recordPayment(tx, {
		orderId,
		kind: 'charge',
		processorId: chargeId,
		amountMinor: intent.amount,
		currency: intent.currency.toUpperCase(),
		status: 'failed',
		idempotencyKey: `charge-failed:${chargeId}`,
		failureReason: message
	});
	if (!recorded) return false;
	await audit.record(tx, {
		actorId: null,
		action: 'order.payment_failed',
		subjectType: 'order',
		subjectId: orderId,
		data: {
			chargeId,
			paymentIntentId: intent.id,
			code: error.code ?? null,
			declineCode: error.decline_code ?? null,
			message
		}
	});
	return true;
}

/**
 * Applies one verified processor event, exactly once: the event id is recorded in the same transaction as its
 * effect, so a replay (or a concurrent duplicate) changes nothing. Paid sessions and succeeded intents fund
 * their order; a failed intent keeps its reason for the order's page; `account.updated` goes to payouts.
 * Other types are acknowledged and ignored.
 */
export async function handleEvent(db: Executor, event: Stripe.Event): Promise<EventOutcome> {
	if (await alreadyHandled(db, event.id)) return 'duplicate';
	// Reads at the processor happen before the transaction, so no lock waits on the network.
	let paid: Paid | null = null;
	switch (event.type) {
		case 'checkout.session.completed':
		case 'checkout.session.async_payment_succeeded':
			paid = await paidFromSession(event.data.object);
			break;
		case 'payment_intent.succeeded':
			paid = paidFromIntent(event.data.object);
			break;
		case 'payment_intent.payment_failed':
		case 'account.updated':
			break;
		default:
			return 'ignored';
	}
	return db.transaction(async (tx) => {
		if (!(await claim(tx, event))) return 'duplicate';
		switch (event.type) {
			case 'payment_intent.payment_failed':
				return (await recordFailure(tx, event.data.object)) ? 'applied' : 'ignored';
			case 'account.updated':
				return (await payouts.applyAccountUpdate(tx, event.data.object)) ? 'applied' : 'ignored';
			default:
				return paid && (await fund(tx, paid, event.type)) ? 'applied' : 'ignored';
		}
	});
}

/** The order's payment as its pages show it. */
export type PaymentState = {
	status: PayableOrder['status'];
	paid: boolean;
	failure: { message: string; at: Date } | null;
};

/**
 * For the page the customer returns to: reads the Checkout Session at the processor and, when it is paid,
 * funds the order exactly as the webhook would (whichever comes first wins; the other changes nothing), so
 * the page shows the true state even before the webhook arrives. A session of another order is not found.
 */
export async function syncFromSession(
	db: Executor,
	{ sessionId, orderId }: { sessionId: string; orderId: string }
): Promise<PaymentState> {
	let session: Stripe.Checkout.Session;
	try {
		session = await payments().checkout.sessions.retrieve(sessionId, { expand: ['payment_intent'] });
	} catch (error) {
		if ((error as { statusCode?: number }).statusCode === 404)
			throw new PaymentError('not_found', 'There is no such payment.');
		throw outageAsUnavailable(error);
	}
	if (session.metadata?.order_id !== orderId) throw new PaymentError('not_found', 'There is no such payment.');
	const paid = await paidFromSession(session);
	if (paid) await db.transaction((tx) => fund(tx, paid, 'return_page'));
	else if (session.payment_intent && typeof session.payment_intent !== 'string') {
		const intent = session.payment_intent;
		await db.transaction((tx) => recordFailure(tx, intent));
	}
	return stateOf(db, orderId);
}

/**
 * The same for an order whose customer came back without a session id (the payment page's "go back"):
 * reads the order's latest Checkout Session, if it has one.
 */
export async function syncOrder(db: Executor, { orderId }: { orderId: string }): Promise<PaymentState> {
	const row = await forPayment(db, { orderId });
	if (!row) throw new PaymentError('not_found', 'There is no such order.');
	if (row.status === 'awaiting_payment' && row.checkoutSessionId)
		return syncFromSession(db, { sessionId: row.checkoutSessionId, orderId });
	return stateOf(db, orderId);
}

/** The order's payment state from our records. */
export async function stateOf(db: Executor, orderId: string): Promise<PaymentState> {
	const row = await forPayment(db, { orderId });
	if (!row) throw new PaymentError('not_found', 'There is no such order.');
	const paid = row.fundedAt !== null;
	return { status: row.status, paid, failure: paid ? null : await lastFailure(db, orderId) };
}
