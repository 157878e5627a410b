/**
 * The calls that move an order's money at the processor, and the frame every money job runs in.
 *
 * Each call carries an idempotency key derived from the business action (`release:<order>`, `advance:<order>`,
 * `refund:<order>`, `reversal:advance:<order>`), so a retry of a call that did go through — its answer lost to
 * a timeout — gets the same object back instead of a second one. Transfers go to the tailor's connected account
 * with `source_transaction` = the order's charge and `transfer_group` = the order id.
 *
 * The processor forgets idempotency keys after a day, and a job may still be retrying then; so before each call the
 * processor's own list is searched for an object this action made (its metadata names the order and the action),
 * and that object is used instead of making another.
 */
import { sql } from 'drizzle-orm';
import type Stripe from 'stripe';
import * as accounts from '../accounts';
import * as audit from '../audit';
import type { Executor } from '../db';
import * as notifications from '../notifications';
import { forMoney } from '../orders/payment';
import { moneyRetry } from '../services/order-settings';
import { payments } from '../services/payments';

export type MoneyAction = 'release' | 'advance' | 'refund' | 'reversal:advance';

export const moneyKey = (action: MoneyAction, orderId: string) => `${action}:${orderId}`;

type TransferInput = {
	orderId: string;
	amountMinor: number;
	currency: string;
	destination: string;
	chargeId: string;
	action: 'release' | 'advance';
};

type Tagged = { metadata: Stripe.Metadata | null };

/** The first object in a processor list that the given action on the order made, if any. */
async function madeBefore<T extends Tagged>(list: AsyncIterable<T>, orderId: string, action: MoneyAction) {
	for await (const item of list)
		if (item.metadata?.order_id === orderId && item.metadata?.action === action) return item;
	return null;
}

/** A Transfer to the tailor's connected account, funded by the order's charge. */
export async function transfer(input: TransferInput): Promise<Stripe.Transfer> {
	const before = await madeBefore(
		payments().transfers.list({ transfer_group: input.orderId, limit: 100 }),
		input.orderId,
		input.action
	);
	if (before) return before;
	return payments().transfers.create(
		{
			amount: input.amountMinor,
			currency: input.currency.toLowerCase(),
			destination: input.destination,
			source_transaction: input.chargeId,
			transfer_group: input.orderId,
			description: input.action === 'advance' ? 'Materials advance' : 'Payout on release',
			metadata: { order_id: input.orderId, action: input.action }
		},
		{ idempotencyKey: moneyKey(input.action, input.orderId) }
	);
}

/** Takes a paid advance back from the tailor's connected account. */
export async function reverseAdvance(input: {
	orderId: string;
	transferId: string;
	amountMinor: number;
}): Promise<Stripe.TransferReversal> {
	const before = await madeBefore(
		payments().transfers.listReversals(input.transferId, { limit: 100 }),
		input.orderId,
		'reversal:advance'
	);
	if (before) return before;
	return payments().transfers.createReversal(
		input.transferId,
		{ amount: input.amountMinor, metadata: { order_id: input.orderId, action: 'reversal:advance' } },
		{ idempotencyKey: moneyKey('reversal:advance', input.orderId) }
	);
}

/** Returns money from the order's charge to the customer's card. */
export async function refund(input: {
	orderId: string;
	chargeId: string;
	amountMinor: number;
}): Promise<Stripe.Refund> {
	const before = await madeBefore(
		payments().refunds.list({ charge: input.chargeId, limit: 100 }),
		input.orderId,
		'refund'
	);
	if (before) return before;
	return payments().refunds.create(
		{
			charge: input.chargeId,
			amount: input.amountMinor,
			reason: 'requested_by_customer',
			metadata: { order_id: input.orderId, action: 'refund' }
		},
		{ idempotencyKey: moneyKey('refund', input.orderId) }
	);
}

/**
 * Runs one money job for an order: inside a transaction holding the order's money lock (an advisory lock, so
 * the release, advance and refund of one order never interleave, while people's actions on the order are not
 * held up), so `work` can call the processor and record what it did in the same transaction. A failure is
 * audited in a transaction of its own; after `MONEY_ALERT_AFTER` failures of the same action every admin is
 * told once. The error is passed on, so the queue retries the job with back-off.
 */
export async function moneyJob(
	db: Executor,
	{ orderId, action }: { orderId: string; action: MoneyAction },
	work: (tx: Executor) => Promise<void>
): Promise<void> {
	try {
		await db.transaction(async (tx) => {
			await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`order-money:${orderId}`}))`);
			await work(tx);
		});
	} catch (error) {
		await noteFailure(db, { orderId, action, error }).catch((noted: unknown) =>
			console.error(`[payments] could not record a failed ${action} of ${orderId}:`, noted)
		);
		throw error;
	}
}

async function noteFailure(
	db: Executor,
	{ orderId, action, error }: { orderId: string; action: MoneyAction; error: unknown }
) {
	const key = moneyKey(action, orderId);
	const message = error instanceof Error ? error.message : String(error);
	await db.transaction(async (tx) => {
		const row = await forMoney(tx, { orderId, lock: true });
		if (!row) return;
		await audit.record(tx, {
			actorId: null,
			action: 'order.money_call_failed',
			subjectType: 'order',
			subjectId: orderId,
			data: { key, message: message.slice(0, 500) }
		});
		const failures = await audit.countOf(tx, {
			subjectType: 'order',
			subjectId: orderId,
			action: 'order.money_call_failed',
			key
		});
		if (failures < moneyRetry().alertAfter) return;
		const alerted = await audit.countOf(tx, {
			subjectType: 'order',
			subjectId: orderId,
			action: 'order.money_stuck',
			key
		});
		if (alerted > 0) return;
		await audit.record(tx, {
			actorId: null,
			action: 'order.money_stuck',
			subjectType: 'order',
			subjectId: orderId,
			data: { key, failures, message: message.slice(0, 500) }
		});
		for (const adminId of await accounts.adminIds(tx))
			await notifications.notify(tx, {
				userId: adminId,
				event: 'money_stuck',
				title: `A ${action} is stuck on order ${orderId.slice(0, 8)}`,
				body: `The ${action} for this order has failed ${failures} times. It keeps being retried with the same idempotency key (${key}), so it will not be paid twice; the last error was:\n\n${message.slice(0, 300)}`,
				href: `/orders/${orderId}`
			});
	});
}
