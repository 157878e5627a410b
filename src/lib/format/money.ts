import { minorUnitExponent } from '../drafting/quote';

/** Integer minor units as an exact decimal string ("-12.50"), so money never passes through a float. */
function toDecimal(amountMinor: number, exponent: number): string {
	if (!Number.isSafeInteger(amountMinor)) throw new RangeError('Money must be a whole number of minor units');
	const digits = String(Math.abs(amountMinor)).padStart(exponent + 1, '0');
	const major = exponent ? `${digits.slice(0, -exponent)}.${digits.slice(-exponent)}` : digits;
	return amountMinor < 0 ? `-${major}` : major;
}

/** Formatters made so far (building one costs far more than formatting with it), by locale, currency and digits. */
const formatters = new Map<string, Intl.NumberFormat>();

/** Whole units when every amount shown is whole (€450), the currency's minor digits otherwise (€60.50). */
function formatterFor(amountsMinor: number[], currency: string, locale: string) {
	const exponent = minorUnitExponent(currency);
	const whole = amountsMinor.every((amount) => amount % 10 ** exponent === 0);
	const digits = whole ? 0 : exponent;
	const key = `${locale}|${currency}|${digits}`;
	let formatter = formatters.get(key);
	if (!formatter) {
		formatter = new Intl.NumberFormat(locale, {
			style: 'currency',
			currency,
			minimumFractionDigits: digits,
			maximumFractionDigits: digits
		});
		if (formatters.size < 512) formatters.set(key, formatter);
	}
	return { formatter, exponent };
}

// Intl formats decimal strings exactly (Intl.NumberFormat v3); its types still say number.
type Exact = number & string;

/** One amount in integer minor units of an ISO 4217 currency: "€450", "€60.50", "¥19,500". */
export function formatMoney(amountMinor: number, currency: string, locale = 'en'): string {
	const { formatter, exponent } = formatterFor([amountMinor], currency, locale);
	return formatter.format(toDecimal(amountMinor, exponent) as Exact);
}

/**
 * One amount written alike with the others shown beside it (a column of figures): whole units only when every
 * one of them is whole, so "€192" never sits above "€19.20".
 */
export function formatMoneyAmong(amountMinor: number, amountsShownMinor: number[], currency: string, locale = 'en') {
	const { formatter, exponent } = formatterFor([amountMinor, ...amountsShownMinor], currency, locale);
	return formatter.format(toDecimal(amountMinor, exponent) as Exact);
}

/** Ranges written so far, by locale, currency and both ends. */
const rangesWritten = new Map<string, string>();

/** A range such as a budget, the way the locale writes ranges: "€450 – €650"; one amount when both ends agree. */
export function formatMoneyRange(minMinor: number, maxMinor: number, currency: string, locale = 'en'): string {
	if (minMinor === maxMinor) return formatMoney(minMinor, currency, locale);
	// ICU's range formatting is slow next to everything else on a card; budgets repeat, so keep what it wrote.
	const key = `${locale}|${currency}|${minMinor}|${maxMinor}`;
	const known = rangesWritten.get(key);
	if (known !== undefined) return known;
	const { formatter, exponent } = formatterFor([minMinor, maxMinor], currency, locale);
	const text = formatter.formatRange(toDecimal(minMinor, exponent) as Exact, toDecimal(maxMinor, exponent) as Exact);
	if (rangesWritten.size >= 2048) rangesWritten.clear();
	rangesWritten.set(key, text);
	return text;
}
