import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { parseQuery } from '$lib/server/http/respond';
import * as notifications from '$lib/server/notifications';
import type { RequestHandler } from './$types';

/** The caller's notices, newest first: `{ items, nextCursor, unreadCount }`. */
export const GET: RequestHandler = async ({ url, locals }) => {
	const user = requireUser();
	const query = parseQuery(url, notifications.schemas.listQuery);
	if (!query.ok) return query.response;
	return json(await notifications.list(locals.db, { userId: user.id, ...query.data }));
};
