import * as messages from '$lib/server/messages';
import * as notifications from '$lib/server/notifications';
import type { LayoutServerLoad } from './$types';

/**
 * Every page gets the signed-in person and, for them only, how many messages and notices wait unread (no DB
 * work otherwise; one count query each, run side by side).
 */
export const load: LayoutServerLoad = async ({ locals, depends }) => {
	depends('messages:unread');
	depends('notifications:unread');
	const user = locals.user;
	if (!user) return { user: null, unreadMessages: 0, unreadNotifications: 0 };
	const [unreadMessages, unreadNotifications] = await Promise.all([
		messages.unreadCount(locals.db, user),
		notifications.unreadCount(locals.db, { userId: user.id })
	]);
	return { user, unreadMessages, unreadNotifications };
};
