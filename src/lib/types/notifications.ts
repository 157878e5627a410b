/** What the browser is sent about notices and preferences (never database rows). */

export type NoticeGroupId = 'quotes' | 'payments' | 'work' | 'fittings' | 'messages' | 'desk';

/** One in-app notice; `href` is always a path inside Tackline. */
export type NotificationDto<E extends string = string> = {
	id: string;
	event: E;
	title: string;
	body: string;
	href: string;
	read: boolean;
	readAt: string | null;
	createdAt: string;
};

export type NotificationPage<E extends string = string> = {
	items: NotificationDto<E>[];
	nextCursor: string | null;
	unreadCount: number;
};

/** One row of the preferences grid. `required` says why it cannot be turned off, when it cannot. */
export type EventPreferenceDto<E extends string = string> = {
	event: E;
	group: NoticeGroupId;
	label: string;
	description: string;
	required: 'money' | 'meeting' | null;
	email: boolean;
	inApp: boolean;
};
