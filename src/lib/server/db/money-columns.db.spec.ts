import { sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from './client';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 1 });
afterAll(() => pool.end());

describe('money columns', () => {
	it('are 64-bit integers in every table', async () => {
		const { rows } = await db.execute<{ table_name: string; column_name: string; data_type: string }>(sql`
			select table_name, column_name, data_type from information_schema.columns
			where table_schema = 'public' and column_name like '%\_minor'`);
		expect(rows.length).toBeGreaterThanOrEqual(14);
		expect(rows.filter((row) => row.data_type !== 'bigint')).toEqual([]);
	});
});
