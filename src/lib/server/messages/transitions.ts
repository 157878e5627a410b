import { and, eq, isNull, sql } from 'drizzle-orm';
import { maxAttachments, type MessageView } from '$lib/types/messages';
import * as audit from '../audit';
import type { Executor } from '../db';
import { message, messageAttachment, messageThread } from '../db/schema';
import { storeUpload, type StoredPhoto, type Upload } from '../photos';
import * as workrooms from '../workrooms';
import { isSuspended, openness, sideOf, threadFacts, type ThreadFacts } from './access';
import { MessageError, noSuchThread } from './errors';
import { toViews } from './queries';
import { messageText } from './schemas';
import { openThread } from './threads';

/** Who acts: the signed-in person, with the request's address for the audit log. */
export type Actor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };

export type AttachmentInput = { file: Upload; altText?: string };

/** The notification channel every app process listens on; the payload names the thread and the message. */
export const messagesChannel = 'tackline_messages';

function checkedBody(body: string, attachments: number) {
	const parsed = messageText.safeParse(body);
	if (!parsed.success)
		throw new MessageError('invalid', parsed.error.issues[0]?.message ?? 'Check the message.', [
			{ path: 'body', message: parsed.error.issues[0]?.message ?? 'Check the message.' }
		]);
	if (parsed.data.length === 0 && attachments === 0)
		throw new MessageError('invalid', 'Write a message.', [{ path: 'body', message: 'Write a message.' }]);
	if (attachments > maxAttachments)
		throw new MessageError('invalid', `Send at most ${maxAttachments} photos with one message.`, [
			{ path: 'file', message: `Send at most ${maxAttachments} photos with one message.` }
		]);
	return parsed.data;
}

/** The thread, with the actor's right to write in it checked: a participant, not suspended, the thread open. */
async function writable(db: Executor, threadId: string, actor: Actor, options: { lock?: boolean } = {}) {
	const facts = await threadFacts(db, threadId, options);
	const side = facts && sideOf(facts, actor);
	if (!facts || !side) throw noSuchThread();
	if (await isSuspended(db, actor.id)) throw new MessageError('forbidden', 'This account is suspended.');
	const state = openness(facts, side);
	if (!state.open) throw new MessageError('closed', state.closedReason ?? 'This conversation is closed.');
	return facts;
}

/**
 * Writes the message inside the caller's transaction, with the thread row locked: within one thread,
 * `created_at` (taken after the lock) follows commit order, so "everything after message X" never skips
 * one that committed late. The notification goes out when the transaction commits.
 */
async function insertMessage(
	tx: Executor,
	{
		facts,
		actor,
		body,
		photos
	}: { facts: ThreadFacts; actor: Actor; body: string; photos: (StoredPhoto & { altText: string })[] }
) {
	const [row] = await tx
		.insert(message)
		.values({ threadId: facts.id, authorId: actor.id, body, createdAt: sql`clock_timestamp()` })
		.returning();
	await tx.update(messageThread).set({ lastMessageAt: row.createdAt }).where(eq(messageThread.id, facts.id));
	if (photos.length) {
		await tx.insert(messageAttachment).values(
			photos.map((photo, index) => ({
				messageId: row.id,
				storageKey: photo.key,
				thumbKey: photo.thumbKey,
				fileName: `photo-${index + 1}.webp`,
				contentType: photo.contentType,
				bytes: photo.bytes,
				width: photo.width,
				height: photo.height,
				altText: photo.altText
			}))
		);
	}
	await tx.execute(
		sql`select pg_notify(${messagesChannel}, ${JSON.stringify({
			threadId: facts.id,
			messageId: row.id,
			people: [facts.customerId, facts.tailorId]
		})})`
	);
	const [view] = await toViews(tx, [row], actor.id);
	return view;
}

