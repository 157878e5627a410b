import type { Executor } from '../db';
import { completeRefund } from '../orders/lifecycle';
import { forMoney } from '../orders/payment';
import { chargeOf, moneyOf, paymentByKey, post, recordPayment } from './ledger';
import { moneyJob, moneyKey, refund, reverseAdvance } from './transfers';

/**
 * The `order-refund` job, for an order cancelled by agreement before work started, or cancelled before payment
 * with a payment that arrived anyway: first takes back a paid advance (`reversal:advance:<order>`, tailor
 * payouts → escrow), then refunds everything escrow holds (`refund:<order>`, escrow → customer refunds), each
 * recorded and posted in the transaction that made it. Waits (fails for a retry) while an approved advance is
 * still on its way, so it is reversed rather than missed.
 */
export async function runRefund(db: Executor, { orderId }: { orderId: string }): Promise<void> {
	const reversalKey = moneyKey('reversal:advance', orderId);
	const refundKey = moneyKey('refund', orderId);
	await moneyJob(db, { orderId, action: 'refund' }, async (tx) => {
		const row = await forMoney(tx, { orderId });
		if (!row || !(row.refundRequestedAt || row.status === 'cancelled')) return;
		const done = await paymentByKey(tx, refundKey);
		if (done) {
			await completeRefund(tx, { orderId, refundId: done.processorId, amountMinor: done.amountMinor });
			return;
		}
		if (row.fabricApprovedAt && row.advanceMinor > 0) {
			const advance = await paymentByKey(tx, moneyKey('advance', orderId));
			if (!advance) throw new Error('The materials advance is still on its way; the refund waits to reverse it');
			if (!(await paymentByKey(tx, reversalKey))) {
				const reversal = await reverseAdvance({
					orderId,
					transferId: advance.processorId,
					amountMinor: advance.amountMinor
				});
				const paymentId = await recordPayment(tx, {
					orderId,
					kind: 'reversal',
					processorId: reversal.id,
					amountMinor: advance.amountMinor,
					currency: row.currency,
					status: 'succeeded',
					idempotencyKey: reversalKey
				});
				if (!paymentId) return;
				await post(tx, {
					orderId,
					currency: row.currency,
					kind: 'reversal',
					idempotencyKey: reversalKey,
					paymentId,
					postings: [
						{ account: 'tailor_payouts', amountMinor: -advance.amountMinor },
						{ account: 'escrow', amountMinor: advance.amountMinor }
					]
				});
			}
		}
		const held = (await moneyOf(tx, orderId)).heldMinor;
		if (held <= 0) return;
		const chargeId = await chargeOf(tx, orderId);
		if (!chargeId) throw new Error(`Order ${orderId} has no charge to refund`);
		const made = await refund({ orderId, chargeId, amountMinor: held });
		const paymentId = await recordPayment(tx, {
			orderId,
			kind: 'refund',
			processorId: made.id,
			amountMinor: held,
			currency: row.currency,
			status: made.status === 'succeeded' ? 'succeeded' : 'pending',
			idempotencyKey: refundKey
		});
		if (!paymentId) return;
		await post(tx, {
			orderId,
			currency: row.currency,
			kind: 'refund',
			idempotencyKey: refundKey,
			paymentId,
			postings: [
				{ account: 'escrow', amountMinor: -held },
				{ account: 'customer_refunds', amountMinor: held }
			]
		});
		await completeRefund(tx, { orderId, refundId: made.id, amountMinor: held });
	});
}
