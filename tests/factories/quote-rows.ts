/** Quotes written straight into the test file's database, as the quotes area stores them. */
import { and, eq, ne } from 'drizzle-orm';
import type { Executor } from '../../src/lib/server/db/client';
import { commission, order, quote, type NewQuote } from '../../src/lib/server/db/schema';

const dayMs = 86_400_000;

function isoDay(daysFromNow: number) {
	return new Date(Date.now() + daysFromNow * dayMs).toISOString().slice(0, 10);
}

/** A live quote (unless `status` says otherwise): €450, delivered in 40 days, valid for 14. */
export async function insertQuote(
	db: Executor,
	options: { commissionId: string; tailorId: string } & Partial<Omit<NewQuote, 'commissionId' | 'tailorId'>>
): Promise<{ id: string; priceMinor: number; currency: string; deliveryDate: string }> {
	const [row] = await db
		.insert(quote)
		.values({
			priceMinor: 45_000,
			currency: 'EUR',
			deliveryDate: isoDay(40),
			fittingsIncluded: 2,
			fabricIncluded: true,
			message: 'Happy to make this; two fittings included.',
			validUntil: new Date(Date.now() + 14 * dayMs),
			...options
		})
		.returning({
			id: quote.id,
			priceMinor: quote.priceMinor,
			currency: quote.currency,
			deliveryDate: quote.deliveryDate
		});
	return row;
}

/**
 * The state an acceptance leaves behind, written directly: the quote accepted, the others declined, an order
 * awaiting payment (10 % fee) and the commission awarded. For tests about what comes after acceptance.
 */
export async function awardQuote(
	db: Executor,
	{ commissionId, quoteId, customerId }: { commissionId: string; quoteId: string; customerId: string }
) {
	const now = new Date();
	await db
		.update(quote)
		.set({ status: 'declined', declineReason: 'another quote was accepted', decidedAt: now })
		.where(and(eq(quote.commissionId, commissionId), eq(quote.status, 'sent'), ne(quote.id, quoteId)));
	const [accepted] = await db
		.update(quote)
		.set({ status: 'accepted', decidedAt: now })
		.where(eq(quote.id, quoteId))
		.returning();
	const fee = Math.floor((accepted.priceMinor * 1000 + 5000) / 10_000);
	const [row] = await db
		.insert(order)
		.values({
			commissionId,
			quoteId,
			customerId,
			tailorId: accepted.tailorId,
			priceMinor: accepted.priceMinor,
			platformFeeMinor: fee,
			tailorPayoutMinor: accepted.priceMinor - fee,
			platformFeeBasisPoints: 1000,
			currency: accepted.currency,
			dueDate: accepted.deliveryDate
		})
		.returning({ id: order.id });
	await db.update(commission).set({ status: 'awarded' }).where(eq(commission.id, commissionId));
	return { orderId: row.id };
}
