import { desc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { commission, commissionSizeBand, quote } from '../db/schema';
import type { SizeBandRange } from '$lib/format/size-band';

export async function listForCustomer(db: Executor, { customerId }: { customerId: string }) {
	return db
		.select({
			id: commission.id,
			title: commission.title,
			status: commission.status,
			garmentType: commission.garmentType,
			dateNeeded: commission.dateNeeded,
			quoteCount: sql<number>`count(${quote.id}) filter (where ${quote.status} = 'sent')`.mapWith(Number)
		})
		.from(commission)
		.leftJoin(quote, eq(quote.commissionId, commission.id))
		.where(eq(commission.customerId, customerId))
		.groupBy(commission.id)
		.orderBy(desc(commission.createdAt))
		.limit(50);
}

/** Open commissions, newest first, as a quoting tailor may see them: size band, never measurements. */
export async function listOpen(db: Executor, { limit = 20 }: { limit?: number } = {}) {
	return db
		.select({
			id: commission.id,
			title: commission.title,
			garmentType: commission.garmentType,
			sizeBand: sql<SizeBandRange[]>`coalesce((
				select json_agg(json_build_object('dimension', b.dimension, 'lowerMm', b.lower_mm, 'upperMm', b.upper_mm) order by b.position)
				from ${commissionSizeBand} b where b.commission_id = ${commission.id}
			), '[]'::json)`,
			city: commission.city,
			district: commission.district,
			dateNeeded: commission.dateNeeded,
			budgetMinMinor: commission.budgetMinMinor,
			budgetMaxMinor: commission.budgetMaxMinor,
			currency: commission.currency
		})
		.from(commission)
		.where(eq(commission.status, 'open'))
		.orderBy(desc(commission.publishedAt), desc(commission.id))
		.limit(limit);
}
