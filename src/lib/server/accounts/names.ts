import { inArray } from 'drizzle-orm';
import type { Executor } from '../db';
import { user } from '../db/schema';

/** The names people gave themselves, by user id (null where none was given); never their addresses. */
export async function namesOf(db: Executor, ids: string[]): Promise<Map<string, string | null>> {
	if (ids.length === 0) return new Map();
	const rows = await db
		.select({ id: user.id, name: user.name })
		.from(user)
		.where(inArray(user.id, [...new Set(ids)]));
	return new Map(rows.map((row) => [row.id, row.name]));
}
