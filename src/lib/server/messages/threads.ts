import { sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { messageThread } from '../db/schema';

/**
 * The conversation between a commission's customer and one tailor, made on the tailor's first quote or
 * question and found again afterwards. Safe under concurrent callers: the pair is unique.
 */
export async function openThread(
	db: Executor,
	{ commissionId, tailorId }: { commissionId: string; tailorId: string }
): Promise<{ id: string }> {
	const [row] = await db
		.insert(messageThread)
		.values({ commissionId, tailorId })
		.onConflictDoUpdate({
			target: [messageThread.commissionId, messageThread.tailorId],
			// A no-op update so that `returning` yields the existing row.
			set: { commissionId: sql`excluded.commission_id` }
		})
		.returning({ id: messageThread.id });
	return row;
}
