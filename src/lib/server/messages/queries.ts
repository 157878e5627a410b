import { and, asc, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import {
	attachmentUrl,
	type AttachmentView,
	type MessageView,
	type ThreadSummary,
	type ThreadView
} from '$lib/types/messages';
import { firstNameAndInitial } from '../commissions';
import * as notifications from '../notifications';
import type { Executor } from '../db';
import { preparedPer } from '../db/prepared';
import { message, messageAttachment, type Message } from '../db/schema';
import { openness, sideOf, threadFacts, type Participant } from './access';
import { noSuchThread } from './errors';

type MessageRow = Pick<Message, 'id' | 'threadId' | 'authorId' | 'body' | 'createdAt' | 'readAt'>;

const messageColumns = {
	id: message.id,
	threadId: message.threadId,
	authorId: message.authorId,
	body: message.body,
	createdAt: message.createdAt,
	readAt: message.readAt
};

async function attachmentsOf(db: Executor, messageIds: string[]) {
	const byMessage = new Map<string, AttachmentView[]>();
	if (messageIds.length === 0) return byMessage;
	const rows = await db
		.select({
			id: messageAttachment.id,
			messageId: messageAttachment.messageId,
			width: messageAttachment.width,
			height: messageAttachment.height,
			altText: messageAttachment.altText
		})
		.from(messageAttachment)
		.where(inArray(messageAttachment.messageId, messageIds))
		.orderBy(asc(messageAttachment.createdAt), asc(messageAttachment.id));
	for (const row of rows) {
		const list = byMessage.get(row.messageId) ?? [];
		list.push({
			id: row.id,
			url: attachmentUrl(row.id, 'full'),
			thumbUrl: attachmentUrl(row.id, 'thumb'),
			width: row.width,
			height: row.height,
			altText: row.altText
		});
		byMessage.set(row.messageId, list);
	}
	return byMessage;
}

/** Messages as the viewer sees them, with their photos. */
export async function toViews(db: Executor, rows: MessageRow[], viewerId: string): Promise<MessageView[]> {
	const attachments = await attachmentsOf(
		db,
		rows.map((row) => row.id)
	);
	return rows.map((row) => ({
		id: row.id,
		threadId: row.threadId,
		authorId: row.authorId,
		mine: row.authorId === viewerId,
		body: row.body,
		createdAt: row.createdAt.toISOString(),
		readAt: row.readAt?.toISOString() ?? null,
		attachments: attachments.get(row.id) ?? []
	}));
}

/** `(created_at, id)` of a message of the thread, for keyset comparisons; exact to the microsecond. */
function positionOf(threadId: string, messageId: string): SQL {
	return sql`(select m2.created_at, m2.id from message m2 where m2.id = ${messageId} and m2.thread_id = ${threadId})`;
}

async function requireSide(db: Executor, threadId: string, viewer: Participant) {
	const facts = await threadFacts(db, threadId);
	const side = facts && sideOf(facts, viewer);
	if (!facts || !side) throw noSuchThread();
	return { facts, side };
}

/**
 * One page of a conversation, newest first; `cursor` (the previous page's `nextCursor`, the oldest message
 * it held) fetches the page before it. Only the thread's customer and tailor may read it.
 */
export async function list(
	db: Executor,
	{ threadId, viewer, cursor, limit = 30 }: { threadId: string; viewer: Participant; cursor?: string; limit?: number }
): Promise<{ items: MessageView[]; nextCursor: string | null }> {
	await requireSide(db, threadId, viewer);
	const rows = await db
		.select(messageColumns)
		.from(message)
		.where(
			and(
				eq(message.threadId, threadId),
				cursor ? sql`(${message.createdAt}, ${message.id}) < ${positionOf(threadId, cursor)}` : undefined
			)
		)
		.orderBy(desc(message.createdAt), desc(message.id))
		.limit(limit + 1);
	const page = rows.slice(0, limit);
	return {
		items: await toViews(db, page, viewer.id),
		nextCursor: rows.length > limit ? page[page.length - 1].id : null
	};
}

/**
 * Messages of a thread after `after` (oldest first), or from the start when it is null: what a live stream
 * sends on each change and when a client reconnects with `Last-Event-ID`. The caller has checked the viewer.
 */
export async function messagesAfter(
	db: Executor,
	{
		threadId,
		after,
		viewerId,
		limit = 200
	}: { threadId: string; after: string | null; viewerId: string; limit?: number }
) {
	const rows = await db
		.select(messageColumns)
		.from(message)
		.where(
			and(
				eq(message.threadId, threadId),
				after ? sql`(${message.createdAt}, ${message.id}) > ${positionOf(threadId, after)}` : undefined
			)
		)
		.orderBy(asc(message.createdAt), asc(message.id))
		.limit(limit);
	return toViews(db, rows, viewerId);
}

/** The newest message's id in a thread (where a live stream without a starting point begins), or null. */
export async function latestMessageId(db: Executor, threadId: string) {
	const [row] = await db
		.select({ id: message.id })
		.from(message)
		.where(eq(message.threadId, threadId))
		.orderBy(desc(message.createdAt), desc(message.id))
		.limit(1);
	return row?.id ?? null;
}

/** Whether `messageId` is a message of the thread (a `Last-Event-ID` from elsewhere is ignored). */
export async function belongsTo(db: Executor, { threadId, messageId }: { threadId: string; messageId: string }) {
	const [row] = await db
		.select({ id: message.id })
		.from(message)
		.where(and(eq(message.id, messageId), eq(message.threadId, threadId)))
		.limit(1);
	return Boolean(row);
}

type ThreadRow = {
	id: string;
	commissionId: string;
	title: string;
	status: string;
	customerId: string;
	tailorId: string;
	customerName: string | null;
	shopName: string | null;
	unread: number;
	lastBody: string | null;
	lastAt: Date | string | null;
	lastAuthorId: string | null;
	lastHasAttachments: boolean | null;
};

const previewLength = 140;

function preview(body: string) {
	const flat = body.replace(/\s+/g, ' ').trim();
	return flat.length > previewLength ? `${flat.slice(0, previewLength - 1)}…` : flat;
}

const iso = (value: Date | string) => (value instanceof Date ? value : new Date(value)).toISOString();

function summaryOf(row: ThreadRow, viewerId: string): ThreadSummary {
	const viewerIsTailor = row.tailorId === viewerId;
	return {
		id: row.id,
		commission: { id: row.commissionId, title: row.title, status: row.status },
		otherParty: viewerIsTailor
			? { id: row.customerId, name: firstNameAndInitial(row.customerName), role: 'customer' }
			: { id: row.tailorId, name: row.shopName ?? 'A workroom', role: 'tailor' },
		lastMessage:
			row.lastAt && row.lastBody !== null
				? {
						preview: preview(row.lastBody),
						at: iso(row.lastAt),
						mine: row.lastAuthorId === viewerId,
						hasAttachments: Boolean(row.lastHasAttachments)
					}
				: null,
		unreadCount: Number(row.unread)
	};
}

/** The viewer's threads, as ids: those they tailor, and those on their commissions. */
function threadsOf(viewerId: unknown) {
	return sql`(
		select t.id from message_thread t where t.tailor_id = ${viewerId}
		union
		select t.id from message_thread t join commission c on c.id = t.commission_id where c.customer_id = ${viewerId}
	)`;
}

/**
 * The viewer's inbox: unread conversations first, then by latest message, keyset-paged by thread id. Each
 * names the other party, the commission, the last message's start and how many messages wait unread.
 */
export async function threadsFor(
	db: Executor,
	{ viewer, cursor, limit = 20 }: { viewer: Participant; cursor?: string; limit?: number }
): Promise<{ items: ThreadSummary[]; nextCursor: string | null }> {
	const after = cursor
		? sql`where (r.has_unread, r.last_at, r.id) < (select c2.has_unread, c2.last_at, c2.id from ranked c2 where c2.id = ${cursor})`
		: sql``;
	const result = await db.execute<ThreadRow>(sql`
		with ranked as (
			select t.id, t.commission_id, t.tailor_id, c.title, c.status, c.customer_id,
				coalesce(t.last_message_at, t.created_at) as last_at, u.unread, (u.unread > 0)::int as has_unread
			from message_thread t
			join commission c on c.id = t.commission_id
			cross join lateral (
				select count(*)::int as unread from message m
				where m.thread_id = t.id and m.read_at is null and m.author_id is distinct from ${viewer.id}
			) u
			where t.id in ${threadsOf(viewer.id)}
		)
		select r.id, r.commission_id as "commissionId", r.title, r.status, r.customer_id as "customerId",
			r.tailor_id as "tailorId", cu.name as "customerName", tp.shop_name as "shopName", r.unread,
			lm.body as "lastBody", lm.created_at as "lastAt", lm.author_id as "lastAuthorId",
			lm.has_attachments as "lastHasAttachments"
		from ranked r
		left join "user" cu on cu.id = r.customer_id
		left join tailor_profile tp on tp.user_id = r.tailor_id
		left join lateral (
			select m.body, m.created_at, m.author_id,
				exists (select 1 from message_attachment a where a.message_id = m.id) as has_attachments
			from message m where m.thread_id = r.id order by m.created_at desc, m.id desc limit 1
		) lm on true
		${after}
		order by r.has_unread desc, r.last_at desc, r.id desc
		limit ${limit + 1}`);
	const rows = result.rows.slice(0, limit);
	return {
		items: rows.map((row) => summaryOf(row, viewer.id)),
		nextCursor: result.rows.length > limit ? rows[rows.length - 1].id : null
	};
}

/** One thread's header for the conversation page: the inbox summary plus whether it still takes messages. */
export async function getThread(db: Executor, { threadId, viewer }: { threadId: string; viewer: Participant }) {
	const { facts, side } = await requireSide(db, threadId, viewer);
	const result = await db.execute<{ customerName: string | null; shopName: string | null; unread: number }>(sql`
		select (select name from "user" where id = ${facts.customerId}) as "customerName",
			(select shop_name from tailor_profile where user_id = ${facts.tailorId}) as "shopName",
			(select count(*)::int from message m where m.thread_id = ${threadId} and m.read_at is null
				and m.author_id is distinct from ${viewer.id}) as unread`);
	const extra = result.rows[0];
	const view: ThreadView = {
		...summaryOf(
			{
				id: facts.id,
				commissionId: facts.commissionId,
				title: facts.commissionTitle,
				status: facts.commissionStatus,
				customerId: facts.customerId,
				tailorId: facts.tailorId,
				customerName: extra.customerName,
				shopName: extra.shopName,
				unread: extra.unread,
				lastBody: null,
				lastAt: null,
				lastAuthorId: null,
				lastHasAttachments: null
			},
			viewer.id
		),
		viewerRole: side,
		...openness(facts, side)
	};
	return view;
}

/** The thread of a commission and tailor, if one was opened. */
export async function threadIdFor(
	db: Executor,
	{ commissionId, tailorId }: { commissionId: string; tailorId: string }
) {
	const result = await db.execute<{ id: string }>(
		sql`select id from message_thread where commission_id = ${commissionId} and tailor_id = ${tailorId}`
	);
	return result.rows[0]?.id ?? null;
}

const unreadMessagesOf = (viewerId: unknown) => sql<number>`(
	select count(*)::int from message m
	where m.thread_id in ${threadsOf(viewerId)} and m.read_at is null and m.author_id is distinct from ${viewerId}
)`;

/** How many messages wait unread for the viewer across all their threads (the navigation's badge). */
export async function unreadCount(db: Executor, viewer: Participant) {
	const result = await db.execute<{ count: number }>(sql`select ${unreadMessagesOf(viewer.id)} as count`);
	return Number(result.rows[0]?.count ?? 0);
}

const headerCountsStatement = preparedPer((db) => {
	const viewerId = sql.placeholder('viewerId');
	return db
		.select({
			messages: unreadMessagesOf(viewerId).mapWith(Number),
			notices: notifications.unreadCountExpression(viewerId).mapWith(Number)
		})
		.from(sql`(values (1)) as one (x)`)
		.prepare('header_unread_counts');
});

/**
 * What the header's badges show, in one statement: the messages waiting unread (as `unreadCount`) and the
 * notices waiting unread (as `notifications.unreadCount`, capped the same way).
 */
export async function unreadCounts(db: Executor, viewer: Participant): Promise<{ messages: number; notices: number }> {
	const [row] = await headerCountsStatement(db).execute({ viewerId: viewer.id });
	return { messages: row?.messages ?? 0, notices: row?.notices ?? 0 };
}
