/**
 * Local stand-in for an SMTP relay: accepts every message, keeps it in memory and shows it
 * through a small JSON API (`GET /messages`, `GET /messages/:id`, `DELETE /messages`) that the
 * app's development inbox page reads. `POST /control/relay` with `{ "mode": "up" | "down" | "stalled" }`
 * lets tests take the relay away (connections refused) or stall it (accepted, never answered).
 */
import { createServer, type Server } from 'node:http';
import { createServer as createTcpServer, type Socket } from 'node:net';
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
	const relay = relaySwitch(smtp, options.smtpPort, host);

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
		if (url.pathname === '/control/relay' && req.method === 'POST') {
			readJson(req)
				.then((body) => relay.set((body as { mode?: unknown } | null)?.mode))
				.then((mode) => send(200, { mode }))
				.catch((error: Error) => send(400, { error: error.message }));
			return;
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
			await relay.set('up');
			await Promise.all([
				new Promise<void>((resolve) => smtp.close(() => resolve())),
				new Promise<void>((resolve) => api.close(() => resolve()))
			]);
		}
	};
}

type RelayMode = 'up' | 'down' | 'stalled';

/** Takes the SMTP listener off its port (refused) or puts a silent one there (stalled), and back. */
function relaySwitch(smtp: SMTPServer, port: number, host: string) {
	let mode: RelayMode = 'up';
	const held = new Set<Socket>();
	const silent = createTcpServer((socket) => {
		held.add(socket);
		socket.on('error', () => undefined);
		socket.on('close', () => held.delete(socket));
	});
	const listen = (server: { listen: (port: number, host: string, done: () => void) => unknown }) =>
		new Promise<void>((resolve) => server.listen(port, host, resolve));
	// Stops listening at once; sessions already open finish on their own.
	const closeSmtp = () => void smtp.server.close();
	const closeSilent = () => {
		for (const socket of held) socket.destroy();
		return new Promise<void>((resolve) => silent.close(() => resolve()));
	};

	return {
		async set(next: unknown): Promise<RelayMode> {
			if (next !== 'up' && next !== 'down' && next !== 'stalled') throw new Error('mode must be up, down or stalled');
			if (next === mode) return mode;
			if (mode === 'up') closeSmtp();
			if (mode === 'stalled') await closeSilent();
			if (next === 'up') await listen(smtp.server);
			if (next === 'stalled') await listen(silent);
			mode = next;
			return mode;
		}
	};
}

function readJson(req: import('node:http').IncomingMessage): Promise<unknown> {
	return new Promise((resolve, reject) => {
		let body = '';
		req.setEncoding('utf8');
		req.on('data', (chunk: string) => (body += chunk));
		req.on('end', () => {
			try {
				resolve(body ? JSON.parse(body) : null);
			} catch {
				reject(new Error('body must be JSON'));
			}
		});
		req.on('error', reject);
	});
}
