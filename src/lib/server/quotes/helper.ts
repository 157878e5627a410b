import { garments, minorUnitExponent, type GarmentId } from '$lib/drafting';
import type { SizeBandRange } from '$lib/format/size-band';
import { quoteWorking, type Working, type WorkingInput } from '$lib/quotes/working';
import type { WorkroomRates } from '$lib/types/workroom';
import { fabricEstimateForBand, liningEstimateForBand, typicalLeadDays } from '../commissions';
import { commissionForQuoting } from '../commissions/for-quoting';
import { sizeBandOf } from '../commissions/quotes-read';
import type { Executor } from '../db';
import { activeOrderDueDates } from '../orders/load';
import * as workrooms from '../workrooms';
import { latestQuoteOf } from './queries';

/**
 * A starting price per metre for fabric the workroom buys, in major units: a mid-range dress or suiting
 * cloth sold by the metre (from memory). Only a starting figure; the tailor types what they pay.
 */
export const startingFabricPricePerMetre = 25;

/**
 * A starting price per metre for lining (a viscose or acetate lining sold by the metre), in major units
 * (from memory). Only a starting figure; the tailor types what they pay.
 */
export const startingLiningPricePerMetre = 8;

export type HelperFacts = {
	garmentType: string;
	sizeBand: readonly SizeBandRange[];
	fabricSource: 'customer_supplies' | 'tailor_sources';
	currency: string;
	rates: WorkroomRates | null;
	leadTimes: Partial<Record<string, number>>;
	leadTimeDays?: number;
};

export type HelperPrefill = {
	input: WorkingInput;
	working: Working;
	/** Where each figure came from, in plain words, for the tailor to check. */
	notes: string[];
	/** Days the workroom usually needs for this garment: the suggested delivery is that far off. */
	leadDays: number;
};

/** "1.6 m" (the estimate in metres) → 1.6; anything else is no estimate. */
function metresOf(display: string | undefined) {
	const match = display && /^(\d+(?:\.\d+)?) m$/.exec(display);
	return match ? Number(match[1]) : null;
}

/**
 * The quote helper's starting figures: fabric metres from the size band's estimate, the workroom's labour
 * hours for the garment and its hourly rate, its mark-up on fabric it buys; then the working.
 */
export function prefill(facts: HelperFacts): HelperPrefill {
	const notes: string[] = [];
	const garment = garments.find((g) => g.id === facts.garmentType);
	const sourced = facts.fabricSource === 'tailor_sources';
	const estimate = fabricEstimateForBand(facts.garmentType, facts.sizeBand, 'cm');
	const estimated = metresOf(estimate?.length);
	const fabricMetres = estimated ?? 0;
	if (!sourced) notes.push('The customer brings the fabric, so it is not charged.');
	else if (estimated !== null)
		notes.push(`Fabric: ${estimate!.length} of ${estimate!.width} cm wide cloth for the middle of the size band.`);
	else notes.push('No fabric estimate for this garment: enter the length you would buy.');

	const rates = facts.rates;
	const sameCurrency = rates !== null && rates.currency === facts.currency;
	const ownHours = rates?.labourHours[facts.garmentType as GarmentId];
	const labourHours = ownHours ?? garment?.defaultLabourHours ?? 0;
	if (ownHours === undefined)
		notes.push(
			garment
				? `Labour: ${labourHours} h, the usual time for this garment; your own hours are not set for it.`
				: 'Labour: enter the hours this piece will take you.'
		);
	const hourlyRateMinor = sameCurrency ? rates.hourlyRateMinor : 0;
	if (rates && !sameCurrency)
		notes.push(
			`Your hourly rate is in ${rates.currency} and this commission is priced in ${facts.currency}: enter your rate in ${facts.currency}.`
		);
	else if (!rates) notes.push('Labour: enter your hourly rate.');

	const lining = liningEstimateForBand(facts.garmentType, facts.sizeBand, 'cm');
	const liningMetres = metresOf(lining?.length ?? undefined);
	if (lining)
		notes.push(
			liningMetres !== null
				? `Lining: ${lining.length} of ${lining.width} cm wide lining for the ${lining.pieces}, laid apart from the cloth; you buy it, whoever brings the cloth. The price is a starting figure per metre.`
				: 'Lining: enter the length you would buy.'
		);
	const input: WorkingInput = {
		currency: facts.currency,
		tailorSourcesFabric: sourced,
		fabricMetres,
		fabricPricePerMetreMinor: startingFabricPricePerMetre * 10 ** minorUnitExponent(facts.currency),
		labourHours,
		hourlyRateMinor,
		markupPercent: rates?.fabricMarkupPercent ?? 0,
		...(lining
			? {
					lining: {
						metres: liningMetres ?? 0,
						pricePerMetreMinor: startingLiningPricePerMetre * 10 ** minorUnitExponent(facts.currency)
					}
				}
			: {})
	};
	if (sourced) notes.push('Fabric price: a starting figure per metre; change it to what the cloth costs you.');
	const leadDays =
		facts.leadTimes[facts.garmentType] ??
		facts.leadTimeDays ??
		typicalLeadDays[facts.garmentType as GarmentId] ??
		typicalLeadDays.other;
	return { input, working: quoteWorking(input), notes, leadDays };
}

/**
 * Everything the quote page needs for one tailor and commission: the commission's quoting facts, whether
 * the workroom may quote, its latest quote there, and the helper's starting figures. Null when the
 * commission is not one the tailor may see (a draft, someone else's closed one, or no such id).
 */
export async function quoteContext(
	db: Executor,
	{ commissionId, tailorId }: { commissionId: string; tailorId: string }
) {
	const commission = await commissionForQuoting(db, { id: commissionId });
	if (!commission || commission.status === 'draft') return null;
	const today = new Date().toISOString().slice(0, 10);
	const [latest, workroom, band, mayQuote, bookedDueDates] = await Promise.all([
		latestQuoteOf(db, { commissionId, tailorId }),
		workrooms.getOwn(db, { tailorId }),
		sizeBandOf(db, commissionId),
		workrooms.canQuote(db, { tailorId }),
		activeOrderDueDates(db, { tailorId, from: today })
	]);
	if (commission.status !== 'open' && !latest) return null;
	const helper = prefill({
		garmentType: commission.garmentType,
		sizeBand: band,
		fabricSource: commission.fabricSource,
		currency: commission.currency,
		rates: workroom?.rates ?? null,
		leadTimes: workroom?.leadTimes ?? {}
	});
	return { commission, sizeBand: band, workroom, mayQuote, latest, helper, bookedDueDates };
}
