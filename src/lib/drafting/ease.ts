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

export interface TrouserEase {
	/** Added to each quarter waist. */
	waistPerQuarter: number;
	/** Finished hip girth − body hip, all round. */
	hip: number;
	/** Finished thigh girth − body thigh, each leg. */
	thigh: number;
}

/**
 * Trouser ease. "regular" is the worked quarter-hip method (common practice): 1 in on each quarter waist
 * and none at hip or thigh; "fitted" takes half the waist ease. "relaxed" adds the relaxed hip ease of
 * the table above (4 in) and 2 in at the thigh, the top of the 1½–2 in minimum thigh ease for trousers in
 * Liechty, Pottberg & Rasband, Fitting & Pattern Alteration (from memory).
 */
export const trouserEase: Readonly<Record<Fit, TrouserEase>> = {
	fitted: { waistPerQuarter: inch(0.5), hip: 0, thigh: 0 },
	regular: { waistPerQuarter: inch(1), hip: 0, thigh: 0 },
	relaxed: { waistPerQuarter: inch(1.5), hip: wearingEase.relaxed.hip, thigh: inch(2) }
};

/**
 * Total chest/bust ease for a shirt or blouse with set-in sleeves. fitted: 2 in, inside the CWU "Ease in
 * Clothing" fitted-shirt range 1½–2½ in; regular: 3 in, the CWU "classic shirt up to 3 in"; relaxed: 4 in,
 * McCunn's fitting ease "4 in with sleeves" (How to Make Sewing Patterns). Waist and hip take the wearing
 * ease above; a blouse waist is McCunn's 2 in at regular.
 */
export const shirtEase: Readonly<Record<Fit, { bust: number; waist: number; hip: number }>> = {
	fitted: { bust: inch(2), waist: inch(1), hip: wearingEase.fitted.hip },
	regular: { bust: inch(3), waist: inch(2), hip: wearingEase.regular.hip },
	relaxed: { bust: inch(4), waist: inch(3), hip: wearingEase.relaxed.hip }
};

/**
 * A set-in sleeve's biceps should be at least 2 in larger than the arm (Threads, "Set-in sleeve solutions",
 * 2021; dresspatternmaking.com sleeve block notes: 2 in for the standard figure, up to 4 in for freedom).
 */
export const bicepsEase: Readonly<Record<Fit, number>> = {
	fitted: inch(2),
	regular: inch(2.5),
	relaxed: inch(3)
};

/**
 * A waistcoat is worn over a shirt, so it carries the shirt beneath it as well as its own wearing ease
 * (from memory: about 8–10 cm over the chest for a classic waistcoat). regular is McCunn's 4 in bust fitting
 * ease; fitted takes the CWU bodice 2 in plus 1 in for the shirt; relaxed is common practice. At the waist
 * a waistcoat sits close: the CWU dress waist range ¾–1 in plus 1 in for the shirt at fitted and regular.
 */
export const waistcoatEase: Readonly<Record<Fit, { chest: number; waist: number }>> = {
	fitted: { chest: inch(3), waist: inch(1.75) },
	regular: { chest: inch(4), waist: inch(2) },
	relaxed: { chest: inch(6), waist: inch(3) }
};
