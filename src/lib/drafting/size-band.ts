import type { MeasurementCode, Measurements } from './measurements';
import type { GarmentCategory } from './templates/types';

/*
 * Size indication from primary body dimensions, in the manner of EN 13402-3 / ISO 8559-2: body measurements
 * in whole centimetres (EN 13402-3: "the nearest whole number … is used for size designation"), shown as a
 * min–max range of the body. Intervals are a fixed 4 cm (EN 13402-3's open-ended scales with fixed intervals;
 * 4 cm is its usual women's step), centred on multiples of 4 cm as in the 88-72-96 pictogram body.
 * Which dimensions are primary for which garment follows ISO 8559-2 Table 1 as remembered (from memory):
 * bust and hip for tops and dresses, waist and hip for skirts and trousers.
 */
const bandWidthCm = 4;

const dimensionsFor: Record<GarmentCategory, MeasurementCode[]> = {
	top: ['bust_girth', 'hip_girth'],
	dress: ['bust_girth', 'hip_girth'],
	skirt: ['waist_girth', 'hip_girth'],
	trousers: ['waist_girth', 'hip_girth']
};

const names: Partial<Record<MeasurementCode, string>> = { bust_girth: 'bust', waist_girth: 'waist', hip_girth: 'hip' };

export interface SizeBandDimension {
	code: MeasurementCode;
	label: string;
	minCm: number;
	maxCm: number;
}

export interface SizeBand {
	dimensions: SizeBandDimension[];
	text: string;
}

export function bandFor(mm: number): { minCm: number; maxCm: number } {
	const wholeCm = Math.round(mm / 10);
	const centre = Math.round(wholeCm / bandWidthCm) * bandWidthCm;
	return { minCm: centre - bandWidthCm / 2, maxCm: centre + bandWidthCm / 2 };
}

/** "bust 86–90 cm, hip 94–98 cm"; null when the primary dimension is missing. */
export function sizeBand(body: Measurements, category: GarmentCategory): SizeBand | null {
	const [primary, ...secondary] = dimensionsFor[category];
	if (body[primary] === undefined) return null;
	const dimensions = [primary, ...secondary]
		.filter((code) => body[code] !== undefined)
		.map((code) => ({ code, label: names[code] ?? code, ...bandFor(body[code]!) }));
	return { dimensions, text: dimensions.map((d) => `${d.label} ${d.minCm}–${d.maxCm} cm`).join(', ') };
}
