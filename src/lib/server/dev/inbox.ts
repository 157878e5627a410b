import { error } from '@sveltejs/kit';
import { env } from '$env/dynamic/private';

export type InboxMessage = {
	id: string;
	from: string;
	to: string[];
	subject: string;
	text: string;
	receivedAt: string;
};

/** The development inbox exists only in builds made with the development tools. */
export function requireDevTools() {
	if (!__TACKLINE_DEV_TOOLS__ || !env.MAIL_INBOX_URL) error(404, { message: 'Not found' });
	return env.MAIL_INBOX_URL;
}

export async function list(): Promise<InboxMessage[]> {
	const response = await fetch(`${requireDevTools()}/messages`);
	if (!response.ok) error(502, { message: 'The local mail stand-in is not answering.' });
	return (await response.json()) as InboxMessage[];
}

export async function get({ id }: { id: string }): Promise<InboxMessage> {
	const response = await fetch(`${requireDevTools()}/messages/${encodeURIComponent(id)}`);
	if (response.status === 404) error(404, { message: 'That message is no longer in the inbox.' });
	if (!response.ok) error(502, { message: 'The local mail stand-in is not answering.' });
	return (await response.json()) as InboxMessage;
}
