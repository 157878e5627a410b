import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema';

/** Opens a pool and a Drizzle client on it. Scripts call this with their own URL; the app uses `db` from `./index`. */
export function createDb(url: string, options: { max?: number } = {}) {
	const pool = new pg.Pool({ connectionString: url, max: options.max ?? 10 });
	// An idle connection dropped by the server (restart, shutdown) must not crash the process.
	pool.on('error', (error) => console.error(`database connection lost: ${error.message}`));
	const db = drizzle(pool, { schema, casing: 'snake_case' });
	return { db, pool };
}

export type Database = ReturnType<typeof createDb>['db'];
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];
/** Either the database or an open transaction: domain functions accept both. */
export type Executor = Database | Transaction;
