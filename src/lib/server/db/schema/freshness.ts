import { bigint, check, pgTable, smallint } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';

/**
 * One row counting committed changes to what the pages show. A deferred trigger on every application table
 * (migration 0011) adds one at commit, in the same transaction as the change, so an answer rendered after
 * reading the count is current for as long as the count has not moved.
 */
export const dataVersion = pgTable(
	'data_version',
	{
		id: smallint('id').primaryKey().default(1),
		value: bigint('value', { mode: 'number' }).notNull().default(0)
	},
	(t) => [check('data_version_one_row', sql`${t.id} = 1`)]
);
