import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import * as notifications from '$lib/server/notifications';
import type { RequestHandler } from './$types';

/** Marks the caller's notices read, `{ ids }` or `{ all: true }` → `{ marked, unreadCount }`; others' ids are ignored. */
export const POST: RequestHandler = async ({ request, locals }) => {
	const user = requireUser();
	const body = await parseJsonBody(request, notifications.schemas.readBody);
	if (!body.ok) return body.response;
	const marked = await notifications.markRead(locals.db, { userId: user.id, ...body.data });
	return json({ marked, unreadCount: await notifications.unreadCount(locals.db, { userId: user.id }) });
};
