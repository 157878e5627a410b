import { eq, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { dataVersion } from '../db/schema';

/**
 * The count of committed changes as a column of the caller's own query, so that it is read in the same
 * statement as the session, before the request reads anything else.
 */
export const dataVersionColumn = () =>
	sql<string>`(select ${dataVersion.value} from ${dataVersion} where ${dataVersion.id} = 1)`;

export async function currentVersion(db: Executor) {
	const [row] = await db.select({ value: dataVersion.value }).from(dataVersion).where(eq(dataVersion.id, 1));
	return row ? String(row.value) : null;
}

/** Counts a change the database did not see (a search index rebuilt from nothing), so kept answers are dropped. */
export async function touch(db: Executor) {
	await db
		.update(dataVersion)
		.set({ value: sql`${dataVersion.value} + 1` })
		.where(eq(dataVersion.id, 1));
}
