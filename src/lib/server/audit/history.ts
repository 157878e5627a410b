import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { auditEvent, user } from '../db/schema';

export type HistoryEntry = {
	id: string;
	/** Dotted verb as recorded, e.g. 'account.suspended'. */
	action: string;
	at: Date;
	/** Null for system actions, or when the actor's account is gone. */
	actor: { id: string; name: string | null; email: string } | null;
	/** Only the reason, when one was given: the rest of an event's data stays on the server. */
	reason: string | null;
};

type Subjects = { subjectType: string; subjectIds: string[]; limitEach?: number };

/** The latest events of many subjects of one type, newest first, in one query; keyed by subject id. */
export async function historiesFor(
	db: Executor,
	{ subjectType, subjectIds, limitEach = 20 }: Subjects
): Promise<Map<string, HistoryEntry[]>> {
	const histories = new Map<string, HistoryEntry[]>(subjectIds.map((id) => [id, []]));
	if (subjectIds.length === 0) return histories;
	const ranked = db
		.select({
			id: auditEvent.id,
			subjectId: auditEvent.subjectId,
			action: auditEvent.action,
			at: auditEvent.createdAt,
			actorId: auditEvent.actorId,
			reason: sql<string | null>`${auditEvent.data} ->> 'reason'`.as('reason'),
			rank: sql<number>`row_number() over (partition by ${auditEvent.subjectId} order by ${auditEvent.createdAt} desc, ${auditEvent.id} desc)`.as(
				'rank'
			)
		})
		.from(auditEvent)
		.where(and(eq(auditEvent.subjectType, subjectType), inArray(auditEvent.subjectId, subjectIds)))
		.as('ranked');
	const rows = await db
		.select({
			id: ranked.id,
			subjectId: ranked.subjectId,
			action: ranked.action,
			at: ranked.at,
			reason: ranked.reason,
			actorId: user.id,
			actorName: user.name,
			actorEmail: user.email
		})
		.from(ranked)
		.leftJoin(user, eq(user.id, ranked.actorId))
		.where(sql`${ranked.rank} <= ${limitEach}`)
		.orderBy(desc(ranked.at), desc(ranked.id));
	for (const row of rows) {
		histories.get(row.subjectId)?.push({
			id: row.id,
			action: row.action,
			at: row.at,
			actor: row.actorId && row.actorEmail ? { id: row.actorId, name: row.actorName, email: row.actorEmail } : null,
			reason: row.reason
		});
	}
	return histories;
}

/** What happened to one subject (say a user: joined, suspended and why, reinstated, by whom, when), newest first. */
export async function historyFor(
	db: Executor,
	{ subjectType, subjectId, limit = 50 }: { subjectType: string; subjectId: string; limit?: number }
): Promise<HistoryEntry[]> {
	const histories = await historiesFor(db, { subjectType, subjectIds: [subjectId], limitEach: limit });
	return histories.get(subjectId) ?? [];
}
