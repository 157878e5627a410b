import { eq } from 'drizzle-orm';
import * as audit from '../audit';
import type { Executor } from '../db';
import { commission, type Commission } from '../db/schema';
import type { Actor } from './transitions';

/**
 * The commission, locked for the rest of the caller's transaction, when `ownerId` owns it; null otherwise.
 * Deciding on a quote takes this lock first, so decisions on one commission happen one at a time.
 */
export async function lockForDecision(
	tx: Executor,
	{ id, ownerId }: { id: string; ownerId: string }
): Promise<Commission | null> {
	const [row] = await tx.select().from(commission).where(eq(commission.id, id)).for('update').limit(1);
	return row && row.customerId === ownerId ? row : null;
}

/**
 * Open → awarded, inside the acceptance's transaction, on a row `lockForDecision` locked. Returns false (and
 * changes nothing) when the commission is no longer open: the caller refuses the acceptance.
 */
export async function award(
	tx: Executor,
	{ row, actor, quoteId, orderId }: { row: Commission; actor: Actor; quoteId: string; orderId: string }
): Promise<boolean> {
	if (row.status !== 'open') return false;
	await tx.update(commission).set({ status: 'awarded', updatedAt: new Date() }).where(eq(commission.id, row.id));
	await audit.record(tx, {
		actorId: actor.id,
		ip: actor.ip,
		action: 'commission.awarded',
		subjectType: 'commission',
		subjectId: row.id,
		data: { quoteId, orderId }
	});
	return true;
}
