/** Reads the mail stand-in's inbox. Mail may go through a queue, so lookups wait (a bounded while). */
const inboxUrl = process.env.MAIL_INBOX_URL;

export type ReceivedMail = { id: string; to: string[]; subject: string; text: string; receivedAt: string };

export async function mailTo(address: string): Promise<ReceivedMail[]> {
	const response = await fetch(`${inboxUrl}/messages?to=${encodeURIComponent(address.toLowerCase())}`);
	return response.json();
}

/** The newest mail to `address` (with `subject`, if given) once at least `count` such mails are there. */
export async function waitForMail(
	address: string,
	{ subject, count = 1, timeoutMs = 15_000 }: { subject?: string; count?: number; timeoutMs?: number } = {}
): Promise<ReceivedMail> {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const matching = (await mailTo(address)).filter((m) => !subject || m.subject === subject);
		if (matching.length >= count) return matching[0];
		if (Date.now() > deadline)
			throw new Error(`no mail "${subject ?? '*'}" #${count} to ${address} within ${timeoutMs} ms`);
		await new Promise((r) => setTimeout(r, 100));
	}
}

/** Waits long enough for queued mail to have gone out, then lists what arrived. */
export async function settledMailTo(address: string, waitMs = 1500) {
	await new Promise((r) => setTimeout(r, waitMs));
	return mailTo(address);
}

/** The first absolute link in a mail. */
export function linkIn(mail: ReceivedMail): URL {
	const found = /https?:\/\/\S+/.exec(mail.text)?.[0];
	if (!found) throw new Error(`no link in "${mail.subject}"`);
	return new URL(found);
}

export const subjects = {
	signInLink: 'Your Tackline sign-in link',
	confirm: 'Your Tackline confirmation link',
	noAccount: 'Signing in to Tackline',
	accountExists: 'You already have a Tackline account',
	passwordChanged: 'Your Tackline password was changed'
} as const;
