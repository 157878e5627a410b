import { z } from 'zod';
import { maxAttachments } from '$lib/types/messages';

/* The JSON answers of /api/v1/threads/…, as the messages area builds them (`MessageView`, `ThreadSummary`). */

/** A photo sent with a message: same-origin addresses that check the viewer takes part in the thread. */
export const attachmentDto = z
	.object({
		id: z.uuid(),
		url: z.string(),
		thumbUrl: z.string(),
		width: z.number().int().nullable(),
		height: z.number().int().nullable(),
		altText: z.string()
	})
	.meta({ id: 'MessageAttachment' });

/** A message; `mine` is from the caller's side. The live stream sends the same object as each event's data. */
export const messageDto = z
	.object({
		id: z.uuid(),
		threadId: z.uuid(),
		authorId: z.uuid().nullable(),
		mine: z.boolean(),
		body: z.string(),
		createdAt: z.iso.datetime(),
		readAt: z.iso.datetime().nullable(),
		attachments: z.array(attachmentDto).max(maxAttachments)
	})
	.meta({ id: 'Message' });

export const messagePage = z
	.object({ items: z.array(messageDto), nextCursor: z.uuid().nullable() })
	.meta({ id: 'MessagePage', description: 'Newest first; nextCursor fetches the older page.' });

/** One conversation in the caller's inbox. */
export const threadDto = z
	.object({
		id: z.uuid(),
		commission: z.object({ id: z.uuid(), title: z.string(), status: z.string() }),
		otherParty: z.object({ id: z.uuid().nullable(), name: z.string(), role: z.enum(['customer', 'tailor']) }),
		lastMessage: z
			.object({ preview: z.string(), at: z.iso.datetime(), mine: z.boolean(), hasAttachments: z.boolean() })
			.nullable(),
		unreadCount: z.number().int().min(0)
	})
	.meta({ id: 'Thread' });

export const threadPage = z
	.object({ items: z.array(threadDto), nextCursor: z.uuid().nullable() })
	.meta({ id: 'ThreadPage', description: 'Unread conversations first, then by latest message.' });

/** `POST /api/v1/threads/{id}/read`. */
export const markedResponse = z
	.object({ marked: z.int().min(0).meta({ description: 'How many messages were newly marked read.' }) })
	.meta({ id: 'MarkedRead' });
