/**
 * Lengths are stored in millimetres and shown in centimetres or inches.
 * 1 in = 25.4 mm and 1 yd = 0.9144 m exactly (international yard and pound agreement, 1959).
 */
export const mmPerInch = 25.4;
export const mmPerCm = 10;
export const mmPerYard = 914.4;
export const mmPerMetre = 1000;

export const units = ['in', 'cm'] as const;
export type Unit = (typeof units)[number];

/** The unit fabric is bought in for each display unit. */
export type BuyUnit = 'yd' | 'm';

export function toMm(value: number, unit: Unit): number {
	return unit === 'in' ? value * mmPerInch : value * mmPerCm;
}

export function fromMm(mm: number, unit: Unit): number {
	return unit === 'in' ? mm / mmPerInch : mm / mmPerCm;
}

/** A value in the unit, rounded for an API answer: 0.001 in or 0.01 cm (well under a tape's reading). */
export function toUnitValue(mm: number, unit: Unit): number {
	const value = fromMm(mm, unit);
	const step = unit === 'in' ? 1000 : 100;
	return Math.round(value * step) / step;
}

const vulgarFractions: Record<string, string> = {
	'¼': '1/4',
	'½': '1/2',
	'¾': '3/4',
	'⅛': '1/8',
	'⅜': '3/8',
	'⅝': '5/8',
	'⅞': '7/8'
};

const unitSuffixes: Array<[RegExp, Unit | 'mm']> = [
	[/\s*(?:mm|millimet(?:re|er)s?)$/i, 'mm'],
	[/\s*(?:cm|centimet(?:re|er)s?)$/i, 'cm'],
	[/\s*(?:in|inch|inches|"|″)$/i, 'in']
];

export type ParsedLength = { ok: true; mm: number; unit: Unit | 'mm' } | { ok: false; message: string };

/**
 * Reads what a person types into a length field: `10.25`, `10 1/4`, `10-1/4`, `10¼`, `3/8`,
 * `26,5`, and an optional unit suffix (`26 cm`, `10 in`, `10"`, `260 mm`) that overrides the field's unit.
 */
export function parseLength(text: string, fieldUnit: Unit): ParsedLength {
	let rest = text.trim();
	for (const [symbol, fraction] of Object.entries(vulgarFractions)) {
		rest = rest.replaceAll(symbol, ` ${fraction}`);
	}
	rest = rest.trim();
	let unit: Unit | 'mm' = fieldUnit;
	for (const [pattern, suffixUnit] of unitSuffixes) {
		if (pattern.test(rest)) {
			unit = suffixUnit;
			rest = rest.replace(pattern, '').trim();
			break;
		}
	}
	const amount = parseAmount(rest);
	if (amount === null) {
		return { ok: false, message: `“${text.trim()}” is not a length. Try 10.25, 10 1/4 or 26 cm.` };
	}
	const mm = unit === 'mm' ? amount : toMm(amount, unit);
	return { ok: true, mm, unit };
}

export interface ParsedLengths {
	mm: Record<string, number>;
	problems: Record<string, string>;
}

/** Several typed lengths at once: the readable ones in mm, a message for each unreadable one; blanks are skipped. */
export function parseLengths(texts: Record<string, string>, fieldUnit: Unit): ParsedLengths {
	const mm: Record<string, number> = {};
	const problems: Record<string, string> = {};
	for (const [key, text] of Object.entries(texts)) {
		if (!text.trim()) continue;
		const parsed = parseLength(text, fieldUnit);
		if (parsed.ok) mm[key] = parsed.mm;
		else problems[key] = parsed.message;
	}
	return { mm, problems };
}

/** Typed lengths rewritten in another unit so nothing changes size; unreadable entries stay as typed. */
export function retypeLengths(
	texts: Record<string, string>,
	parsed: ParsedLengths,
	next: Unit
): Record<string, string> {
	return Object.fromEntries(
		Object.entries(texts).map(([key, text]) => [
			key,
			parsed.mm[key] !== undefined ? formatForInput(parsed.mm[key], next) : text
		])
	);
}

function parseAmount(text: string): number | null {
	const decimal = /^\d+(?:[.,]\d+)?$|^[.,]\d+$/;
	if (decimal.test(text)) return Number(text.replace(',', '.'));
	const mixed = /^(\d+)(?:\s+|\s*-\s*)(\d+)\s*\/\s*(\d+)$/.exec(text);
	if (mixed) return fraction(Number(mixed[1]), Number(mixed[2]), Number(mixed[3]));
	const simple = /^(\d+)\s*\/\s*(\d+)$/.exec(text);
	if (simple) return fraction(0, Number(simple[1]), Number(simple[2]));
	return null;
}

function fraction(whole: number, numerator: number, denominator: number): number | null {
	if (denominator === 0 || numerator >= denominator) return null;
	return whole + numerator / denominator;
}

/** Inches to the nearest eighth as whole eighths (ties away from zero, common practice). */
export function toEighths(mm: number): number {
	const eighths = (mm / mmPerInch) * 8;
	return Math.sign(eighths) * Math.round(Math.abs(eighths) + 1e-9);
}

/** `10 3/8`, `3/8`, `10` — inches to the nearest eighth. */
export function formatInches(mm: number): string {
	const eighths = toEighths(mm);
	const sign = eighths < 0 ? '−' : '';
	const abs = Math.abs(eighths);
	const whole = Math.floor(abs / 8);
	const rest = abs % 8;
	if (rest === 0) return `${sign}${whole}`;
	const divisor = gcd(rest, 8);
	const fractionText = `${rest / divisor}/${8 / divisor}`;
	return whole === 0 ? `${sign}${fractionText}` : `${sign}${whole} ${fractionText}`;
}

/** Centimetres to one decimal, without a trailing `.0`. */
export function formatCentimetres(mm: number): string {
	const tenths = Math.round(mm + (mm >= 0 ? 1e-9 : -1e-9));
	const text = (tenths / 10).toFixed(1).replace(/\.0$/, '');
	return text.replace('-', '−');
}

export function formatLength(mm: number, unit: Unit, options: { withUnit?: boolean } = {}): string {
	const text = unit === 'in' ? formatInches(mm) : formatCentimetres(mm);
	return options.withUnit ? `${text} ${unit}` : text;
}

/** A length as it goes back into an input field (same as the display, so it round-trips). */
export function formatForInput(mm: number, unit: Unit): string {
	return formatLength(mm, unit);
}

export function buyUnitFor(unit: Unit): BuyUnit {
	return unit === 'in' ? 'yd' : 'm';
}

/** Rounds a fabric length up to the usual buying step: 1/8 yd for yards, 0.1 m for metres. */
export function roundUpFabric(mm: number, buyUnit: BuyUnit): { mm: number; value: number } {
	const step = buyUnit === 'yd' ? mmPerYard / 8 : mmPerMetre / 10;
	const steps = Math.ceil(mm / step - 1e-9);
	const roundedMm = steps * step;
	return buyUnit === 'yd' ? { mm: roundedMm, value: steps / 8 } : { mm: roundedMm, value: steps / 10 };
}

/** `2 5/8 yd`, `1.6 m`. */
export function formatFabricLength(value: number, buyUnit: BuyUnit): string {
	if (buyUnit === 'm') return `${value.toFixed(1)} m`;
	return `${formatInches(value * mmPerInch)} yd`;
}

function gcd(a: number, b: number): number {
	return b === 0 ? a : gcd(b, a % b);
}
