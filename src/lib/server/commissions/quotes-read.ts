import { and, eq, sql } from 'drizzle-orm';
import type { SizeBandRange } from '$lib/format/size-band';
import type { Executor } from '../db';
import { commissionSizeBand, quote } from '../db/schema';

/** Tailors with a live (sent) quote on the commission: the people an edit or a cancellation concerns. */
export async function liveQuoteTailors(db: Executor, commissionId: string) {
	return db
		.selectDistinct({ tailorId: quote.tailorId })
		.from(quote)
		.where(and(eq(quote.commissionId, commissionId), eq(quote.status, 'sent')));
}

export async function hasAcceptedQuote(db: Executor, commissionId: string) {
	const [row] = await db
		.select({ id: quote.id })
		.from(quote)
		.where(and(eq(quote.commissionId, commissionId), eq(quote.status, 'accepted')))
		.limit(1);
	return Boolean(row);
}

/** Whether the tailor has quoted on the commission at all (an awarded or closed one stays visible to them). */
export async function quotedBy(db: Executor, { commissionId, tailorId }: { commissionId: string; tailorId: string }) {
	const [row] = await db
		.select({ status: quote.status })
		.from(quote)
		.where(and(eq(quote.commissionId, commissionId), eq(quote.tailorId, tailorId)))
		.orderBy(sql`${quote.status} = 'accepted' desc`)
		.limit(1);
	return row?.status ?? null;
}

export async function sizeBandOf(db: Executor, commissionId: string): Promise<SizeBandRange[]> {
	return db
		.select({
			dimension: commissionSizeBand.dimension,
			lowerMm: commissionSizeBand.lowerMm,
			upperMm: commissionSizeBand.upperMm
		})
		.from(commissionSizeBand)
		.where(eq(commissionSizeBand.commissionId, commissionId))
		.orderBy(commissionSizeBand.position);
}
