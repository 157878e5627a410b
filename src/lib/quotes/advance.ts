/**
 * The fabric advance a quote may ask for: money for materials, paid to the tailor when the customer approves
 * the fabric and deducted from the final release. The same rule runs in the quote form, the API and the
 * database's check (`quote_advance_within_limit`).
 */
import { formatMoney } from '$lib/format';

/** An advance is at most this share of the price, in per cent. */
export const advanceLimitPercent = 30;

/** The largest advance a price allows, in minor units: 30 % rounded down, so the database's check always agrees. */
export function maxAdvanceMinor(priceMinor: number): number {
	return Math.floor((priceMinor * advanceLimitPercent) / 100);
}

export type AdvanceIssue = { path: 'advanceMinor'; message: string };

/** What is wrong with an advance on these terms, if anything. A zero advance is always fine. */
export function advanceIssue(terms: {
	priceMinor: number;
	currency: string;
	advanceMinor: number;
	fabricIncluded: boolean;
}): AdvanceIssue | null {
	if (terms.advanceMinor === 0) return null;
	if (!terms.fabricIncluded)
		return {
			path: 'advanceMinor',
			message: 'An advance for materials is possible only when you source the fabric (fabric included in the price).'
		};
	const max = maxAdvanceMinor(terms.priceMinor);
	if (terms.advanceMinor > max)
		return {
			path: 'advanceMinor',
			message: `The advance can be at most ${advanceLimitPercent} % of the price: ${formatMoney(max, terms.currency)} here.`
		};
	return null;
}
