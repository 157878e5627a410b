import { sql } from 'drizzle-orm';
import { boolean, index, pgEnum, pgTable, primaryKey, text, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, instant } from './columns';
import { user } from './auth';

/** Everything Tackline tells people about; preferences are kept per event and channel. */
export const notificationEvent = pgEnum('notification_event', [
	'quote_received',
	'quote_accepted',
	'quote_declined',
	'payment_received',
	'payment_failed',
	'progress_posted',
	'fabric_approval',
	'advance_released',
	'fitting_offered',
	'fitting_booked',
	'fitting_cancelled',
	'fitting_reminder',
	'delivered',
	'alteration_requested',
	'released',
	'refunded',
	'order_cancelled',
	'message_waiting',
	'money_stuck'
]);
export const notificationChannel = pgEnum('notification_channel', ['email', 'in_app']);

/** An in-app notification: what happened, where to look, and whether its person has seen it. */
export const notification = pgTable(
	'notification',
	{
		id: id(),
		userId: uuid('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		event: notificationEvent('event').notNull(),
		title: text('title').notNull(),
		body: text('body').notNull().default(''),
		/** A path inside Tackline (`/orders/…`), never an outside address. */
		href: text('href').notNull(),
		readAt: instant('read_at'),
		createdAt: createdAt()
	},
	(t) => [
		index('notification_user_created_idx').on(t.userId, t.createdAt),
		index('notification_user_unread_idx')
			.on(t.userId)
			.where(sql`${t.readAt} is null`)
	]
);
export type Notification = typeof notification.$inferSelect;
export type NewNotification = typeof notification.$inferInsert;
export type NotificationEvent = (typeof notificationEvent.enumValues)[number];
export type NotificationChannel = (typeof notificationChannel.enumValues)[number];

/** A person's choice for one event on one channel; no row means the default (on). */
export const notificationPreference = pgTable(
	'notification_preference',
	{
		userId: uuid('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		event: notificationEvent('event').notNull(),
		channel: notificationChannel('channel').notNull(),
		enabled: boolean('enabled').notNull()
	},
	(t) => [primaryKey({ columns: [t.userId, t.event, t.channel] })]
);
export type NotificationPreference = typeof notificationPreference.$inferSelect;
