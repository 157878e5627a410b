import { capacityWindowDays, warningsFor, type QuoteWarning } from '$lib/quotes/warnings';
import type { Executor } from '../db';
import { activeOrdersAround } from '../orders/load';

export {
	capacityWindowDays,
	countAround,
	warningsFor,
	type QuoteWarning,
	type WarningFacts
} from '$lib/quotes/warnings';

/** Reads the tailor's orders around the delivery date and says what to warn about. */
export async function quoteWarnings(
	db: Executor,
	{
		tailorId,
		deliveryDate,
		dateNeeded,
		capacity,
		windowDays = capacityWindowDays
	}: { tailorId: string; deliveryDate: string; dateNeeded: string | null; capacity: number; windowDays?: number }
): Promise<QuoteWarning[]> {
	const { count } = await activeOrdersAround(db, { tailorId, date: deliveryDate, windowDays });
	return warningsFor({ deliveryDate, dateNeeded, capacity, ordersAround: count, windowDays });
}
