import type { Executor } from '../db';
import { completeAdvance } from '../orders/lifecycle';
import { forMoney } from '../orders/payment';
import * as payouts from '../payouts';
import { chargeOf, paymentByKey, post, recordPayment } from './ledger';
import { moneyJob, moneyKey, transfer } from './transfers';

/**
 * The `order-advance` job: once the customer approved the fabric, transfers the materials advance to the
 * tailor with the key `advance:<order>`, records it as an `advance_transfer` and posts escrow → tailor payouts,
 * all in one transaction. It always completes once asked for — a cancellation agreed meanwhile reverses it — so
 * a transfer that went through before its answer was lost is never left out of the ledger.
 */
export async function runAdvance(db: Executor, { orderId }: { orderId: string }): Promise<void> {
	const key = moneyKey('advance', orderId);
	await moneyJob(db, { orderId, action: 'advance' }, async (tx) => {
		const row = await forMoney(tx, { orderId });
		if (!row || !row.fabricApprovedAt || row.advanceMinor <= 0) return;
		if (await paymentByKey(tx, key)) return;
		const chargeId = await chargeOf(tx, orderId);
		if (!chargeId) throw new Error(`Order ${orderId} has no charge to transfer from`);
		const destination = await payouts.destinationOf(tx, row.tailorId);
		if (!destination) throw new Error('The tailor’s payouts account cannot receive transfers yet');
		const made = await transfer({
			orderId,
			amountMinor: row.advanceMinor,
			currency: row.currency,
			destination,
			chargeId,
			action: 'advance'
		});
		const paymentId = await recordPayment(tx, {
			orderId,
			kind: 'advance_transfer',
			processorId: made.id,
			amountMinor: row.advanceMinor,
			currency: row.currency,
			status: 'succeeded',
			idempotencyKey: key
		});
		if (!paymentId) return;
		await post(tx, {
			orderId,
			currency: row.currency,
			kind: 'advance',
			idempotencyKey: key,
			paymentId,
			postings: [
				{ account: 'escrow', amountMinor: -row.advanceMinor },
				{ account: 'tailor_payouts', amountMinor: row.advanceMinor }
			]
		});
		await completeAdvance(tx, { orderId });
	});
}
