import { z } from 'zod';
import { maxAttachments } from '$lib/types/messages';
import { eventsQuery, messagesQuery, postBody, sendFields, threadsQuery } from '../../messages/schemas';
import { markedResponse, messageDto, messagePage, threadPage } from '../../messages/response-schemas';
import { access, errors, jsonBody, uuidPath, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Messages'];
const id = uuidPath('id');
const participants = 'For the commission’s customer and the tailor of the conversation; anyone else gets 404.';

const photo = z.string().meta({
	description: 'A photo (JPEG, PNG or WebP; up to 15 MB). Its content decides, never its name.',
	override: { type: 'string', contentMediaType: 'application/octet-stream' }
});

/** A new message: JSON `{ body }`, or multipart with the text, photos in `file` and their `altText`. */
const newMessage = {
	required: true,
	content: {
		'application/json': { schema: postBody },
		'multipart/form-data': {
			schema: sendFields.extend({
				file: z
					.array(photo)
					.max(maxAttachments)
					.optional()
					.meta({ description: `Up to ${maxAttachments} photos, each as a \`file\` part.` })
			})
		}
	}
};

const paths: Paths = {
	'/api/v1/threads': {
		get: {
			operationId: 'listThreads',
			tags,
			summary: 'List the caller’s conversations',
			...access(
				'signedIn',
				'Every conversation the caller takes part in, unread ones first, then by their latest message; `nextCursor` fetches the next page.'
			),
			requestParams: { query: threadsQuery },
			responses: { '200': jsonBody(threadPage, 'A page of conversations.'), ...errors(400, 401) }
		}
	},
	'/api/v1/threads/{id}/messages': {
		get: {
			operationId: 'listMessages',
			tags,
			summary: 'Read a conversation',
			...access('signedIn', `${participants} Newest first; \`nextCursor\` fetches the older page.`),
			requestParams: { ...id, query: messagesQuery },
			responses: { '200': jsonBody(messagePage, 'A page of messages.'), ...errors(400, 401, 404) }
		},
		post: {
			operationId: 'postMessage',
			tags,
			summary: 'Send a message',
			...access(
				'signedIn',
				`${participants} JSON \`{ body }\`, or multipart with \`body\`, photos in \`file\` and their \`altText\` (the text may then be empty). Photos are re-encoded on arrival, metadata removed. 409 once the conversation is closed.`
			),
			requestParams: id,
			requestBody: newMessage,
			responses: {
				'201': jsonBody(messageDto, 'The message sent.'),
				...errors(400, 401, 403, 404, 409, 413, 415, 422)
			}
		}
	},
	'/api/v1/threads/{id}/read': {
		post: {
			operationId: 'markThreadRead',
			tags,
			summary: 'Mark a conversation read',
			...access('signedIn', `${participants} Marks every message the caller received in it as read.`),
			requestParams: id,
			responses: { '200': jsonBody(markedResponse, 'How many messages were marked.'), ...errors(401, 404) }
		}
	},
	'/api/v1/threads/{id}/events': {
		get: {
			operationId: 'streamThread',
			tags,
			summary: 'Follow a conversation live',
			...access(
				'signedIn',
				`${participants} Server-sent events: first every message since \`Last-Event-ID\` (or \`?after=\`; the header wins), then each new one as it arrives, as \`event: message\` with the message's id as the event id and a \`Message\` as JSON data. A comment line every 20 seconds keeps the connection open.`
			),
			requestParams: {
				...id,
				query: eventsQuery,
				header: z.object({
					'last-event-id': z
						.uuid()
						.optional()
						.meta({ description: 'The id of the last message received; an EventSource sends it on reconnecting.' })
				})
			},
			responses: {
				'200': {
					description: 'The event stream; it stays open.',
					content: {
						'text/event-stream': {
							schema: z.string().meta({
								description:
									'Events of the form `id: <message id>`, `event: message`, `data: <Message as JSON>`; and, when the other side reads the conversation, `event: read` with `data: {"readAt": <ISO time>}` (no id): what the viewer sent by then is read.'
							})
						}
					}
				},
				...errors(400, 401, 404)
			}
		}
	},
	'/api/v1/threads/events': {
		get: {
			operationId: 'streamUnreadCount',
			tags,
			summary: 'Follow your unread count live',
			...access(
				'signedIn',
				'Server-sent events: `event: unread` with `data: {"count": <messages waiting unread>}` at once, then whenever a message is posted or read in one of your conversations. A comment line every 20 seconds keeps the connection open.'
			),
			responses: {
				'200': {
					description: 'The event stream; it stays open.',
					content: {
						'text/event-stream': {
							schema: z.string().meta({ description: 'Events of the form `event: unread`, `data: {"count": 3}`.' })
						}
					}
				},
				...errors(401)
			}
		}
	}
};

export const messagesArea: Area = {
	tag: {
		name: 'Messages',
		description:
			'Conversations between a commission’s customer and each tailor who quotes or asks about it: reading, sending with photos, unread marks and the live stream.'
	},
	paths
};
