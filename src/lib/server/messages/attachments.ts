import { eq } from 'drizzle-orm';
import type { PhotoVariant } from '$lib/types/photos';
import type { Executor } from '../db';
import { message, messageAttachment } from '../db/schema';
import { openVariant } from '../photos';
import { sideOf, threadFacts } from './access';

/**
 * A photo sent in a conversation, as a stream for a same-origin route, after checking that the viewer is
 * the thread's customer or tailor. Null when it does not exist or the viewer takes no part.
 */
export async function openAttachment(
	db: Executor,
	{ attachmentId, variant, viewer }: { attachmentId: string; variant: PhotoVariant; viewer: { id: string } | null }
) {
	if (!viewer) return null;
	const [row] = await db
		.select({ key: messageAttachment.storageKey, thumbKey: messageAttachment.thumbKey, threadId: message.threadId })
		.from(messageAttachment)
		.innerJoin(message, eq(message.id, messageAttachment.messageId))
		.where(eq(messageAttachment.id, attachmentId))
		.limit(1);
	if (!row) return null;
	const facts = await threadFacts(db, row.threadId);
	if (!facts || !sideOf(facts, viewer)) return null;
	return openVariant(row, variant);
}
