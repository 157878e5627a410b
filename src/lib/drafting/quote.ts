/**
 * Quote helper: fabric, labour, notions and extras → an itemised suggested price in integer minor units
 * of an ISO 4217 currency. No floating-point money: amounts are integers, rates are applied with integer
 * arithmetic and rounded half up once per line.
 */

/** ISO 4217 minor units for codes where engines have disagreed; otherwise Intl (CLDR, which follows ISO 4217). */
const minorUnitTable: Readonly<Record<string, number>> = {
	BHD: 3,
	JOD: 3,
	KWD: 3,
	OMR: 3,
	TND: 3,
	IQD: 3,
	LYD: 3,
	JPY: 0,
	KRW: 0,
	CLP: 0,
	ISK: 0,
	PYG: 0,
	UGX: 0,
	VND: 0,
	XAF: 0,
	XOF: 0,
	XPF: 0,
	RWF: 0,
	BIF: 0,
	DJF: 0,
	GNF: 0,
	KMF: 0,
	VUV: 0
};

export function isCurrencyCode(code: string): boolean {
	if (!/^[A-Z]{3}$/.test(code)) return false;
	if (code in minorUnitTable) return true;
	const supported = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('currency') : null;
	return supported ? supported.includes(code) : true;
}

/** Exponents Intl was asked for, by currency: building a NumberFormat costs far more than the lookup. */
const askedExponents = new Map<string, number>();

export function minorUnitExponent(currency: string): number {
	const known = minorUnitTable[currency] ?? askedExponents.get(currency);
	if (known !== undefined) return known;
	const exponent =
		new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
	if (askedExponents.size < 512) askedExponents.set(currency, exponent);
	return exponent;
}

/** a × b ÷ d rounded half up, for non-negative integers. */
function mulDivRound(a: number, b: number, d: number): number {
	const product = a * b;
	if (!Number.isSafeInteger(product)) throw new RangeError('Amount too large');
	return Math.floor((2 * product + d) / (2 * d));
}

export type FabricCost =
	| { supply: 'customer' }
	| { supply: 'tailor'; pricePerUnitMinor: number; per: 'yd' | 'm'; length: number; lengthUnit?: 'yd' | 'm' };

/** Lining cloth the tailor buys for a lined garment: its own length (from the lining marker) and price. */
export interface LiningCost {
	pricePerUnitMinor: number;
	per: 'yd' | 'm';
	length: number;
	lengthUnit?: 'yd' | 'm';
}

export interface PricedItem {
	label: string;
	amountMinor: number;
}

export interface QuoteInput {
	currency: string;
	fabric: FabricCost;
	/** Only for a lined garment; an unlined one has no lining line. */
	lining?: LiningCost;
	labourHours: number;
	hourlyRateMinor: number;
	notions?: PricedItem[];
	extras?: PricedItem[];
}

export interface QuoteLine {
	id: string;
	label: string;
	amountMinor: number;
}

export interface QuoteEstimate {
	currency: string;
	exponent: number;
	lines: QuoteLine[];
	totalMinor: number;
	/** Suggested range the tailor can edit: total −10 % to +10 % (common practice). */
	range: { lowMinor: number; highMinor: number };
}

const metresPerYardThousandths = 914.4;

/** Length × price per unit, the length first converted to the price's unit (to thousandths). */
function clothLine(id: string, name: string, cloth: LiningCost): QuoteLine {
	const from = cloth.lengthUnit ?? cloth.per;
	// Lengths to thousandths of the price unit: 1 yd = 0.9144 m exactly.
	const thousandths =
		from === cloth.per
			? Math.round(cloth.length * 1000)
			: from === 'yd'
				? Math.round(cloth.length * metresPerYardThousandths)
				: Math.round((cloth.length * 1000 * 1000) / metresPerYardThousandths);
	const amountMinor = mulDivRound(cloth.pricePerUnitMinor, thousandths, 1000);
	return { id, label: `${name}, ${thousandths / 1000} ${cloth.per}`, amountMinor };
}

function fabricLine(fabric: FabricCost): QuoteLine {
	if (fabric.supply === 'customer') return { id: 'fabric', label: 'Fabric (customer supplies)', amountMinor: 0 };
	return clothLine('fabric', 'Fabric', fabric);
}

export function estimateQuote(input: QuoteInput): QuoteEstimate {
	const hundredths = Math.round(input.labourHours * 100);
	const lines: QuoteLine[] = [
		fabricLine(input.fabric),
		...(input.lining ? [clothLine('lining', 'Lining', input.lining)] : []),
		{
			id: 'labour',
			label: `Labour, ${hundredths / 100} h`,
			amountMinor: mulDivRound(input.hourlyRateMinor, hundredths, 100)
		},
		...(input.notions ?? []).map((n, i) => ({ id: `notion_${i + 1}`, label: n.label, amountMinor: n.amountMinor })),
		...(input.extras ?? []).map((e, i) => ({ id: `extra_${i + 1}`, label: e.label, amountMinor: e.amountMinor }))
	];
	const totalMinor = lines.reduce((sum, line) => sum + line.amountMinor, 0);
	if (!Number.isSafeInteger(totalMinor)) throw new RangeError('Amount too large');
	return {
		currency: input.currency,
		exponent: minorUnitExponent(input.currency),
		lines,
		totalMinor,
		range: { lowMinor: mulDivRound(totalMinor, 90, 100), highMinor: mulDivRound(totalMinor, 110, 100) }
	};
}

/** "12.50" → 1250 for USD, "500" → 500 for JPY; string arithmetic, no floats. Null when not a price. */
export function parseMoney(text: string, currency: string): number | null {
	const exponent = minorUnitExponent(currency);
	const match = /^\s*(\d{1,12})(?:[.,](\d*))?\s*$/.exec(text);
	if (!match) return null;
	const fraction = match[2] ?? '';
	if (fraction.length > exponent) return null;
	return Number(match[1] + fraction.padEnd(exponent, '0'));
}

const moneyFormats = new Map<string, Intl.NumberFormat>();

export function formatMoney(amountMinor: number, currency: string, locale = 'en'): string {
	const exponent = minorUnitExponent(currency);
	const negative = amountMinor < 0;
	const digits = String(Math.abs(amountMinor)).padStart(exponent + 1, '0');
	const major = exponent ? `${digits.slice(0, -exponent)}.${digits.slice(-exponent)}` : digits;
	const key = `${locale}|${currency}`;
	let formatter = moneyFormats.get(key);
	if (!formatter) {
		formatter = new Intl.NumberFormat(locale, {
			style: 'currency',
			currency,
			minimumFractionDigits: exponent,
			maximumFractionDigits: exponent
		});
		if (moneyFormats.size < 512) moneyFormats.set(key, formatter);
	}
	// Intl formats a decimal string exactly, so money never passes through a float.
	return formatter.format(`${negative ? '-' : ''}${major}` as unknown as number);
}
