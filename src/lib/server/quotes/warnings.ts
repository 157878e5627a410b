import { formatDate } from '$lib/format';
import type { Executor } from '../db';
import { activeOrdersAround } from '../orders/load';

/** Something the tailor should know before sending, never a reason to refuse. */
export type QuoteWarning = { code: 'after_date_needed' | 'capacity_full'; message: string };

export type WarningFacts = {
	deliveryDate: string;
	dateNeeded: string | null;
	capacity: number;
	/** The tailor's active orders due around the delivery date (see `orders.activeOrdersAround`). */
	ordersAround: number;
	windowDays: number;
};

/** The warnings for a delivery date, from facts already read. */
export function warningsFor(facts: WarningFacts): QuoteWarning[] {
	const warnings: QuoteWarning[] = [];
	if (facts.dateNeeded && facts.deliveryDate > facts.dateNeeded)
		warnings.push({
			code: 'after_date_needed',
			message: `Delivery on ${formatDate(facts.deliveryDate)} is after the customer needs it (${formatDate(facts.dateNeeded)}).`
		});
	if (facts.ordersAround >= facts.capacity)
		warnings.push({
			code: 'capacity_full',
			message: `You already have ${facts.ordersAround} accepted ${facts.ordersAround === 1 ? 'order' : 'orders'} due within ${facts.windowDays} days of that date, and your workroom takes ${facts.capacity} at once.`
		});
	return warnings;
}

/** Reads the tailor's orders around the delivery date and says what to warn about. */
export async function quoteWarnings(
	db: Executor,
	{
		tailorId,
		deliveryDate,
		dateNeeded,
		capacity,
		windowDays = 14
	}: { tailorId: string; deliveryDate: string; dateNeeded: string | null; capacity: number; windowDays?: number }
): Promise<QuoteWarning[]> {
	const { count } = await activeOrdersAround(db, { tailorId, date: deliveryDate, windowDays });
	return warningsFor({ deliveryDate, dateNeeded, capacity, ordersAround: count, windowDays });
}
