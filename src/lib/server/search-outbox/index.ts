import { and, asc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { searchOutbox, type SearchDocumentKind } from '../db/schema';
import * as jobs from '../jobs';

/** Every note asks for one sync run; while one waits in the queue, further asks are folded into it. */
export const syncSingletonKey = 'search-sync';

/**
 * Asks for a sync run inside the caller's transaction. Where pg-boss has never started (a bare test
 * database), the savepoint keeps the caller's transaction alive: the note stays, and the next run or a
 * reindex picks it up.
 */
export async function requestSync(db: Executor) {
	try {
		await db.transaction((sp) => jobs.enqueue(sp, jobs.queueNames.searchSync, {}, { singletonKey: syncSingletonKey }));
	} catch (error) {
		if (
			(error as { code?: string }).code !== '42P01' &&
			(error as { cause?: { code?: string } }).cause?.code !== '42P01'
		)
			throw error;
	}
}

/**
 * Records that a document's search entry must be rebuilt. Call it inside the transaction that makes the
 * change: the row commits (or rolls back) with it, and the search sync job drains the outbox. Lives apart
 * from the search area so that the areas search reads (commissions, workrooms) can call it without a cycle.
 * A second note for the same document moves its time on, so a sync that read the older state leaves it.
 */
export async function noteSearchChange(db: Executor, kind: SearchDocumentKind, entityId: string) {
	await db
		.insert(searchOutbox)
		.values({ kind, entityId })
		.onConflictDoUpdate({
			target: [searchOutbox.kind, searchOutbox.entityId],
			set: { createdAt: sql`clock_timestamp()` }
		});
	await requestSync(db);
}

export const noteCommissionChanged = (db: Executor, commissionId: string) =>
	noteSearchChange(db, 'commission', commissionId);

export const noteWorkroomChanged = (db: Executor, tailorId: string) => noteSearchChange(db, 'workroom', tailorId);

/** `version` is the note's time as PostgreSQL writes it, to the microsecond (a JS date would round it). */
export type PendingNote = { id: number; kind: SearchDocumentKind; entityId: string; version: string };

/** The oldest notes still waiting, for the sync job. */
export async function pending(db: Executor, { limit = 500 }: { limit?: number } = {}): Promise<PendingNote[]> {
	return db
		.select({
			id: searchOutbox.id,
			kind: searchOutbox.kind,
			entityId: searchOutbox.entityId,
			version: sql<string>`${searchOutbox.createdAt}::text`
		})
		.from(searchOutbox)
		.orderBy(asc(searchOutbox.createdAt), asc(searchOutbox.id))
		.limit(limit);
}

/** Removes notes the index now reflects; a note moved on since it was read stays for the next run. */
export async function clear(db: Executor, notes: PendingNote[]) {
	for (const note of notes)
		await db
			.delete(searchOutbox)
			.where(and(eq(searchOutbox.id, note.id), sql`${searchOutbox.createdAt} = ${note.version}::timestamptz`));
}

/** How many notes wait: 0 when the index is in step. */
export async function backlog(db: Executor): Promise<number> {
	const [row] = await db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(searchOutbox);
	return row.n;
}
