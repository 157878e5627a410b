import { sql, type Param, type SQL } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import type { Executor } from '../db';
import { queueClient } from '../services/queue';
import type { QueueName } from './names';

export { queueNames, type QueueName } from './names';

/** pg-boss's own tables live in this schema; created and migrated by pg-boss at start. */
const schema = sql.raw('pgboss');

/**
 * Lets pg-boss run its parameterised statements on a Drizzle handle, so a job is written in the
 * caller's transaction and disappears with it on rollback.
 */
export function onExecutor(db: Executor): PgBoss.Db {
	return {
		async executeSql(text: string, values: unknown[] = []) {
			const chunks: (SQL | Param)[] = text
				.split(/\$(\d+)/)
				.map((part, index) => (index % 2 === 0 ? sql.raw(part) : sql.param(values[Number(part) - 1])));
			const result = await db.execute(sql.join(chunks));
			return { rows: result.rows };
		}
	};
}

export type SendOptions = Omit<PgBoss.SendOptions, 'db'>;

/**
 * Queues a job inside the caller's transaction (or on its own when given the database). Retries,
 * back-off and dead letters come from the queue's definition. Throws when the queue does not exist,
 * which pg-boss would otherwise answer with a silent `null`.
 */
export async function enqueue(db: Executor, name: QueueName, data: object, options: SendOptions = {}) {
	const id = await queueClient().send(name, data, { ...options, db: onExecutor(db) });
	const mayBeDeduplicated = Boolean(options.singletonKey || options.singletonSeconds);
	if (id === null && !mayBeDeduplicated)
		throw new Error(`job queue "${name}" does not exist; has the app started once?`);
	return id;
}

/** Runs a job on a cron schedule (UTC unless `tz`), for queues whose definition has no `cron`. */
export async function schedule(name: QueueName, cron: string, data: object = {}, options: PgBoss.ScheduleOptions = {}) {
	await queueClient().schedule(name, cron, data, options);
}

export type WaitingJob<T> = { id: string; data: T; output: unknown; createdOn: Date };

/** Jobs waiting in a queue that has no worker (a dead-letter queue), newest first. */
export async function listWaiting<T>(db: Executor, name: QueueName, { limit = 100 } = {}): Promise<WaitingJob<T>[]> {
	const result = await db.execute(sql`
		select id, data, output, created_on as "createdOn" from ${schema}.job
		where name = ${name} and state = 'created'
		order by created_on desc, id
		limit ${limit}`);
	return (result.rows as WaitingJob<T>[]).map((row) => ({ ...row, createdOn: new Date(row.createdOn) }));
}

/** Removes one waiting job and returns its data, or null when it is gone (already taken by someone else). */
export async function takeWaiting<T>(db: Executor, name: QueueName, id: string): Promise<T | null> {
	const result = await db.execute(sql`
		delete from ${schema}.job where name = ${name} and id = ${id} and state = 'created' returning data`);
	const [row] = result.rows as { data: T }[];
	return row?.data ?? null;
}
