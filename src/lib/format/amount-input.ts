import { isCurrencyCode, minorUnitExponent } from '../drafting/quote';

export type ParsedAmount = { ok: true; minor: number } | { ok: false; message: string };

/**
 * A typed amount ("35", "35.5", "1 250,00") as integer minor units of `currency`, using the currency's
 * ISO 4217 exponent: "35.5" EUR is 3550, "1200" JPY is 1200. Either '.' or ',' may mark the decimals;
 * spaces group thousands. No float ever carries the money.
 */
export function parseAmount(typed: string, currency: string): ParsedAmount {
	if (!isCurrencyCode(currency)) return { ok: false, message: 'Choose a currency.' };
	const compact = typed.replace(/[\s\u00a0\u2009\u202f]/g, '');
	const match = /^(\d+)(?:[.,](\d+))?$/.exec(compact);
	if (!match) return { ok: false, message: 'Enter an amount such as 35 or 35.50.' };
	const exponent = minorUnitExponent(currency);
	const [, whole, fraction = ''] = match;
	if (fraction.length > exponent) {
		return {
			ok: false,
			message: exponent === 0 ? `${currency} has no decimals.` : `Use at most ${exponent} decimals for ${currency}.`
		};
	}
	const minor = Number(whole.replace(/^0+(?=\d)/, '') + fraction.padEnd(exponent, '0'));
	if (!Number.isSafeInteger(minor)) return { ok: false, message: 'That amount is too large.' };
	return { ok: true, minor };
}

/** Minor units back as the plain text a person would type: 3550 EUR → "35.50", 1200 JPY → "1200". */
export function amountInputValue(minor: number, currency: string): string {
	const exponent = minorUnitExponent(currency);
	if (exponent === 0) return String(minor);
	const digits = String(minor).padStart(exponent + 1, '0');
	return `${digits.slice(0, -exponent)}.${digits.slice(-exponent)}`;
}

/** ISO 4217 codes this runtime knows, each with its English name, sorted by code. */
export function currencyChoices(): { code: string; name: string }[] {
	const names = new Intl.DisplayNames('en', { type: 'currency' });
	return Intl.supportedValuesOf('currency')
		.filter(isCurrencyCode)
		.map((code) => ({ code, name: names.of(code) ?? code }));
}
