import { env } from '$env/dynamic/private';
import pg from 'pg';

/**
 * What a subscriber hears: a notification on its channel, that the connection came back (re-read the source),
 * or that the process is shutting down (end long-lived answers so the server can drain).
 */
export type NotificationEvent = { type: 'notification'; payload: string } | { type: 'resync' } | { type: 'closing' };
export type NotificationListener = (event: NotificationEvent) => void;

const listeners = new Map<string, Set<NotificationListener>>();
let client: pg.Client | null = null;
let connecting: Promise<pg.Client> | null = null;
let retryTimer: ReturnType<typeof setTimeout> | null = null;
let failures = 0;
let closed = false;

const firstRetryMs = 250;
const maxRetryMs = 30_000;

function quoteIdent(channel: string) {
	return `"${channel.replaceAll('"', '""')}"`;
}

function fanOut(channel: string, event: NotificationEvent) {
	for (const listener of listeners.get(channel) ?? []) {
		try {
			listener(event);
		} catch (error) {
			console.error(`[notifications] a subscriber of ${channel} failed:`, error);
		}
	}
}

function scheduleReconnect() {
	if (closed || retryTimer || listeners.size === 0) return;
	const delay = Math.min(maxRetryMs, firstRetryMs * 2 ** failures) * (0.75 + Math.random() * 0.5);
	failures += 1;
	retryTimer = setTimeout(() => {
		retryTimer = null;
		void connect().then(
			() => {
				// Whatever was sent while the connection was away is in the database: everyone re-reads from there.
				for (const channel of listeners.keys()) fanOut(channel, { type: 'resync' });
			},
			() => scheduleReconnect()
		);
	}, delay);
	retryTimer.unref?.();
}

function lost(which: pg.Client, error?: Error) {
	if (client !== which) return;
	client = null;
	if (error) console.error(`[notifications] connection lost: ${error.message}`);
	void which.end().catch(() => undefined);
	scheduleReconnect();
}

/** The one dedicated LISTEN connection of this process, opened on first use and re-opened with back-off. */
async function connect(): Promise<pg.Client> {
	if (client) return client;
	if (connecting) return connecting;
	if (!env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
	const fresh = new pg.Client({
		connectionString: env.DATABASE_URL,
		application_name: 'tackline-notifications',
		keepAlive: true
	});
	connecting = (async () => {
		try {
			await fresh.connect();
			fresh.on('notification', (message) =>
				fanOut(message.channel, { type: 'notification', payload: message.payload ?? '' })
			);
			fresh.on('error', (error) => lost(fresh, error));
			fresh.on('end', () => lost(fresh));
			for (const channel of listeners.keys()) await fresh.query(`LISTEN ${quoteIdent(channel)}`);
			client = fresh;
			failures = 0;
			return fresh;
		} catch (error) {
			await fresh.end().catch(() => undefined);
			throw error;
		} finally {
			connecting = null;
		}
	})();
	return connecting;
}

/**
 * Subscribes to a PostgreSQL NOTIFY channel through this process's single listening connection. Resolves
 * once LISTEN is in place (so anything committed afterwards is heard) and returns the unsubscribe function.
 * If the connection drops, it is re-opened with back-off and every subscriber gets `resync`: notifications
 * sent meanwhile are lost, so subscribers re-read what they need from the database.
 */
export async function listen(channel: string, listener: NotificationListener): Promise<() => void> {
	closed = false;
	closeOnShutdownSignals();
	let set = listeners.get(channel);
	const isNewChannel = !set;
	if (!set) listeners.set(channel, (set = new Set()));
	set.add(listener);
	const unsubscribe = () => {
		const current = listeners.get(channel);
		current?.delete(listener);
		if (current && current.size === 0) {
			listeners.delete(channel);
			void client?.query(`UNLISTEN ${quoteIdent(channel)}`).catch(() => undefined);
		}
	};
	try {
		const active = await connect();
		// LISTEN is idempotent: repeating it for a connection that opened meanwhile does no harm.
		if (isNewChannel) await active.query(`LISTEN ${quoteIdent(channel)}`);
	} catch (error) {
		unsubscribe();
		scheduleReconnect();
		throw error;
	}
	return unsubscribe;
}

/** Closes the listening connection (at shutdown); subscribers are dropped. */
export async function closeNotifications() {
	closed = true;
	listeners.clear();
	if (retryTimer) clearTimeout(retryTimer);
	retryTimer = null;
	const current = client;
	client = null;
	await current?.end().catch(() => undefined);
}

process.on('sveltekit:shutdown', () => void closeNotifications());

let watchingSignals = false;

/**
 * adapter-node drains open requests before it exits; live streams never end by themselves, so they are told to
 * close (browsers reconnect, to another instance if there is one). Registered with the first subscriber only,
 * so scripts that never listen keep the default signal handling.
 */
function closeOnShutdownSignals() {
	if (watchingSignals) return;
	watchingSignals = true;
	for (const signal of ['SIGTERM', 'SIGINT'] as const) {
		process.on(signal, () => {
			for (const channel of listeners.keys()) fanOut(channel, { type: 'closing' });
		});
	}
}
