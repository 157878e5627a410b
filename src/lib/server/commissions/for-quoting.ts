import { eq, inArray } from 'drizzle-orm';
import type { Executor } from '../db';
import { commission } from '../db/schema';

/**
 * What quoting needs of a commission: who owns it, whether it is open, its currency and dates, and what
 * the quote helper prices from. `lock` takes a share lock for the caller's transaction, so the commission
 * cannot be awarded, cancelled or expired while a quote on it is written.
 */
export async function commissionForQuoting(db: Executor, { id, lock = false }: { id: string; lock?: boolean }) {
	const query = db
		.select({
			id: commission.id,
			customerId: commission.customerId,
			status: commission.status,
			title: commission.title,
			garmentType: commission.garmentType,
			garmentOther: commission.garmentOther,
			fabricSource: commission.fabricSource,
			currency: commission.currency,
			dateNeeded: commission.dateNeeded,
			expiresAt: commission.expiresAt
		})
		.from(commission)
		.where(eq(commission.id, id))
		.limit(1);
	const [row] = await (lock ? query.for('share') : query);
	return row ?? null;
}

export type CommissionForQuoting = NonNullable<Awaited<ReturnType<typeof commissionForQuoting>>>;

/** Titles and statuses of the given commissions, for lists of quotes. */
export async function commissionSummaries(db: Executor, ids: string[]) {
	if (ids.length === 0) return new Map<string, { title: string; status: string; garmentType: string }>();
	const rows = await db
		.select({
			id: commission.id,
			title: commission.title,
			status: commission.status,
			garmentType: commission.garmentType
		})
		.from(commission)
		.where(inArray(commission.id, ids));
	return new Map(rows.map(({ id, ...rest }) => [id, rest]));
}