/** Stores each upload (checked and re-encoded), then runs `save`; if it throws, the stored objects go again. */
async function withStored<T>(
	inputs: AttachmentInput[],
	save: (photos: (StoredPhoto & { altText: string })[]) => Promise<T>,
	done: (StoredPhoto & { altText: string })[] = []
): Promise<T> {
	if (inputs.length === 0) return save(done);
	const [first, ...rest] = inputs;
	return storeUpload(first.file, (stored) =>
		withStored(rest, save, [...done, { ...stored, altText: first.altText ?? '' }])
	);
}

/**
 * Posts a message in a thread: the commission's customer and the thread's tailor only (others are told it
 * does not exist), not while suspended, and only while the thread is open. Plain text of 1–4000
 * characters after trimming (it may be empty beside a photo); photos go through the photo pipeline.
 */
export async function post(
	db: Executor,
	{
		threadId,
		actor,
		body,
		attachments = []
	}: { threadId: string; actor: Actor; body: string; attachments?: AttachmentInput[] }
): Promise<MessageView> {
	const text = checkedBody(body, attachments.length);
	// Checked before any photo is processed, so a stranger's upload costs nothing; checked again under the lock.
	await writable(db, threadId, actor);
	return withStored(attachments, (photos) =>
		db.transaction(async (tx) => {
			const facts = await writable(tx, threadId, actor, { lock: true });
			return insertMessage(tx, { facts, actor, body: text, photos });
		})
	);
}

/** Marks every message the viewer received in the thread as read; answers how many changed. */
export async function markRead(db: Executor, { threadId, viewer }: { threadId: string; viewer: { id: string } }) {
	const facts = await threadFacts(db, threadId);
	if (!facts || !sideOf(facts, viewer)) throw noSuchThread();
	const changed = await db
		.update(message)
		.set({ readAt: new Date() })
		.where(
			and(
				eq(message.threadId, threadId),
				isNull(message.readAt),
				sql`${message.authorId} is distinct from ${viewer.id}`
			)
		)
		.returning({ id: message.id, readAt: message.readAt });
	if (changed.length) {
		// The other side's "read" marks and both sides' unread counts follow live (see live.ts).
		const payload = {
			threadId,
			readBy: viewer.id,
			readAt: changed[0].readAt!.toISOString(),
			people: [facts.customerId, facts.tailorId]
		};
		await db.execute(sql`select pg_notify(${messagesChannel}, ${JSON.stringify(payload)})`);
	}
	return changed.length;
}

/**
 * A tailor's question on an open commission: opens the thread with its customer (or finds the one a quote
 * opened) and posts the question. Only tailors whose workroom is set up may ask, as only they may quote.
 */
export async function startQuestion(
	db: Executor,
	{ commissionId, actor, body }: { commissionId: string; actor: Actor; body: string }
): Promise<{ threadId: string; message: MessageView }> {
	if (actor.role !== 'tailor') throw new MessageError('forbidden', 'Only tailors ask questions on a commission.');
	const text = checkedBody(body, 0);
	// An onboarded, listed workroom (the stored mark; no onboarding repair runs from here).
	if (!(await workrooms.getPublic(db, { slugOrId: actor.id })))
		throw new MessageError('not_onboarded', 'Finish setting up your workroom before you ask customers questions.');
	return db.transaction(async (tx) => {
		const status = await commissionStatus(tx, commissionId);
		if (status !== 'open') throw new MessageError('not_found', 'There is no such open commission.');
		const thread = await openThread(tx, { commissionId, tailorId: actor.id });
		const facts = await writable(tx, thread.id, actor, { lock: true });
		const posted = await insertMessage(tx, { facts, actor, body: text, photos: [] });
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'message.question_asked',
			subjectType: 'commission',
			subjectId: commissionId,
			data: { threadId: thread.id }
		});
		return { threadId: thread.id, message: posted };
	});
}

/** A commission's status (locked for the transaction) or null; the one commission read this module makes. */
async function commissionStatus(tx: Executor, commissionId: string) {
	const result = await tx.execute<{ status: string }>(
		sql`select status from commission where id = ${commissionId} for share`
	);
	return result.rows[0]?.status ?? null;
}
