import { env } from '$env/dynamic/private';
import PgBoss from 'pg-boss';

let client: PgBoss | null = null;

/**
 * The process's one pg-boss client, kept in PostgreSQL's `pgboss` schema. Constructing it opens no
 * connection: sending inside a caller's transaction works before (or without) `start()`, which only
 * the app process calls to run workers and maintenance.
 */
export function queueClient(): PgBoss {
	if (client) return client;
	if (!env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
	client = new PgBoss({
		connectionString: env.DATABASE_URL,
		application_name: 'tackline-jobs',
		max: 4
	});
	// pg-boss reports lost connections and failed maintenance as events; unheard, they would crash the process.
	client.on('error', (error) => console.error(`[jobs] ${error.message}`));
	return client;
}

/** Drops a client whose start failed (pg-boss cannot start an instance twice); the next call builds a new one. */
export async function discardQueueClient() {
	const pool = client?.getDb() as { opened?: boolean; close?: () => Promise<void> } | undefined;
	client = null;
	if (pool?.opened) await pool.close?.().catch(() => undefined);
}
