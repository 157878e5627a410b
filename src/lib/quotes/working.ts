/**
 * The quote helper's working, shared by the server (pre-fill) and the browser (live recompute as the
 * tailor edits a figure): fabric metres × price per metre, the workroom's mark-up on fabric it sources,
 * labour hours × hourly rate, and the total. Integer minor units throughout, through `estimateQuote`.
 */
import type { QuoteLine } from '$lib/drafting';
import { estimateQuote, minorUnitExponent } from '$lib/drafting/quote';

export type WorkingInput = {
	currency: string;
	/** Whether the workroom buys the fabric (and so charges for it); otherwise the customer brings it. */
	tailorSourcesFabric: boolean;
	fabricMetres: number;
	fabricPricePerMetreMinor: number;
	labourHours: number;
	hourlyRateMinor: number;
	/** Whole percent added to the cost of the cloth the workroom buys (the fabric when it sources it, the lining). */
	markupPercent: number;
	/**
	 * A lined garment's lining, from the lining layout: the workroom buys it (a trimming, whoever brings the
	 * fabric). Left out for an unlined garment, which then has no lining line.
	 */
	lining?: { metres: number; pricePerMetreMinor: number };
};

export type WorkingLine = QuoteLine & { detail: string };

export type Working = {
	currency: string;
	exponent: number;
	lines: WorkingLine[];
	totalMinor: number;
	range: { lowMinor: number; highMinor: number };
};

/** a × pct ÷ 100, rounded half up, for non-negative integers. */
function percentOf(amountMinor: number, percent: number) {
	return Math.floor((2 * amountMinor * percent + 100) / 200);
}

function money(minor: number, currency: string) {
	const exponent = minorUnitExponent(currency);
	if (exponent === 0) return `${minor} ${currency}`;
	const digits = String(minor).padStart(exponent + 1, '0');
	return `${digits.slice(0, -exponent)}.${digits.slice(-exponent)} ${currency}`;
}

/** The itemised working; figures outside sense (negative, not numbers) count as zero. */
export function quoteWorking(input: WorkingInput): Working {
	const clean = (n: number) => (Number.isFinite(n) && n > 0 ? n : 0);
	const metres = clean(input.fabricMetres);
	const perMetre = Math.round(clean(input.fabricPricePerMetreMinor));
	const hours = clean(input.labourHours);
	const rate = Math.round(clean(input.hourlyRateMinor));
	const markup = Math.round(clean(input.markupPercent));
	const sourced = input.tailorSourcesFabric;
	const lining = input.lining && {
		metres: clean(input.lining.metres),
		perMetre: Math.round(clean(input.lining.pricePerMetreMinor))
	};
	const base = estimateQuote({
		currency: input.currency,
		fabric: sourced
			? { supply: 'tailor', pricePerUnitMinor: perMetre, per: 'm', length: metres }
			: { supply: 'customer' },
		...(lining ? { lining: { pricePerUnitMinor: lining.perMetre, per: 'm' as const, length: lining.metres } } : {}),
		labourHours: hours,
		hourlyRateMinor: rate
	});
	const fabric = base.lines.find((line) => line.id === 'fabric')!;
	const liningLine = base.lines.find((line) => line.id === 'lining');
	const labour = base.lines.find((line) => line.id === 'labour')!;
	const bought = (sourced ? fabric.amountMinor : 0) + (liningLine?.amountMinor ?? 0);
	const markupMinor = sourced || liningLine ? percentOf(bought, markup) : 0;
	const markupOf = [sourced ? 'fabric' : '', liningLine ? 'lining' : ''].filter(Boolean).join(' and ');
	const lines: WorkingLine[] = [
		{
			...fabric,
			label: sourced ? 'Fabric' : 'Fabric (the customer brings it)',
			detail: sourced ? `${metres} m × ${money(perMetre, input.currency)}` : 'Not charged'
		},
		...(liningLine && lining
			? [
					{
						...liningLine,
						label: 'Lining',
						detail: `${lining.metres} m × ${money(lining.perMetre, input.currency)}`
					}
				]
			: []),
		...(sourced || liningLine
			? [
					{
						id: 'markup',
						label: `Mark-up on ${markupOf}`,
						amountMinor: markupMinor,
						detail: `${markup} % of ${money(bought, input.currency)}`
					}
				]
			: []),
		{ ...labour, label: 'Labour', detail: `${Math.round(hours * 100) / 100} h × ${money(rate, input.currency)}` }
	];
	const totalMinor = base.totalMinor + markupMinor;
	return {
		currency: input.currency,
		exponent: base.exponent,
		lines,
		totalMinor,
		range: { lowMinor: percentOf(totalMinor, 90), highMinor: percentOf(totalMinor, 110) }
	};
}
