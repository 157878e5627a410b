import { sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../db/client';
import { dataVersion } from '../db/schema';

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

/** Tables whose writes do not change what a page shows (or that a kept answer checks directly). */
const untracked = ['data_version', 'rate_limit', 'session', 'verification_token', 'processed_webhook_event'];

async function version() {
	const [row] = await db.select({ value: dataVersion.value }).from(dataVersion);
	return Number(row.value);
}

describe('the data version', () => {
	it('is counted on every application table', async () => {
		const { rows } = await pool.query<{ tablename: string; tracked: boolean }>(
			`select t.tablename,
				exists (select 1 from pg_trigger g where g.tgrelid = format('public.%I', t.tablename)::regclass
					and g.tgname = 'data_version_bump') as tracked
			 from pg_tables t where t.schemaname = 'public'`
		);
		const missing = rows.filter((row) => !row.tracked && !untracked.includes(row.tablename));
		expect(missing.map((row) => row.tablename)).toEqual([]);
		expect(rows.length).toBeGreaterThan(20);
	});

	it('moves once per committed transaction, however many rows it wrote, and not for a rolled-back one', async () => {
		const before = await version();
		const place = (n: number) => `freshness-check-${process.pid}-${n}`;
		await db.transaction(async (tx) => {
			for (const n of [1, 2, 3]) {
				await tx.execute(
					sql`insert into local_place (id, name, country, lat, lng) values (${place(n)}, 'Check', 'GB', 0, 0)`
				);
			}
			await tx.execute(sql`delete from local_place where id like ${`freshness-check-${process.pid}-%`}`);
			// Deferred to the commit: the count has not moved yet inside the transaction.
			const [inside] = await tx.select({ value: dataVersion.value }).from(dataVersion);
			expect(Number(inside.value)).toBe(before);
		});
		expect(await version()).toBe(before + 1);
		await db
			.transaction(async (tx) => {
				await tx.execute(
					sql`insert into local_place (id, name, country, lat, lng) values (${place(4)}, 'Check', 'GB', 0, 0)`
				);
				tx.rollback();
			})
			.catch(() => {});
		expect(await version()).toBe(before + 1);
	});
});
