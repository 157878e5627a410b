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

export async function check(): Promise<string> {
	try {
		await mailer().verify();
		return 'ok';
	} catch (error) {
		return error instanceof Error ? error.message : 'unreachable';
	}
}

function escapeAttribute(value: string) {
	return value.replaceAll('&', '&amp;').replaceAll('"', '&quot;').replaceAll('<', '&lt;');
}

export function signInLinkMail(to: string, url: string): Mail {
	const host = new URL(url).host;
	return {
		to,
		subject: 'Your Tackline sign-in link',
		text: `Hello,\n\nUse this link to sign in to Tackline at ${host}:\n\n${url}\n\nThe link works once and expires in 24 hours. If you did not ask for it, you can ignore this email.\n\n— Tackline`,
		html: `<p>Hello,</p><p>Use this link to sign in to Tackline at ${host}:</p><p><a href="${escapeAttribute(url)}">Sign in to Tackline</a></p><p>The link works once and expires in 24 hours. If you did not ask for it, you can ignore this email.</p><p>— Tackline</p>`
	};
}

export function passwordChangedMail(to: string): Mail {
	return {
		to,
		subject: 'Your Tackline password was changed',
		text: `Hello,\n\nThe password of your Tackline account (${to}) was just changed.\n\nIf that was you, there is nothing more to do. If it was not, ask for a sign-in link on the sign-in page, choose a new password in your account settings, and write to support@tackline.test.\n\n— Tackline`
	};
}
