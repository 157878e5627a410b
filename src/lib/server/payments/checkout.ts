import { garmentName } from '$lib/format';
import type Stripe from 'stripe';
import * as accounts from '../accounts';
import * as audit from '../audit';
import { publicOrigin } from '../auth/origin';
import * as commissions from '../commissions';
import type { Executor } from '../db';
import { forPayment, isParty, noteCheckoutSession } from '../orders/payment';
import { payments } from '../services/payments';
import { outageAsUnavailable, PaymentError } from './errors';
import { syncFromSession } from './events';

/** Who pays: the signed-in person, with the request's address for the audit log. */
export type PayingActor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };

const noSuchOrder = () => new PaymentError('not_found', 'There is no such order.');

/** The page the hosted payment page returns to, paid or not. */
export const returnPath = (orderId: string) => `/orders/${orderId}/paid`;

function attemptOf(session: Stripe.Checkout.Session): number {
	const n = Number(session.metadata?.attempt);
	return Number.isSafeInteger(n) && n > 0 ? n : 1;
}

/**
 * The customer starts paying for an order awaiting payment: a Checkout Session in payment mode for the
 * garment at the order's price, with the order id as metadata and transfer group. The idempotency key
 * `checkout:<order>:<attempt>` makes a double click the same session; an open session is reused, and only
 * after one expires is the next attempt made. Returns the hosted page's URL.
 */
export async function startCheckout(
	db: Executor,
	input: { orderId: string; actor: PayingActor }
): Promise<{ url: string; sessionId: string; reused: boolean }> {
	try {
		return await checkout(db, input);
	} catch (error) {
		throw outageAsUnavailable(error);
	}
}

async function checkout(
	db: Executor,
	{ orderId, actor }: { orderId: string; actor: PayingActor }
): Promise<{ url: string; sessionId: string; reused: boolean }> {
	const row = await forPayment(db, { orderId });
	if (!row || !(isParty(row, actor.id) || actor.role === 'admin')) throw noSuchOrder();
	if (row.customerId !== actor.id) throw new PaymentError('forbidden', 'Only the customer pays for an order.');
	if (row.status === 'cancelled')
		throw new PaymentError('conflict', 'This order was cancelled, so there is nothing to pay.');
	if (row.status !== 'awaiting_payment') throw new PaymentError('conflict', 'This order is already paid.');

	const stripe = payments();
	let attempt = 1;
	if (row.checkoutSessionId) {
		const previous = await stripe.checkout.sessions.retrieve(row.checkoutSessionId);
		if (previous.status === 'open' && previous.url) return { url: previous.url, sessionId: previous.id, reused: true };
		if (previous.status === 'complete') {
			await syncFromSession(db, { sessionId: previous.id, orderId });
			throw new PaymentError('conflict', 'This order is already paid.');
		}
		attempt = attemptOf(previous) + 1;
	}

	const commission = await commissions.getForOwner(db, { id: row.commissionId, ownerId: row.customerId });
	const customer = await accounts.getProfile(db, { id: row.customerId });
	if (!commission || !customer) throw noSuchOrder();
	const origin = publicOrigin();
	const metadata = { order_id: row.id, commission_id: row.commissionId, attempt: String(attempt) };
	const session = await stripe.checkout.sessions.create(
		{
			mode: 'payment',
			line_items: [
				{
					quantity: 1,
					price_data: {
						currency: row.currency.toLowerCase(),
						unit_amount: row.priceMinor,
						product_data: {
							name: `${garmentName(commission.garmentType)} — made to measure`,
							description: commission.title.slice(0, 200)
						}
					}
				}
			],
			customer_email: customer.email,
			client_reference_id: row.id,
			metadata,
			payment_intent_data: { transfer_group: row.id, metadata },
			success_url: `${origin}${returnPath(row.id)}?session_id={CHECKOUT_SESSION_ID}`,
			cancel_url: `${origin}${returnPath(row.id)}?cancelled=1`
		},
		{ idempotencyKey: `checkout:${row.id}:${attempt}` }
	);
	if (!session.url) throw new PaymentError('unavailable', 'The payment page could not be opened. Please try again.');
	await db.transaction(async (tx) => {
		await noteCheckoutSession(tx, { orderId: row.id, sessionId: session.id });
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'order.checkout_started',
			subjectType: 'order',
			subjectId: row.id,
			data: { sessionId: session.id, attempt, amountMinor: row.priceMinor, currency: row.currency }
		});
	});
	return { url: session.url, sessionId: session.id, reused: false };
}
