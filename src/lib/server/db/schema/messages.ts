import { sql } from 'drizzle-orm';
import { check, index, integer, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, instant } from './columns';
import { user } from './auth';
import { commission } from './commissions';
import { tailorProfile } from './tailors';

/** One conversation per commission and tailor; the customer is the commission's owner. */
export const messageThread = pgTable(
	'message_thread',
	{
		id: id(),
		commissionId: uuid('commission_id')
			.notNull()
			.references(() => commission.id, { onDelete: 'cascade' }),
		tailorId: uuid('tailor_id')
			.notNull()
			.references(() => tailorProfile.userId, { onDelete: 'cascade' }),
		lastMessageAt: instant('last_message_at'),
		createdAt: createdAt()
	},
	(t) => [
		unique('message_thread_commission_tailor_uq').on(t.commissionId, t.tailorId),
		index('message_thread_tailor_idx').on(t.tailorId, t.lastMessageAt)
	]
);
export type MessageThread = typeof messageThread.$inferSelect;
export type NewMessageThread = typeof messageThread.$inferInsert;

export const message = pgTable(
	'message',
	{
		id: id(),
		threadId: uuid('thread_id')
			.notNull()
			.references(() => messageThread.id, { onDelete: 'cascade' }),
		// The other party keeps the conversation (and a dispute its evidence) if the author's account goes.
		authorId: uuid('author_id').references(() => user.id, { onDelete: 'set null' }),
		body: text('body').notNull(),
		readAt: instant('read_at'),
		/** When the recipient was e-mailed about it while it sat unread (batched). */
		notifiedAt: instant('notified_at'),
		createdAt: createdAt()
	},
	(t) => [
		index('message_thread_created_idx').on(t.threadId, t.createdAt, t.id),
		index('message_unread_unnotified_idx')
			.on(t.createdAt)
			.where(sql`${t.readAt} is null and ${t.notifiedAt} is null`)
	]
);
export type Message = typeof message.$inferSelect;
export type NewMessage = typeof message.$inferInsert;

export const messageAttachment = pgTable(
	'message_attachment',
	{
		id: id(),
		messageId: uuid('message_id')
			.notNull()
			.references(() => message.id, { onDelete: 'cascade' }),
		storageKey: text('storage_key').notNull().unique(),
		fileName: text('file_name').notNull(),
		contentType: text('content_type').notNull(),
		bytes: integer('bytes').notNull(),
		width: integer('width'),
		height: integer('height'),
		/** The 480 px re-encoded copy (photos go through the same pipeline as commission photos). */
		thumbKey: text('thumb_key').unique(),
		altText: text('alt_text').notNull().default(''),
		createdAt: createdAt()
	},
	(t) => [
		index('message_attachment_message_idx').on(t.messageId),
		check('message_attachment_bytes_positive', sql`${t.bytes} > 0`)
	]
);
export type MessageAttachment = typeof messageAttachment.$inferSelect;
export type NewMessageAttachment = typeof messageAttachment.$inferInsert;
