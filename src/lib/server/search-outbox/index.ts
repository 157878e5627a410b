import type { Executor } from '../db';
import { searchOutbox, type SearchDocumentKind } from '../db/schema';

/**
 * Records that a document's search entry must be rebuilt. Call it inside the transaction that makes the
 * change: the row commits (or rolls back) with it, and the search sync job drains the outbox. Lives apart
 * from the search area so that the areas search reads (commissions, workrooms) can call it without a cycle.
 */
export async function noteSearchChange(db: Executor, kind: SearchDocumentKind, entityId: string) {
	await db.insert(searchOutbox).values({ kind, entityId }).onConflictDoNothing();
}

export const noteCommissionChanged = (db: Executor, commissionId: string) =>
	noteSearchChange(db, 'commission', commissionId);

export const noteWorkroomChanged = (db: Executor, tailorId: string) => noteSearchChange(db, 'workroom', tailorId);
