import { sql } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { db } from '../db';
import { queueNames } from '../jobs';
import * as mail from '.';

async function jobsTo(address: string) {
	const result = await db.execute(
		sql`select state from pgboss.job where name = ${queueNames.mail} and data->>'to' = ${address}`
	);
	return result.rows;
}

// Runs against the server's database while its mail worker runs.
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
