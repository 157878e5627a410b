import { and, asc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { searchOutbox, type SearchDocumentKind } from '../db/schema';
import * as jobs from '../jobs';

/** Every note asks for one sync run; while one waits in the queue, further asks are folded into it. */
export const syncSingletonKey = 'search-sync';

let lastWarning = 0;

/**
 * Asks for a sync run inside the caller's transaction. Asking must never undo the change itself: in a
 * savepoint, and a refusal (pg-boss never started on this database, no queue configured in a script) is
 * only noted — the outbox row stays, and the minute cron or a reindex picks it up.
 */
export async function requestSync(db: Executor) {
	try {
		await db.transaction((sp) => jobs.enqueue(sp, jobs.queueNames.searchSync, {}, { singletonKey: syncSingletonKey }));
	} catch (error) {
		const code =
			(error as { code?: string; cause?: { code?: string } }).code ??
			(error as { cause?: { code?: string } }).cause?.code;
		if (code === '42P01' || Date.now() - lastWarning < 60_000) return;
		lastWarning = Date.now();
		console.warn(`[search] could not ask for a sync now; the next scheduled run will: ${String(error)}`);
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
