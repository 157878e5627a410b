import * as accounts from '../accounts';
import { publicOrigin } from '../auth/origin';
import type { Executor } from '../db';
import { notification, type NotificationEvent } from '../db/schema';
import * as mail from '../mail';
import type { MailAttachment } from '../mail';
import { catalogue, reaches } from './catalogue';
import { isInternalPath, noticeMail } from './layout';
import { wants } from './preferences';

export type { NotificationEvent } from '../db/schema';
export { catalogue, eventsFor, groups, notificationEvents } from './catalogue';
export { escapeHtml, isInternalPath, noticeMail, preferencesPath } from './layout';
export { list, markRead, unreadCount, unreadCountExpression, unreadCap, hrefOf } from './queries';
export * as preferences from './preferences';
export { PreferenceRefused, type EventPreference, type PreferenceChange, type PreferenceGroup } from './preferences';
export * as schemas from './schemas';

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

/** A short in-app notice that goes with a grouped mail (one per conversation in a message digest). */
export type InAppNotice = Pick<Notice, 'title' | 'body' | 'href'>;

function requireInternal(href: string) {
	if (!isInternalPath(href)) throw new Error(`A notice must point inside Tackline, not to ${JSON.stringify(href)}`);
}

/**
 * Tells one person about an event, inside the caller's transaction: an in-app notification and a mail
 * through the mail queue (sent with retries only if the change commits), each unless the person turned that
 * channel off for this event. Events about money or meetings are always sent; `money_stuck` reaches only
 * administrators. The one way areas notify people.
 */
export async function notify(tx: Executor, notice: Notice): Promise<void> {
	requireInternal(notice.href);
	const person = await accounts.getProfile(tx, { id: notice.userId });
	if (!person || !reaches(notice.event, person.role)) return;
	const channels = await wants(tx, { userId: notice.userId, event: notice.event });
	if (channels.inApp)
		await tx.insert(notification).values({
			userId: notice.userId,
			event: notice.event,
			title: notice.title,
			body: notice.body,
			href: notice.href
		});
	if (channels.email) await queueMail(tx, { ...notice, to: person.email, name: person.name });
}

/**
 * One mail about several things (the message digest) and one in-app notice for each of them, with the same
 * preference checks as `notify`. The mail links to `href`; each in-app notice to its own page.
 */
export async function notifyGrouped(
	tx: Executor,
	{ notices, ...digest }: Notice & { notices: InAppNotice[] }
): Promise<void> {
	requireInternal(digest.href);
	notices.forEach((notice) => requireInternal(notice.href));
	const person = await accounts.getProfile(tx, { id: digest.userId });
	if (!person || !reaches(digest.event, person.role)) return;
	const channels = await wants(tx, { userId: digest.userId, event: digest.event });
	if (channels.inApp && notices.length)
		await tx
			.insert(notification)
			.values(notices.map((notice) => ({ userId: digest.userId, event: digest.event, ...notice })));
	if (channels.email) await queueMail(tx, { ...digest, to: person.email, name: person.name });
}

async function queueMail(tx: Executor, notice: Notice & { to: string; name: string | null }) {
	const info = catalogue[notice.event];
	await mail.queue(
		tx,
		noticeMail({
			to: notice.to,
			name: notice.name,
			title: notice.title,
			body: notice.body,
			href: notice.href,
			action: info.action,
			required: info.required,
			origin: publicOrigin(),
			attachments: notice.attachments
		})
	);
}
