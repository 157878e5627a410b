import type { MeasurementCode, Measurements } from './measurements';
import type { GarmentCategory } from './templates/types';

/*
 * Size indication from the control dimensions of EN 13402-3: each designation (88, 92, …) stands for the body
 * girths from half way to the designation below up to, not including, half way to the one above. Girths are
 * placed as measured — rounding first could put a body in a band that does not contain it. Women's bust
 * designations step by 4 cm up to 104 and by 6 cm above (110, 116, …), waist and hip by 4 cm (EN 13402-3
 * tables, from memory; the standard's wider steps at the largest waist and hip sizes are not encoded).
 * Which dimensions are primary for which garment follows ISO 8559-2 Table 1 as remembered (from memory):
 * bust and hip for tops and dresses, waist and hip for skirts and trousers.
 */
const steps: Partial<Record<MeasurementCode, ReadonlyArray<{ fromCm: number; stepCm: number }>>> = {
	bust_girth: [
		{ fromCm: 0, stepCm: 4 },
		{ fromCm: 104, stepCm: 6 }
	]
};
const everyFour = [{ fromCm: 0, stepCm: 4 }];

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
	/** Lowest girth in the band (inclusive). */
	minCm: number;
	/** Girth where the next band starts (exclusive). */
	maxCm: number;
	/** The standard's designation for the band (its centre). */
	designationCm: number;
}

export interface SizeBand {
	dimensions: SizeBandDimension[];
	text: string;
}

function designationAfter(code: MeasurementCode, cm: number): number {
	const table = steps[code] ?? everyFour;
	const { stepCm } = table.filter((s) => cm >= s.fromCm).at(-1)!;
	return cm + stepCm;
}

function designationBefore(code: MeasurementCode, cm: number): number {
	const table = steps[code] ?? everyFour;
	const { stepCm } = table.filter((s) => cm > s.fromCm).at(-1)!;
	return cm - stepCm;
}

export function bandFor(code: MeasurementCode, mm: number): Omit<SizeBandDimension, 'code' | 'label'> {
	const cm = mm / 10;
	if (!Number.isFinite(cm)) throw new RangeError('A girth must be a finite number');
	const table = steps[code] ?? everyFour;
	const from = table.filter((s) => cm >= s.fromCm).at(-1)!;
	let designation = from.fromCm + Math.round((cm - from.fromCm) / from.stepCm) * from.stepCm;
	for (;;) {
		const next = designationAfter(code, designation);
		const previous = designationBefore(code, designation);
		const minCm = (previous + designation) / 2;
		const maxCm = (designation + next) / 2;
		if (cm < minCm) designation = previous;
		else if (cm >= maxCm) designation = next;
		else return { minCm, maxCm, designationCm: designation };
	}
}

/** "bust 86–90 cm, hip 94–98 cm"; null when the primary dimension is missing. */
export function sizeBand(body: Measurements, category: GarmentCategory): SizeBand | null {
	const [primary, ...secondary] = dimensionsFor[category];
	if (body[primary] === undefined) return null;
	const dimensions = [primary, ...secondary]
		.filter((code) => body[code] !== undefined)
		.map((code) => ({ code, label: names[code] ?? code, ...bandFor(code, body[code]!) }));
	return { dimensions, text: dimensions.map((d) => `${d.label} ${d.minCm}–${d.maxCm} cm`).join(', ') };
}
