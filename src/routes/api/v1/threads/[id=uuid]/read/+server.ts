import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import * as messages from '$lib/server/messages';
import { refused } from '../../respond.server';
import type { RequestHandler } from './$types';

/** Marks every message the caller received in the thread as read → `{ marked }`. */
export const POST: RequestHandler = async ({ params, locals }) => {
	const user = requireUser();
	try {
		return json({ marked: await messages.markRead(locals.db, { threadId: params.id, viewer: user }) });
	} catch (error) {
		return refused(error);
	}
};
