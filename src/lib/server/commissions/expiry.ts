import { and, eq, lte } from 'drizzle-orm';
import type { Executor } from '../db';
import { commission } from '../db/schema';
import { expire } from './transitions';

/**
 * The expiry job's worker: every open commission past its `expires_at` is expired, each in its own
 * transaction, so one failure leaves the rest done and the next run picks up what is left.
 */
export async function expireDue(db: Executor, { now = new Date(), limit = 200 }: { now?: Date; limit?: number } = {}) {
	const due = await db
		.select({ id: commission.id })
		.from(commission)
		.where(and(eq(commission.status, 'open'), lte(commission.expiresAt, now)))
		.orderBy(commission.expiresAt)
		.limit(limit);
	let expired = 0;
	for (const { id } of due) if (await expire(db, { id, now })) expired += 1;
	return expired;
}
