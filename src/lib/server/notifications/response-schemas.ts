import { z } from 'zod';
import { notificationEvent } from '../db/schema';

/* The JSON answers of /api/v1/notifications and /api/v1/account/notification-preferences. */

const eventName = z.enum(notificationEvent.enumValues);

export const notificationDto = z
	.object({
		id: z.uuid(),
		event: eventName,
		title: z.string(),
		body: z.string().meta({ description: 'Plain text; paragraphs separated by a blank line.' }),
		href: z.string().meta({ description: 'A path inside Tackline, starting with one `/`.' }),
		read: z.boolean(),
		readAt: z.iso.datetime().nullable(),
		createdAt: z.iso.datetime()
	})
	.meta({ id: 'Notification' });

export const notificationPage = z
	.object({
		items: z.array(notificationDto),
		nextCursor: z.uuid().nullable(),
		unreadCount: z
			.int()
			.min(0)
			.max(100)
			.meta({ description: 'Unread notices, counted up to 100 (shown as “99+” past 99).' })
	})
	.meta({ id: 'NotificationPage', description: 'Newest first; nextCursor fetches the older page.' });

export const readResponse = z
	.object({
		marked: z.int().min(0).meta({ description: 'How many notices were newly marked read.' }),
		unreadCount: z.int().min(0).max(100)
	})
	.meta({ id: 'NotificationsMarkedRead' });

export const eventPreference = z
	.object({
		event: eventName,
		group: z.enum(['quotes', 'payments', 'work', 'fittings', 'messages', 'desk']),
		label: z.string(),
		description: z.string(),
		required: z.enum(['money', 'meeting']).nullable().meta({
			description: 'Why both channels are always on (money or meeting someone); null when they may be turned off.'
		}),
		email: z.boolean(),
		inApp: z.boolean()
	})
	.meta({ id: 'NotificationPreference' });

export const preferencesResponse = z
	.object({ events: z.array(eventPreference) })
	.meta({ id: 'NotificationPreferences', description: 'Every event the caller’s account can receive.' });
