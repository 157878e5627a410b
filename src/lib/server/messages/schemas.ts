import { z } from 'zod';
import { maxMessageLength } from '$lib/types/messages';
import { maxAltTextLength } from '$lib/types/photos';
import { text } from '../forms';

/** A message's text: plain, trimmed, line breaks allowed, 1–4000 characters (empty only beside a photo). */
export const messageText = text({
	max: maxMessageLength,
	multiline: true,
	tooLong: `Keep a message under ${maxMessageLength} characters.`
});

/** `POST /api/v1/threads/{id}/messages` as JSON. */
export const postBody = z
	.object({ body: messageText.pipe(z.string().min(1, 'Write a message.')) })
	.strict()
	.meta({ id: 'MessageInput' });

/** The send form (and the multipart API): text, and optionally one photo with its description. */
export const sendFields = z.object({
	body: messageText,
	altText: text({ max: maxAltTextLength }).default('')
});

/** A tailor's first question on an open commission. */
export const questionFields = z.object({ body: messageText.pipe(z.string().min(1, 'Write your question.')) });

const cursor = z.uuid('Use the nextCursor of the previous page.').optional();

export const messagesQuery = z.object({ cursor, limit: z.coerce.number().int().min(1).max(100).default(30) }).strict();

export const threadsQuery = z.object({ cursor, limit: z.coerce.number().int().min(1).max(100).default(20) }).strict();

/** `?after=` on the live stream (the `Last-Event-ID` header says the same and wins). */
export const eventsQuery = z.object({ after: z.uuid('Use the id of the last message received.').optional() }).strict();
