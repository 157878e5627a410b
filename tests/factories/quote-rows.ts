/** Quotes written straight into the test file's database, as the quotes area stores them. */
import type { Executor } from '../../src/lib/server/db/client';
import { quote, type NewQuote } from '../../src/lib/server/db/schema';

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
