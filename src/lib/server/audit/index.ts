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
