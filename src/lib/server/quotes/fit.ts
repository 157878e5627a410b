import { formatMoney, formatMoneyRange } from '$lib/format';
import type { BestFitHint, FitCriterion, QuoteFit } from '$lib/types/quote-comparison';

/** What the best-fit score reads of one live quote. */
export type FitInput = {
	id: string;
	tailorName: string;
	priceMinor: number;
	currency: string;
	deliveryDate: string;
	distanceKm: number | null;
};

export type FitContext = {
	dateNeeded: string | null;
	budget: { minMinor: number; maxMinor: number; currency: string } | null;
};

/** The rules, as the page shows them under "How the best fit is worked out". */
export const fitMethod = [
	'On time: 3 points when the delivery date is on or before the date you need it, none when later.',
	'Budget: 2 points when the price is at or below the top of your budget, none above it.',
	'Price: 2 points for the lowest price among the live quotes, 1 for the next lowest (equal prices share a place).',
	'Distance: 2 points for a workroom within 5 km of your area, 1 within 15 km.',
	'A check that cannot be made (no date needed, no budget, another currency, an unknown place) is left out for that quote. The highest total is the best fit; equal totals go to the lower price, then the earlier delivery.'
];

const dayMs = 86_400_000;

/** Whole days from `from` to `to` (ISO dates): positive when `to` is later. */
export function daysBetween(from: string, to: string): number {
	return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / dayMs);
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

function onTime(q: FitInput, { dateNeeded }: FitContext): FitCriterion | null {
	if (!dateNeeded) return null;
	const early = daysBetween(q.deliveryDate, dateNeeded);
	const detail =
		early === 0
			? 'Ready on the day you need it'
			: early > 0
				? `Ready ${plural(early, 'day')} early`
				: `${plural(-early, 'day')} late`;
	return { id: 'on_time', label: 'On time', points: early >= 0 ? 3 : 0, max: 3, detail };
}

function withinBudget(q: FitInput, { budget }: FitContext): FitCriterion | null {
	if (!budget || budget.currency !== q.currency) return null;
	const range = formatMoneyRange(budget.minMinor, budget.maxMinor, budget.currency);
	const over = q.priceMinor - budget.maxMinor;
	return {
		id: 'budget',
		label: 'Within budget',
		points: over <= 0 ? 2 : 0,
		max: 2,
		detail:
			over <= 0 ? `Within your budget of ${range}` : `${formatMoney(over, q.currency)} over your budget of ${range}`
	};
}

function priceRank(q: FitInput, all: FitInput[]): FitCriterion {
	const prices = [...new Set(all.filter((o) => o.currency === q.currency).map((o) => o.priceMinor))].sort(
		(a, b) => a - b
	);
	const place = prices.indexOf(q.priceMinor);
	const points = place === 0 ? 2 : place === 1 ? 1 : 0;
	const detail =
		prices.length === 1
			? 'The only price in this currency'
			: place === 0
				? 'The lowest price'
				: place === 1
					? 'The second lowest price'
					: `Price ${place + 1} of ${prices.length}`;
	return { id: 'price', label: 'Price', points, max: 2, detail };
}

function nearby(q: FitInput): FitCriterion | null {
	if (q.distanceKm === null) return null;
	const points = q.distanceKm <= 5 ? 2 : q.distanceKm <= 15 ? 1 : 0;
	return { id: 'distance', label: 'Distance', points, max: 2, detail: `${formatKm(q.distanceKm)} from your area` };
}

/** "800 m", "3.4 km", "27 km": a distance to the precision the coarse places allow. */
export function formatKm(km: number): string {
	if (km < 1) return 'under 1 km';
	return km < 10 ? `${km.toFixed(1)} km` : `${Math.round(km)} km`;
}

/** Each live quote's score with its working; the others get none. */
export function scoreQuotes(live: FitInput[], context: FitContext): Map<string, QuoteFit> {
	return new Map(
		live.map((q) => {
			const criteria = [onTime(q, context), withinBudget(q, context), priceRank(q, live), nearby(q)].filter(
				(c): c is FitCriterion => c !== null
			);
			const fit = {
				points: criteria.reduce((sum, c) => sum + c.points, 0),
				max: criteria.reduce((sum, c) => sum + c.max, 0),
				criteria
			};
			return [q.id, fit];
		})
	);
}

/** Orders live quotes best first: total, then lower price, then earlier delivery. */
export function byFit(fits: Map<string, QuoteFit>) {
	return (a: FitInput, b: FitInput) =>
		(fits.get(b.id)?.points ?? -1) - (fits.get(a.id)?.points ?? -1) ||
		a.priceMinor - b.priceMinor ||
		a.deliveryDate.localeCompare(b.deliveryDate);
}

/** The plain-words hint: which quote fits best and why, naming any quote level with it on points. */
export function bestFitHint(live: FitInput[], fits: Map<string, QuoteFit>): BestFitHint | null {
	if (live.length === 0) return null;
	const [best, ...rest] = [...live].sort(byFit(fits));
	const fit = fits.get(best.id)!;
	const tied = rest.filter((q) => fits.get(q.id)?.points === fit.points).map((q) => q.tailorName);
	const good = fit.criteria
		.filter((c) => c.points > 0)
		.map((c) => c.detail.charAt(0).toLowerCase() + c.detail.slice(1));
	const short = fit.criteria
		.filter((c) => c.points === 0)
		.map((c) => c.detail.charAt(0).toLowerCase() + c.detail.slice(1));
	const why = good.length ? good.join(', ') : 'no check scored';
	const caveat = short.length ? ` Falls short on: ${short.join(', ')}.` : '';
	const text =
		live.length === 1
			? `${best.tailorName} is the only quote so far: ${why} (${fit.points} of ${fit.max} points).${caveat}`
			: `${best.tailorName} fits best: ${why} (${fit.points} of ${fit.max} points).${caveat}${
					tied.length
						? ` Level on points with ${tied.join(', ')}; the lower price, then the earlier delivery, decides.`
						: ''
				}`;
	return { quoteId: best.id, tailorName: best.tailorName, text, tiedWith: tied };
}
