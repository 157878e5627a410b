import type { Executor } from '../db';
import { completeRelease } from '../orders/lifecycle';
import { forMoney } from '../orders/payment';
import * as payouts from '../payouts';
import { chargeOf, moneyOf, paymentByKey, post, posted, recordPayment, type Posting } from './ledger';
import { moneyJob, moneyKey, transfer } from './transfers';

/**
 * The `order-release` job: once release was asked for (the customer confirmed, or the clock ran out), transfers
 * the tailor's payout less any advance already paid — price − fee − advance — with the key `release:<order>`,
 * then in the same transaction records the transfer, posts the ledger (escrow → tailor payouts and the fee to
 * platform fees) and moves the order to `released`. A repeat finds the key recorded and only finishes what is
 * left; a disputed order is never released. Waits (fails for a retry) while a fabric advance is still on its way.
 */
export async function runRelease(db: Executor, { orderId }: { orderId: string }): Promise<void> {
	const key = moneyKey('release', orderId);
	await moneyJob(db, { orderId, action: 'release' }, async (tx) => {
		const row = await forMoney(tx, { orderId });
		if (!row || !row.releaseRequestedAt) return;
		if (await posted(tx, key)) {
			const done = await paymentByKey(tx, key);
			await completeRelease(tx, { orderId, transferId: done?.processorId ?? null, paidMinor: done?.amountMinor ?? 0 });
			return;
		}
		if (row.status !== 'delivered') return;
		const chargeId = await chargeOf(tx, orderId);
		if (!chargeId) throw new Error(`Order ${orderId} has no charge to transfer from`);
		const money = await moneyOf(tx, orderId);
		if (row.fabricApprovedAt && row.advanceMinor > 0 && money.advancedMinor === 0)
			throw new Error('The materials advance is still on its way; the release waits for it');
		const amount = row.tailorPayoutMinor - money.advancedMinor;
		const fee = row.platformFeeMinor;
		if (amount < 0 || amount + fee !== money.heldMinor)
			throw new Error(
				`Order ${orderId} holds ${money.heldMinor}, not the ${amount + fee} its release needs; left for an admin`
			);
		let paymentId: string | null = null;
		let transferId: string | null = null;
		if (amount > 0) {
			const destination = await payouts.destinationOf(tx, row.tailorId);
			if (!destination) throw new Error('The tailor’s payouts account cannot receive transfers yet');
			const made = await transfer({
				orderId,
				amountMinor: amount,
				currency: row.currency,
				destination,
				chargeId,
				action: 'release'
			});
			transferId = made.id;
			paymentId = await recordPayment(tx, {
				orderId,
				kind: 'release_transfer',
				processorId: made.id,
				amountMinor: amount,
				currency: row.currency,
				status: 'succeeded',
				idempotencyKey: key
			});
			if (!paymentId) return;
		}
		const postings: Posting[] = [
			{ account: 'escrow', amountMinor: -(amount + fee) },
			{ account: 'tailor_payouts', amountMinor: amount },
			{ account: 'platform_fees', amountMinor: fee }
		];
		await post(tx, {
			orderId,
			currency: row.currency,
			kind: 'release',
			idempotencyKey: key,
			paymentId,
			postings: postings.filter((p) => p.amountMinor !== 0)
		});
		await completeRelease(tx, { orderId, transferId, paidMinor: amount });
	});
}
