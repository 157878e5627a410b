import { requireUser } from '$lib/server/auth/guard';
import { apiError, parseQuery } from '$lib/server/http/respond';
import * as messages from '$lib/server/messages';
import { refused } from '../../respond.server';
import type { RequestHandler } from './$types';

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * The conversation live, as server-sent events: each new message as `event: message` with its id, after
 * first sending everything since `Last-Event-ID` (or `?after=`); a comment every 20 s keeps it open.
 */
export const GET: RequestHandler = async ({ params, url, request, locals }) => {
	const user = requireUser();
	const query = parseQuery(url, messages.schemas.eventsQuery);
	if (!query.ok) return query.response;
	const lastEventId = request.headers.get('last-event-id')?.trim();
	if (lastEventId && !uuidPattern.test(lastEventId))
		return apiError(400, 'invalid_input', 'Last-Event-ID must be the id of a message.', [
			{ path: 'Last-Event-ID', message: 'Not a message id.' }
		]);
	let stream: ReadableStream<Uint8Array>;
	try {
		stream = await messages.openStream(locals.db, {
			threadId: params.id,
			viewer: user,
			after: lastEventId || query.data.after || null,
			signal: request.signal
		});
	} catch (error) {
		return refused(error);
	}
	return new Response(stream, {
		headers: {
			'content-type': 'text/event-stream; charset=utf-8',
			'cache-control': 'no-cache, no-store, no-transform',
			connection: 'keep-alive',
			'x-accel-buffering': 'no'
		}
	});
};
