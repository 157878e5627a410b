import { mmPerInch } from './units';

const inch = (value: number) => value * mmPerInch;

export const fits = ['fitted', 'regular', 'relaxed'] as const;
export type Fit = (typeof fits)[number];

export interface WearingEase {
	bust: number;
	dressWaist: number;
	skirtWaist: number;
	hip: number;
}

/**
 * Total wearing ease (garment girth − body girth) for woven fabric, mm.
 * fitted: low ends of the Central Washington University course text "Ch. 16 Ease in Clothing"
 * (bodice bust 1½–2 in, dress waist ¾–1 in, skirt & pants waist ½–¾ in, hip 2–2¾ in);
 * regular: the high ends of the same ranges;
 * relaxed: McCunn's upper fitting ease (How to Make Sewing Patterns: bust 4 in, waist 2 in) with
 * 4 in at the hip as design ease (common practice).
 */
export const wearingEase: Readonly<Record<Fit, WearingEase>> = {
	fitted: { bust: inch(1.5), dressWaist: inch(0.75), skirtWaist: inch(0.5), hip: inch(2) },
	regular: { bust: inch(2), dressWaist: inch(1), skirtWaist: inch(0.75), hip: inch(2.75) },
	relaxed: { bust: inch(4), dressWaist: inch(2), skirtWaist: inch(1), hip: inch(4) }
};

/**
 * A loose tunic carries design ease well beyond wearing ease (CWU ch. 16: "loose = a great deal", no figure).
 * fitted starts at McCunn's 4 in bust fitting ease; the larger figures are common practice.
 */
export const looseEase: Readonly<Record<Fit, number>> = {
	fitted: inch(4),
	regular: inch(8),
	relaxed: inch(12)
};
