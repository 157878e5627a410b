import * as messages from '$lib/server/messages';
import type { LayoutServerLoad } from './$types';

/** Every page gets the signed-in person and, for them only, how many messages wait unread (no DB work otherwise). */
export const load: LayoutServerLoad = async ({ locals, depends }) => {
	depends('messages:unread');
	const user = locals.user;
	if (!user) return { user: null, unreadMessages: 0 };
	return { user, unreadMessages: await messages.unreadCount(locals.db, user) };
};
