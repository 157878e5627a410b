import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { parseQuery } from '$lib/server/http/respond';
import * as messages from '$lib/server/messages';
import { actorOf, readMessage, refused } from '../../respond.server';
import type { RequestHandler } from './$types';

/** A page of the conversation, newest first: `{ items, nextCursor }` (nextCursor fetches older ones). */
export const GET: RequestHandler = async ({ params, url, locals }) => {
	const user = requireUser();
	const query = parseQuery(url, messages.schemas.messagesQuery);
	if (!query.ok) return query.response;
	try {
		return json(await messages.list(locals.db, { threadId: params.id, viewer: user, ...query.data }));
	} catch (error) {
		return refused(error);
	}
};

/** `{ body }` as JSON, or multipart with `body`, a photo in `file` and its `altText` → 201 the message. */
export const POST: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireUser();
	const input = await readMessage(request);
	if (!input.ok) return input.response;
	try {
		const posted = await messages.post(locals.db, {
			threadId: params.id,
			actor: actorOf(user, getClientAddress()),
			body: input.body,
			attachments: input.attachments
		});
		return json(posted, { status: 201 });
	} catch (error) {
		return refused(error);
	}
};
