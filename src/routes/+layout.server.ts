import * as messages from '$lib/server/messages';
import type { LayoutServerLoad } from './$types';

/**
 * Every page gets the signed-in person and, for them only, how many messages and notices wait unread (no DB
 * work otherwise; both counts in one statement).
 */
export const load: LayoutServerLoad = async ({ locals, depends }) => {
	depends('messages:unread');
	depends('notifications:unread');
	const user = locals.user;
	if (!user) return { user: null, unreadMessages: 0, unreadNotifications: 0 };
	const unread = await messages.unreadCounts(locals.db, user);
	return { user, unreadMessages: unread.messages, unreadNotifications: unread.notices };
};
