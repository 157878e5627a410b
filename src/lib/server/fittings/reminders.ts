import { and, asc, eq, gt, isNull, lte } from 'drizzle-orm';
import type { Executor } from '../db';
import { fitting } from '../db/schema';
import * as orders from '../orders';
import { contextOf, fittingStatuses } from './context';
import { tellReminder } from './notices';

const day = 24 * 60 * 60 * 1000;

/**
 * The `fitting-reminder` job: each booked fitting starting within the next 24 hours and not yet reminded gets one
 * reminder to both people. Each fitting is stamped `reminded_at` in the transaction that queues its mails, and rows
 * another run holds are skipped, so a reminder goes once however often (or however many at once) the job runs.
 */
export async function sendDueReminders(
	db: Executor,
	{ now = new Date(), limit = 200 }: { now?: Date; limit?: number } = {}
): Promise<number> {
	const due = await db
		.select({ id: fitting.id })
		.from(fitting)
		.where(
			and(
				eq(fitting.status, 'confirmed'),
				isNull(fitting.remindedAt),
				gt(fitting.startsAt, now),
				lte(fitting.startsAt, new Date(now.getTime() + day))
			)
		)
		.orderBy(asc(fitting.startsAt))
		.limit(limit);
	let sent = 0;
	for (const { id } of due) {
		const reminded = await db.transaction(async (tx) => {
			const [row] = await tx
				.select()
				.from(fitting)
				.where(and(eq(fitting.id, id), eq(fitting.status, 'confirmed'), isNull(fitting.remindedAt)))
				.for('update', { skipLocked: true })
				.limit(1);
			if (!row) return false;
			await tx.update(fitting).set({ remindedAt: now }).where(eq(fitting.id, id));
			// The order as its tailor (who offered the time) sees it.
			const order = row.proposedById
				? await orders.getForParty(tx, { viewerId: row.proposedById, orderId: row.orderId })
				: null;
			if (!order || !fittingStatuses.has(order.status)) return false;
			const ctx = await contextOf(tx, order);
			await tellReminder(tx, ctx, row, 'customer');
			await tellReminder(tx, ctx, row, 'tailor');
			return true;
		});
		if (reminded) sent += 1;
	}
	return sent;
}
