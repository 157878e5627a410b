/**
 * Local stand-in for an SMTP relay: accepts every message, keeps it in memory and shows it
 * through a small JSON API (`GET /messages`, `GET /messages/:id`, `DELETE /messages`) that the
 * app's development inbox page reads.
 */
import { createServer, type Server } from 'node:http';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export type StoredMail = {
	id: string;
	from: string;
	to: string[];
	subject: string;
	text: string;
	html: string | null;
	receivedAt: string;
};

const keep = 500;

export async function startMailStandin(options: { smtpPort: number; apiPort: number; host?: string }) {
	const host = options.host ?? '127.0.0.1';
	const messages: StoredMail[] = [];
	let counter = 0;

	const smtp = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS'], // the bundled certificate has expired; loopback needs no TLS
		logger: false,
		onData(stream, session, callback) {
			simpleParser(stream)
				.then((mail) => {
					counter += 1;
					messages.unshift({
						id: `${Date.now().toString(36)}-${counter}`,
						from: mail.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
						to: session.envelope.rcptTo.map((r) => r.address),
						subject: mail.subject ?? '',
						text: mail.text ?? '',
						html: typeof mail.html === 'string' ? mail.html : null,
						receivedAt: new Date().toISOString()
					});
					messages.length = Math.min(messages.length, keep);
					callback();
				})
				.catch((error: Error) => callback(error));
		}
	});
	await new Promise<void>((resolve, reject) => {
		smtp.once('error', reject);
		smtp.listen(options.smtpPort, host, () => resolve());
	});

	const api: Server = createServer((req, res) => {
		const url = new URL(req.url ?? '/', 'http://localhost');
		const send = (status: number, body: unknown) => {
			res.writeHead(status, { 'content-type': 'application/json' });
			res.end(JSON.stringify(body));
		};
		if (url.pathname === '/messages' && req.method === 'GET') {
			const to = url.searchParams.get('to')?.toLowerCase();
			return send(200, to ? messages.filter((m) => m.to.some((a) => a.toLowerCase() === to)) : messages);
		}
		if (url.pathname === '/messages' && req.method === 'DELETE') {
			messages.length = 0;
			return send(200, { deleted: true });
		}
		const match = /^\/messages\/([\w-]+)$/.exec(url.pathname);
		if (match && req.method === 'GET') {
			const found = messages.find((m) => m.id === match[1]);
			return found ? send(200, found) : send(404, { error: 'not found' });
		}
		if (url.pathname === '/health') return send(200, { status: 'ok' });
		send(404, { error: 'not found' });
	});
	await new Promise<void>((resolve, reject) => {
		api.once('error', reject);
		api.listen(options.apiPort, host, () => resolve());
	});

	return {
		smtpUrl: `smtp://${host}:${options.smtpPort}`,
		inboxUrl: `http://${host}:${options.apiPort}`,
		async stop() {
			await Promise.all([
				new Promise<void>((resolve) => smtp.close(() => resolve())),
				new Promise<void>((resolve) => api.close(() => resolve()))
			]);
		}
	};
}
