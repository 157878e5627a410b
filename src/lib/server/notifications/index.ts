import * as accounts from '../accounts';
import { publicOrigin } from '../auth/origin';
import type { Executor } from '../db';
import { notification, type NotificationEvent } from '../db/schema';
import * as mail from '../mail';
import type { MailAttachment } from '../mail';

export type { NotificationEvent } from '../db/schema';

/** One thing to tell one person: a short title, a few plain-text paragraphs, and the page it is about. */
export type Notice = {
	userId: string;
	event: NotificationEvent;
	/** The mail's subject and the in-app title, in our own words. */
	title: string;
	/** Plain text; paragraphs separated by a blank line. Never a message's text or anything private. */
	body: string;
	/** A path inside Tackline (`/orders/…`). */
	href: string;
	/** Files for the mail only (a fitting's `.ics`). */
	attachments?: MailAttachment[];
};

/**
 * Tells one person about an event, inside the caller's transaction: an in-app notification and a mail
 * through the mail queue (sent with retries only if the change commits). The one way areas notify people.
 */
export async function notify(tx: Executor, notice: Notice): Promise<void> {
	const person = await accounts.getProfile(tx, { id: notice.userId });
	if (!person) return;
	await tx.insert(notification).values({
		userId: notice.userId,
		event: notice.event,
		title: notice.title,
		body: notice.body,
		href: notice.href
	});
	const link = `${publicOrigin()}${notice.href}`;
	await mail.queue(tx, {
		to: person.email,
		subject: notice.title,
		text: `Hello${person.name ? ` ${person.name}` : ''},\n\n${notice.body}\n\n${link}\n\n— Tackline`,
		attachments: notice.attachments
	});
}
