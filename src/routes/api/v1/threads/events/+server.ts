import { requireUser } from '$lib/server/auth/guard';
import * as messages from '$lib/server/messages';
import type { RequestHandler } from './$types';

/**
 * The signed-in person's unread count, live, as server-sent events: `event: unread` with `{ count }` at
 * once and whenever a message is posted or read in one of their conversations; a comment every 20 s.
 */
export const GET: RequestHandler = async ({ request, locals }) => {
	const user = requireUser();
	const stream = await messages.openUnreadStream(locals.db, { viewer: user, signal: request.signal });
	return new Response(stream, {
		headers: {
			'content-type': 'text/event-stream; charset=utf-8',
			'cache-control': 'no-cache, no-store, no-transform',
			connection: 'keep-alive',
			'x-accel-buffering': 'no'
		}
	});
};
