import type { ComparedQuote, ComparisonSort } from '$lib/types/quote-comparison';

export const sortLabels: Record<ComparisonSort, string> = {
	fit: 'Best fit',
	price: 'Price',
	delivery: 'Delivery',
	distance: 'Distance'
};

const byPrice = (a: ComparedQuote, b: ComparedQuote) =>
	a.currency.localeCompare(b.currency) || a.priceMinor - b.priceMinor;
const byDelivery = (a: ComparedQuote, b: ComparedQuote) => a.deliveryDate.localeCompare(b.deliveryDate);
const byDistance = (a: ComparedQuote, b: ComparedQuote) => (a.distanceKm ?? Infinity) - (b.distanceKm ?? Infinity) || 0;
const byFit = (a: ComparedQuote, b: ComparedQuote) =>
	(b.fit?.points ?? -1) - (a.fit?.points ?? -1) || byPrice(a, b) || byDelivery(a, b);

const comparers: Record<ComparisonSort, (a: ComparedQuote, b: ComparedQuote) => number> = {
	fit: byFit,
	price: (a, b) => byPrice(a, b) || byDelivery(a, b),
	delivery: (a, b) => byDelivery(a, b) || byPrice(a, b),
	distance: (a, b) => byDistance(a, b) || byPrice(a, b)
};

/** The quotes in the chosen order; ties fall back to price, then delivery. Unknown distances go last. */
export function sortQuotes(quotes: ComparedQuote[], sort: ComparisonSort): ComparedQuote[] {
	return [...quotes].sort(comparers[sort]);
}

/** "within an hour", "about 5 hours", "about 3 days": a median response time in plain words. */
export function responseText(hours: number | null): string {
	if (hours === null) return 'New to quoting';
	if (hours < 1) return 'Usually within an hour';
	if (hours < 36) return `Usually about ${Math.round(hours)} hour${Math.round(hours) === 1 ? '' : 's'}`;
	return `Usually about ${Math.round(hours / 24)} days`;
}

/** Delivery against the date needed, in words. */
export function deliveryText(days: number | null): string {
	if (days === null) return 'No date needed given';
	if (days === 0) return 'On the day you need it';
	const n = Math.abs(days);
	return `${n} day${n === 1 ? '' : 's'} ${days > 0 ? 'before' : 'after'} you need it`;
}
