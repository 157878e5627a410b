import { isCurrencyCode, minorUnitExponent } from '$lib/drafting';

export type FeeSplit = {
	priceMinor: number;
	platformFeeMinor: number;
	tailorPayoutMinor: number;
	platformFeeBasisPoints: number;
	currency: string;
	/** ISO 4217 minor-unit digits of the currency: the amounts above count units of 10^-exponent. */
	exponent: number;
};

/**
 * Splits a price into the platform's fee and the tailor's payout. The fee is price × rate rounded half up to
 * the currency's minor unit — the amounts already count minor units, so that is a whole number of them — in
 * integer arithmetic only; the payout is what is left, so the two always add up to the price.
 */
export function splitPrice(priceMinor: number, currency: string, basisPoints: number): FeeSplit {
	if (!Number.isSafeInteger(priceMinor) || priceMinor <= 0)
		throw new RangeError('The price must be a positive whole number of minor units');
	if (!Number.isInteger(basisPoints) || basisPoints < 0 || basisPoints > 10_000)
		throw new RangeError('The fee rate must be between 0 and 10 000 basis points');
	if (!isCurrencyCode(currency)) throw new RangeError(`Not an ISO 4217 currency: ${currency}`);
	const product = priceMinor * basisPoints;
	if (!Number.isSafeInteger(product)) throw new RangeError('Amount too large');
	// floor((p·r + 5 000) / 10 000) is p·r / 10 000 rounded half up, for non-negative p·r.
	const platformFeeMinor = Math.floor((product + 5_000) / 10_000);
	return {
		priceMinor,
		platformFeeMinor,
		tailorPayoutMinor: priceMinor - platformFeeMinor,
		platformFeeBasisPoints: basisPoints,
		currency,
		exponent: minorUnitExponent(currency)
	};
}

/** "10 %", "12.5 %": a basis-point rate as people read it. */
export function rateText(basisPoints: number): string {
	const whole = Math.floor(basisPoints / 100);
	const rest = basisPoints % 100;
	return rest ? `${whole}.${String(rest).padStart(2, '0').replace(/0$/, '')} %` : `${whole} %`;
}
