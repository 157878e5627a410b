import { inArray } from 'drizzle-orm';
import type { Executor } from '../db';
import { commission } from '../db/schema';

/** When each of the given commissions was published (unpublished ones are left out). */
export async function publishedTimes(db: Executor, ids: string[]): Promise<Map<string, Date>> {
	if (ids.length === 0) return new Map();
	const rows = await db
		.select({ id: commission.id, publishedAt: commission.publishedAt })
		.from(commission)
		.where(inArray(commission.id, ids));
	return new Map(rows.filter((row) => row.publishedAt).map((row) => [row.id, row.publishedAt!]));
}
