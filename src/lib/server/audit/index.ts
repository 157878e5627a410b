import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { auditEvent } from '../db/schema';

export type AuditEntry = {
	actorId: string | null;
	/** The client address of the request that caused it; null outside a request (scripts, jobs). */
	ip?: string | null;
	action: string;
	subjectType: string;
	subjectId: string;
	data?: Record<string, unknown>;
};

/** Writes one audit event inside the caller's transaction, so it commits or rolls back with the change. */
export async function record(tx: Executor, entry: AuditEntry) {
	await tx.insert(auditEvent).values({ ...entry, data: entry.data ?? {}, ip: entry.ip ?? null });
}
export { historiesFor, historyFor, type HistoryEntry } from './history';

export type RecordedEvent = { action: string; actorId: string | null; at: Date; data: Record<string, unknown> };

/** The latest of the given actions recorded about one subject, or null when none is. */
export async function latestOf(
	db: Executor,
	{ subjectType, subjectId, actions }: { subjectType: string; subjectId: string; actions: string[] }
): Promise<RecordedEvent | null> {
	const [row] = await db
		.select({ action: auditEvent.action, actorId: auditEvent.actorId, at: auditEvent.createdAt, data: auditEvent.data })
		.from(auditEvent)
		.where(
			and(
				eq(auditEvent.subjectType, subjectType),
				eq(auditEvent.subjectId, subjectId),
				inArray(auditEvent.action, actions)
			)
		)
		.orderBy(desc(auditEvent.createdAt), desc(auditEvent.id))
		.limit(1);
	return row ?? null;
}

/** How many times an action was recorded about one subject, optionally only those whose data has `key`. */
export async function countOf(
	db: Executor,
	{ subjectType, subjectId, action, key }: { subjectType: string; subjectId: string; action: string; key?: string }
): Promise<number> {
	const [row] = await db
		.select({ count: sql<number>`count(*)::int` })
		.from(auditEvent)
		.where(
			and(
				eq(auditEvent.subjectType, subjectType),
				eq(auditEvent.subjectId, subjectId),
				eq(auditEvent.action, action),
				key === undefined ? undefined : sql`${auditEvent.data} ->> 'key' = ${key}`
			)
		);
	return row?.count ?? 0;
}
