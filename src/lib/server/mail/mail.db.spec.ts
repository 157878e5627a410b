import { sql } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createDb } from '../db/client';
import { queueNames } from '../jobs';
import * as mail from '.';

async function jobsTo(address: string) {
	const result = await db.execute(
		sql`select state from pgboss.job where name = ${queueNames.mail} and data->>'to' = ${address}`
	);
	return result.rows;
}

// Kit's env module is fixed when vitest starts; this file's database is chosen by the setup after that.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

// The integration setup gives this file its own copy of the demo database and no server, so nothing
// works the queue here; pg-boss's schema and the mail queue are made once, as the app's start would.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());
beforeAll(async () => {
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	await boss.createQueue(queueNames.mail);
	await boss.stop({ graceful: false, wait: true });
});

describe('mail.queue', () => {
	it('writes nothing when the caller’s transaction rolls back', async () => {
		const to = `rolled-back.${randomUUID()}@example.test`;
		await expect(
			db.transaction(async (tx) => {
				await mail.queue(tx, { to, subject: 'Never sent', text: 'This transaction rolls back.' });
				expect(await jobsTo(to)).toHaveLength(0); // not visible outside the transaction yet
				throw new Error('roll back');
			})
		).rejects.toThrow('roll back');
		expect(await jobsTo(to)).toHaveLength(0);
	});

	it('queues one job when the transaction commits', async () => {
		const to = `committed.${randomUUID()}@example.test`;
		await db.transaction(async (tx) => {
			await mail.queue(tx, { to, subject: 'Sent after commit', text: 'This transaction commits.' });
		});
		expect(await jobsTo(to)).toHaveLength(1);
	});
});
