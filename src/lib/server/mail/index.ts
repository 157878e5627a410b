import type { Executor } from '../db';
import * as jobs from '../jobs';
import { mailFrom, mailer } from '../services/mailer';
import { noteRelayAnswered, noteRelayFailed } from './relay';
import type { Mail } from './types';

export { relayStatus, type RelayStatus } from './relay';
export type { Mail, MailAttachment } from './types';
export { discardDeadLetter, listDeadLetters, resendDeadLetter, type DeadLetter } from './dead-letters';

/**
 * Queues a mail inside the caller's transaction: it is sent (with retries) only if the change that
 * causes it commits, and the request never waits on the relay. The one way domain code sends mail.
 */
export async function queue(db: Executor, mail: Mail) {
	await jobs.enqueue(db, jobs.queueNames.mail, mail);
}

/** The mail queue's worker: one attempt at the relay. A throw is retried with back-off, then dead-lettered. */
export async function deliver(mail: Mail) {
	try {
		await mailer().sendMail({
			from: mailFrom(),
			to: mail.to,
			subject: mail.subject,
			text: mail.text,
			html: mail.html,
			attachments: mail.attachments
		});
	} catch (error) {
		noteRelayFailed(error);
		throw error;
	}
	noteRelayAnswered();
}

export function passwordChangedMail(to: string): Mail {
	return {
		to,
		subject: 'Your Tackline password was changed',
		text: `Hello,\n\nThe password of your Tackline account (${to}) was just changed.\n\nIf that was you, there is nothing more to do. If it was not, ask for a sign-in link on the sign-in page, choose a new password in your account settings, and write to support@tackline.test.\n\n— Tackline`
	};
}
