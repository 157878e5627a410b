import { and, eq, gt, ne } from 'drizzle-orm';
import * as audit from '../audit';
import type { Executor } from '../db';
import { quote } from '../db/schema';
import * as notifications from '../notifications';
import { noteCommissionChanged } from '../search-outbox';
import { anotherQuoteAccepted } from './decide';

/** Who cancelled the order: the customer, the tailor, or an admin. */
export type ReopeningActor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };

/** Why the accepted quote is no longer accepted, as its tailor reads it. */
export const orderCancelledBeforePayment = 'the order was cancelled before payment';

/**
 * The order an acceptance made was cancelled before payment: the accepted quote is answered (withdrawn when
 * its own tailor cancelled, declined otherwise), and every quote the acceptance declined goes back to `sent`
 * while it is still valid, its tailor told. Runs inside the cancellation's transaction.
 */
export async function reopenAfterCancelledOrder(
	tx: Executor,
	{
		commissionId,
		acceptedQuoteId,
		actor,
		now = new Date()
	}: { commissionId: string; acceptedQuoteId: string; actor: ReopeningActor; now?: Date }
): Promise<string[]> {
	const [accepted] = await tx
		.select({ tailorId: quote.tailorId, status: quote.status })
		.from(quote)
		.where(eq(quote.id, acceptedQuoteId))
		.for('update');
	if (accepted?.status === 'accepted') {
		const byTailor = accepted.tailorId === actor.id;
		await tx
			.update(quote)
			.set(
				byTailor
					? { status: 'withdrawn', decidedAt: now, updatedAt: now }
					: { status: 'declined', declineReason: orderCancelledBeforePayment, decidedAt: now, updatedAt: now }
			)
			.where(eq(quote.id, acceptedQuoteId));
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: byTailor ? 'quote.withdrawn' : 'quote.declined',
			subjectType: 'quote',
			subjectId: acceptedQuoteId,
			data: { commissionId, reason: orderCancelledBeforePayment }
		});
	}
	const reopened = await tx
		.update(quote)
		.set({ status: 'sent', declineReason: '', decidedAt: null, updatedAt: now })
		.where(
			and(
				eq(quote.commissionId, commissionId),
				eq(quote.status, 'declined'),
				eq(quote.declineReason, anotherQuoteAccepted),
				ne(quote.id, acceptedQuoteId),
				gt(quote.validUntil, now)
			)
		)
		.returning({ id: quote.id, tailorId: quote.tailorId });
	for (const q of reopened) {
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'quote.reopened',
			subjectType: 'quote',
			subjectId: q.id,
			data: { commissionId, cancelledQuoteId: acceptedQuoteId }
		});
		await notifications.notify(tx, {
			userId: q.tailorId,
			event: 'order_cancelled',
			title: 'Your quote is open again',
			body: 'The customer had accepted another quote, but that order was cancelled before payment. Your quote stands again until it expires, and the customer may still accept it.',
			href: `/commissions/${commissionId}`
		});
	}
	if (reopened.length) await noteCommissionChanged(tx, commissionId);
	return reopened.map((q) => q.id);
}
