import type { Executor } from '../db';
import { mailFrom, mailer } from '../services/mailer';

export type Mail = { to: string; subject: string; text: string; html?: string };

export async function send(mail: Mail) {
	await mailer().sendMail({ from: mailFrom(), ...mail });
}

/**
 * Queues a mail inside the caller's transaction: it is sent (with retries) only if the change that
 * causes it commits, and the request never waits on the relay.
 * Contract for every caller; the PostgreSQL-backed queue behind it lands with the mail-queue work.
 */
export async function queue(_db: Executor, mail: Mail) {
	await send(mail);
}

export async function check(): Promise<'ok' | string> {
	try {
		await mailer().verify();
		return 'ok';
	} catch (error) {
		return error instanceof Error ? error.message : 'unreachable';
	}
}

export function passwordChangedMail(to: string): Mail {
	return {
		to,
		subject: 'Your Tackline password was changed',
		text: `Hello,\n\nThe password of your Tackline account (${to}) was just changed.\n\nIf that was you, there is nothing more to do. If it was not, ask for a sign-in link on the sign-in page, choose a new password in your account settings, and write to support@tackline.test.\n\n— Tackline`
	};
}
