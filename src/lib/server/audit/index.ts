import { getRequestEvent } from '$app/server';
import type { Executor } from '../db';
import { auditEvent } from '../db/schema';

export type AuditEntry = {
	actorId: string | null;
	action: string;
	subjectType: string;
	subjectId: string;
	data?: Record<string, unknown>;
};

function clientAddress(): string | null {
	try {
		return getRequestEvent().getClientAddress();
	} catch {
		return null; // outside a request (scripts, jobs)
	}
}

/** Writes one audit event inside the caller's transaction, so it commits or rolls back with the change. */
export async function record(tx: Executor, entry: AuditEntry) {
	await tx.insert(auditEvent).values({ ...entry, data: entry.data ?? {}, ip: clientAddress() });
}
export { historiesFor, historyFor, type HistoryEntry } from './history';
