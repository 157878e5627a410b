import { building } from '$app/environment';
import { env } from '$env/dynamic/private';
import { createDb, type Database } from './client';

function open(): ReturnType<typeof createDb> {
	if (!env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
	return createDb(env.DATABASE_URL);
}

// `vite build` imports server modules to analyse them; it must not need a database.
const opened = building ? null : open();

// adapter-node announces a graceful shutdown once requests have drained; close the pool then.
process.on('sveltekit:shutdown', () => void opened?.pool.end());

export const db = opened?.db as Database;
export const pool = opened?.pool as ReturnType<typeof createDb>['pool'];
export type { Database, Executor, Transaction } from './client';
