import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { parseQuery } from '$lib/server/http/respond';
import * as messages from '$lib/server/messages';
import type { RequestHandler } from './$types';

/** The signed-in person's conversations, unread first: `{ items, nextCursor }`. */
export const GET: RequestHandler = async ({ url, locals }) => {
	const user = requireUser();
	const query = parseQuery(url, messages.schemas.threadsQuery);
	if (!query.ok) return query.response;
	return json(await messages.threadsFor(locals.db, { viewer: user, ...query.data }));
};
