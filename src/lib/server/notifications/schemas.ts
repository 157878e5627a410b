import { z } from 'zod';
import { notificationEvent, type UserRole } from '../db/schema';
import { catalogue, eventsFor } from './catalogue';
import type { PreferenceChange } from './preferences';

/** `GET /api/v1/notifications`: the previous page's `nextCursor`, and a page size. */
export const listQuery = z
	.object({
		cursor: z.uuid('Use the nextCursor of the previous page.').optional(),
		limit: z.coerce.number().int().min(1).max(100).default(20)
	})
	.strict();

/** `POST /api/v1/notifications/read`: some of the caller's notices by id, or all of them. */
export const readBody = z
	.object({
		ids: z.array(z.uuid()).min(1).max(100).optional(),
		all: z.literal(true).optional()
	})
	.strict()
	.refine((body) => (body.ids === undefined) !== (body.all === undefined), {
		message: 'Send either ids or all: true.',
		path: ['ids']
	})
	.meta({ id: 'MarkNotificationsRead' });

const eventName = z.enum(notificationEvent.enumValues);

/** `PUT /api/v1/account/notification-preferences`: events to change; a channel left out keeps its setting. */
export const preferencesBody = z
	.object({
		events: z
			.array(z.object({ event: eventName, email: z.boolean().optional(), inApp: z.boolean().optional() }).strict())
			.max(notificationEvent.enumValues.length)
			.refine((list) => new Set(list.map((item) => item.event)).size === list.length, 'Name each event once.')
	})
	.strict()
	.meta({ id: 'NotificationPreferencesInput' });

const ticked = z.literal('on', 'A box is either ticked or left out.').optional();

/**
 * The preferences form: a checkbox `<event>.email` and `<event>.in_app` for each event the role can turn off,
 * sent only when ticked. Any other field is refused.
 */
export function preferencesForm(role: UserRole) {
	const boxes = eventsFor(role)
		.filter((event) => !catalogue[event].required)
		.flatMap((event) => [
			[`${event}.email`, ticked],
			[`${event}.in_app`, ticked]
		]);
	return z.object(Object.fromEntries(boxes) as Record<string, typeof ticked>).strict();
}

/** Every event the role can turn off, on or off as its boxes were sent. */
export function changesFromForm(role: UserRole, fields: Record<string, string | undefined>): PreferenceChange[] {
	return eventsFor(role)
		.filter((event) => !catalogue[event].required)
		.map((event) => ({
			event,
			email: fields[`${event}.email`] === 'on',
			inApp: fields[`${event}.in_app`] === 'on'
		}));
}
