import { and, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db';
import { notification, type NotificationEvent } from '../db/schema';
import type { NotificationDto, NotificationPage } from '$lib/types/notifications';

/** The bell stops counting here and shows "99+". */
export const unreadCap = 100;

const columns = {
	id: notification.id,
	event: notification.event,
	title: notification.title,
	body: notification.body,
	href: notification.href,
	readAt: notification.readAt,
	createdAt: notification.createdAt
};

type Row = {
	id: string;
	event: NotificationEvent;
	title: string;
	body: string;
	href: string;
	readAt: Date | null;
	createdAt: Date;
};

function toDto(row: Row): NotificationDto<NotificationEvent> {
	return {
		id: row.id,
		event: row.event,
		title: row.title,
		body: row.body,
		href: row.href,
		read: row.readAt !== null,
		readAt: row.readAt?.toISOString() ?? null,
		createdAt: row.createdAt.toISOString()
	};
}

/**
 * `unreadCount` as an expression, for a caller that reads it in the same statement as other header counts;
 * `userId` may be a placeholder of a prepared statement.
 */
export function unreadCountExpression(userId: unknown): SQL<number> {
	return sql<number>`(select count(*)::int from (
		select 1 from ${notification} n where n.user_id = ${userId} and n.read_at is null limit ${sql.raw(String(unreadCap))}
	) unread)`;
}

/** How many notices wait unread, counted up to `unreadCap` (one index-only scan of the unread index). */
export async function unreadCount(db: Executor, { userId }: { userId: string }): Promise<number> {
	const result = await db.execute<{ n: number }>(sql`
		select count(*)::int as n from (
			select 1 from ${notification}
			where ${notification.userId} = ${userId} and ${notification.readAt} is null
			limit ${unreadCap}
		) unread`);
	return result.rows[0]?.n ?? 0;
}

/**
 * One page of a person's notices, newest first. `cursor` is the previous page's `nextCursor` (the id of its
 * last notice); an id that is not theirs starts nowhere and gives an empty page.
 */
export async function list(
	db: Executor,
	{ userId, cursor, limit = 20 }: { userId: string; cursor?: string; limit?: number }
): Promise<NotificationPage<NotificationEvent>> {
	const position = cursor
		? sql`(${notification.createdAt}, ${notification.id}) < (select n.created_at, n.id from ${notification} n where n.id = ${cursor} and n.user_id = ${userId})`
		: undefined;
	const [rows, unread] = await Promise.all([
		db
			.select(columns)
			.from(notification)
			.where(and(eq(notification.userId, userId), position))
			.orderBy(desc(notification.createdAt), desc(notification.id))
			.limit(limit + 1),
		unreadCount(db, { userId })
	]);
	const items = rows.slice(0, limit).map(toDto);
	return { items, nextCursor: rows.length > limit ? items[items.length - 1].id : null, unreadCount: unread };
}

/** Marks the person's own notices read: the ids given (others' ids are ignored), or all. Answers how many changed. */
export async function markRead(
	db: Executor,
	{ userId, ids, all = false, now = new Date() }: { userId: string; ids?: string[]; all?: boolean; now?: Date }
): Promise<number> {
	if (!all && (!ids || ids.length === 0)) return 0;
	const rows = await db
		.update(notification)
		.set({ readAt: now })
		.where(
			and(
				eq(notification.userId, userId),
				isNull(notification.readAt),
				all ? undefined : inArray(notification.id, ids!)
			)
		)
		.returning({ id: notification.id });
	return rows.length;
}

/** One of the person's notices, for opening it: its path inside Tackline, or null. */
export async function hrefOf(db: Executor, { userId, id }: { userId: string; id: string }) {
	const [row] = await db
		.select({ href: notification.href })
		.from(notification)
		.where(and(eq(notification.id, id), eq(notification.userId, userId)))
		.limit(1);
	return row?.href ?? null;
}
