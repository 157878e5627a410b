import type { MeasurementCode } from '../measurements';
import { mmPerInch } from '../units';
import { fits, type Fit } from '../ease';
import { pt } from '../geometry';
import type { DraftPiece } from '../pieces';
import type { BodyMm, ChoiceOption, LengthOption, ResolvedOptions } from './types';

export const inch = (value: number) => value * mmPerInch;

/** Home-sewing pattern seam allowance, 5/8 in (Wikipedia "Seam allowance"; metric patterns use 1.5 cm). */
export const homeSeamAllowance = inch(5 / 8);

export const fitOption: ChoiceOption = {
	id: 'fit',
	label: 'Fit',
	kind: 'choice',
	choices: fits.map((value) => ({ value, label: value[0].toUpperCase() + value.slice(1) })),
	default: 'regular',
	help: 'How much ease (room) to add over the body measurements.'
};

export function lengthOption(
	id: string,
	label: string,
	defaultMm: number | null,
	range: [number, number],
	extra: Partial<LengthOption> = {}
): LengthOption {
	return { id, label, kind: 'length', defaultMm, minMm: range[0], maxMm: range[1], ...extra };
}

export function num(options: ResolvedOptions, id: string): number {
	const value = options[id];
	if (typeof value !== 'number') throw new TypeError(`Option ${id} must be a number`);
	return value;
}

export function fitOf(options: ResolvedOptions): Fit {
	const value = options.fit;
	return (fits as readonly unknown[]).includes(value) ? (value as Fit) : 'regular';
}

export function need(body: BodyMm, code: MeasurementCode): number {
	const value = body[code];
	if (value === undefined) throw new TypeError(`Measurement ${code} is required`);
	return value;
}

/**
 * A straight waistband cut double and folded lengthwise: cut width = 2 × finished depth + 2 seams,
 * length = finished waist + overlap + 2 seams (common practice).
 */
export function waistbandPiece(band: {
	finishedWaist: number;
	depth: number;
	seam: number;
	overlap: number;
	lengthLabel: string;
}): DraftPiece {
	const w = 2 * band.depth + 2 * band.seam;
	const h = band.finishedWaist + band.overlap + 2 * band.seam;
	return {
		id: 'waistband',
		label: 'Waistband',
		cut: { quantity: 1, onFold: false, pair: false, grain: 'lengthwise' },
		outline: [pt(0, 0), pt(w, 0), pt(w, h), pt(0, h)],
		marks: [{ kind: 'fold', points: [pt(w / 2, 0), pt(w / 2, h)], label: 'fold' }],
		lines: [
			{ id: 'cut_width', label: 'Cut width', mm: w, dimension: { from: pt(0, h), to: pt(w, h) } },
			{ id: 'finished_depth', label: 'Finished depth', mm: band.depth },
			{
				id: 'length',
				label: band.lengthLabel,
				mm: h,
				dimension: { from: pt(-inch(0.6), 0), to: pt(-inch(0.6), h) }
			},
			{ id: 'overlap', label: 'Overlap', mm: band.overlap },
			{ id: 'seam_allowance', label: 'Seam allowance', mm: band.seam }
		],
		grainline: [pt(w * 0.7, inch(2)), pt(w * 0.7, h - inch(2))],
		// A straight band may be cut on the crosswise grain, or in two joined with a seam (common practice).
		mayCut: { crosswise: true, inTwo: { joinMm: band.seam } }
	};
}
