import { inArray, sql } from 'drizzle-orm';
import { publicOrigin } from '../auth/origin';
import { firstNameAndInitial } from '../commissions';
import type { Executor } from '../db';
import { message } from '../db/schema';
import { notifyGrouped, type InAppNotice, type Notice } from '../notifications';

/** A message waits this long unread before its recipient is mailed about it. */
export const digestDelayMinutes = 15;

type DueRow = {
	id: string;
	threadId: string;
	title: string;
	recipientId: string | null;
	recipientEmail: string | null;
	recipientName: string | null;
	recipientSuspended: boolean | null;
	recipientIsTailor: boolean | null;
	customerName: string | null;
	shopName: string | null;
};

export type DigestThread = { threadId: string; title: string; otherName: string; count: number };
export type Digest = { recipientId: string; email: string; name: string | null; threads: DigestThread[] };

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function threadLine(thread: DigestThread) {
	return `${plural(thread.count, 'new message', 'new messages')} from ${thread.otherName} about “${thread.title}”`;
}

/**
 * One notice per recipient: a single mail listing the threads and counts (never the texts), and an in-app
 * notice for each thread.
 */
export function digestNotice(digest: Digest, origin: string): Notice & { notices: InAppNotice[] } {
	const total = digest.threads.reduce((sum, thread) => sum + thread.count, 0);
	const lines = digest.threads.map((thread) => `• ${threadLine(thread)}\n  ${origin}/messages/${thread.threadId}`);
	return {
		userId: digest.recipientId,
		event: 'message_waiting',
		title: `${plural(total, 'message is', 'messages are')} waiting for you on Tackline`,
		body: `${plural(total, 'message has', 'messages have')} been waiting unread for a while:\n\n${lines.join('\n\n')}\n\nWe write at most once about each message, after it has waited unread for ${digestDelayMinutes} minutes. All your conversations:`,
		href: '/messages',
		notices: digest.threads.map((thread) => ({
			title: `${thread.count === 1 ? 'A message' : `${thread.count} messages`} from ${thread.otherName}`,
			body: `${threadLine(thread)}.`,
			href: `/messages/${thread.threadId}`
		}))
	};
}

/**
 * Messages unread for at least 15 minutes that nobody was mailed about yet, grouped into one digest per
 * recipient (threads and counts, never the texts). Rows are locked for the caller's transaction and
 * skipped when another run holds them; a message read meanwhile no longer matches.
 */
export async function dueDigests(
	tx: Executor,
	{ now = new Date(), limit = 1000 }: { now?: Date; limit?: number } = {}
): Promise<{ digests: Digest[]; messageIds: string[] }> {
	const cutoff = new Date(now.getTime() - digestDelayMinutes * 60_000);
	// Which side receives: the author's counterpart. A message whose author's account is gone has none.
	const result = await tx.execute<DueRow>(sql`
		with due as (
			select m.id, m.thread_id, m.author_id from message m
			where m.read_at is null and m.notified_at is null and m.created_at <= ${cutoff.toISOString()}
			order by m.created_at
			limit ${limit}
			for update skip locked
		)
		select d.id, d.thread_id as "threadId", c.title, r.id as "recipientId", r.email as "recipientEmail",
			r.name as "recipientName", r.suspended_at is not null as "recipientSuspended",
			r.id = t.tailor_id as "recipientIsTailor", cu.name as "customerName", tp.shop_name as "shopName"
		from due d
		join message_thread t on t.id = d.thread_id
		join commission c on c.id = t.commission_id
		left join "user" r on r.id = case
			when d.author_id = t.tailor_id then c.customer_id
			when d.author_id = c.customer_id then t.tailor_id
		end
		left join "user" cu on cu.id = c.customer_id
		left join tailor_profile tp on tp.user_id = t.tailor_id`);
	const byRecipient = new Map<string, Digest>();
	for (const row of result.rows) {
		if (!row.recipientId || !row.recipientEmail || row.recipientSuspended) continue;
		const digest = byRecipient.get(row.recipientId) ?? {
			recipientId: row.recipientId,
			email: row.recipientEmail,
			name: row.recipientName,
			threads: []
		};
		byRecipient.set(row.recipientId, digest);
		const thread = digest.threads.find((t) => t.threadId === row.threadId);
		if (thread) thread.count += 1;
		else
			digest.threads.push({
				threadId: row.threadId,
				title: row.title,
				// A tailor sees only the customer's first name and initial; the customer sees the workroom.
				otherName: row.recipientIsTailor ? firstNameAndInitial(row.customerName) : (row.shopName ?? 'a workroom'),
				count: 1
			});
	}
	return { digests: [...byRecipient.values()], messageIds: result.rows.map((row) => row.id) };
}

/**
 * The `message-digest` job: one mail per recipient about messages unread for 15 minutes (and an in-app
 * notice per conversation, each as the person's preferences allow), then each message is
 * marked notified so that it is never mentioned again. Suspended recipients and messages without an
 * author are marked without a mail. Answers how many mails were queued.
 */
export async function sendDigests(db: Executor, { now = new Date() }: { now?: Date } = {}) {
	const origin = publicOrigin();
	return db.transaction(async (tx) => {
		const { digests, messageIds } = await dueDigests(tx, { now });
		for (const digest of digests) await notifyGrouped(tx, digestNotice(digest, origin));
		if (messageIds.length) await tx.update(message).set({ notifiedAt: now }).where(inArray(message.id, messageIds));
		return digests.length;
	});
}
