/**
 * Warnings on a quote's delivery date (never reasons to refuse it), worked out the same way on the server
 * and in the browser as the tailor changes the date.
 */
import { formatDate } from '$lib/format';

export type QuoteWarning = { code: 'after_date_needed' | 'capacity_full'; message: string };

export type WarningFacts = {
	deliveryDate: string;
	dateNeeded: string | null;
	capacity: number;
	/** The tailor's active orders due within `windowDays` of the delivery date. */
	ordersAround: number;
	windowDays: number;
};

/** Days either side of a delivery date in which other orders compete for the same weeks. */
export const capacityWindowDays = 14;

export function warningsFor(facts: WarningFacts): QuoteWarning[] {
	const warnings: QuoteWarning[] = [];
	if (facts.dateNeeded && facts.deliveryDate > facts.dateNeeded)
		warnings.push({
			code: 'after_date_needed',
			message: `Delivery on ${formatDate(facts.deliveryDate)} is after the date the customer needs it (${formatDate(facts.dateNeeded)}).`
		});
	if (facts.ordersAround >= facts.capacity)
		warnings.push({
			code: 'capacity_full',
			message: `You already have ${facts.ordersAround} accepted ${facts.ordersAround === 1 ? 'order' : 'orders'} due within ${facts.windowDays} days of that date, and your workroom takes ${facts.capacity} at once.`
		});
	return warnings;
}

/** How many of these due dates fall within `windowDays` of `date` (all `YYYY-MM-DD`). */
export function countAround(dueDates: readonly string[], date: string, windowDays = capacityWindowDays) {
	const at = Date.parse(`${date}T00:00:00Z`);
	if (Number.isNaN(at)) return 0;
	const span = windowDays * 86_400_000;
	return dueDates.filter((due) => Math.abs(Date.parse(`${due}T00:00:00Z`) - at) <= span).length;
}
