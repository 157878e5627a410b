import { pt, quadCurve, type Point } from '../geometry';
import type { DraftPiece, PieceLine, PieceMark } from '../pieces';
import { wearingEase } from '../ease';
import { fitOf, fitOption, homeSeamAllowance, inch, lengthOption, need, num } from './common';
import type { BodyMm, OptionSpec, ResolvedOptions } from './types';

/*
 * A skirt drafted on quarters of hip and waist, the usual block construction (common practice): a rectangle
 * a quarter hip wide, waist suppression shared between the side seam and darts, the side waist raised
 * ½ in over the hip curve. The A-line adds flare at the side seam from the hip line down.
 */

/** Most a single dart should take in; more than this puckers (common practice, 1.5–3 cm darts). */
const maxDartIntake = 30;
const minDartIntake = 2;
const sideRaise = inch(0.5);
export const frontDartLength = inch(3.5);
export const backDartLength = inch(5.5);

export interface SkirtInput {
	waist: number;
	hip: number;
	waistToHip: number;
	length: number;
	waistEase: number;
	hipEase: number;
	seam: number;
	hem: number;
	/** Extra width at the hem on each side seam; null for a straight skirt. */
	flare: number | null;
	maxDartsPerQuarter: 1 | 2;
}

/** Options every skirt offers; a template adds its own (flare, slit) and its hem default. */
export function skirtOptions(hemDefault: number, extra: readonly OptionSpec[] = []): OptionSpec[] {
	return [
		fitOption,
		lengthOption('length', 'Finished length (waist seam to hem)', 600, [300, 1100]),
		lengthOption('seamAllowance', 'Seam allowance', homeSeamAllowance, [inch(0.25), inch(1.25)]),
		lengthOption('hem', 'Hem allowance', hemDefault, [inch(0.5), inch(3)]),
		lengthOption('waistbandDepth', 'Finished waistband depth', inch(1.25), [inch(0.75), inch(3)]),
		lengthOption('zipLength', 'Zip opening', inch(7), [inch(5), inch(10)]),
		...extra
	];
}

/** The measurements, ease and allowances every skirt template reads the same way. */
export function skirtInput(
	body: BodyMm,
	options: ResolvedOptions,
	shape: { flare: number | null; maxDartsPerQuarter: 1 | 2 }
): SkirtInput {
	const ease = wearingEase[fitOf(options)];
	return {
		waist: need(body, 'waist_girth'),
		hip: need(body, 'hip_girth'),
		waistToHip: need(body, 'waist_to_hip'),
		length: num(options, 'length'),
		waistEase: ease.skirtWaist,
		hipEase: ease.hip,
		seam: num(options, 'seamAllowance'),
		hem: num(options, 'hem'),
		...shape
	};
}

export interface DartSet {
	count: number;
	intake: number;
	/** Finished waist of this quarter (centre to side seam, darts closed). */
	waist: number;
}

export interface SkirtShaping {
	/** Quarter width at the hip line: the larger of hip and waist with their ease, so neither binds. */
	quarterHip: number;
	quarterWaist: number;
	sideShaping: number;
	front: DartSet;
	back: DartSet;
}

/**
 * The back takes twice the dart suppression of the front: the seat stands further out from the waist than
 * the abdomen does (Aldrich, Metric Pattern Cutting for Women's Wear, the close-fitting skirt block — the back
 * darts take about twice the front's; from memory). The side seam takes up to half the suppression (at most
 * 1 in); any dart over 3 cm moves to the side seam.
 */
export const frontDartShare = 1 / 3;

export function skirtShaping(
	input: Pick<SkirtInput, 'waist' | 'hip' | 'waistEase' | 'hipEase' | 'maxDartsPerQuarter'>
): SkirtShaping {
	const quarterWaist = (input.waist + input.waistEase) / 4;
	const quarterHip = Math.max((input.hip + input.hipEase) / 4, quarterWaist);
	const suppression = quarterHip - quarterWaist;
	const backCapacity = input.maxDartsPerQuarter * maxDartIntake;
	const spread = Math.min(
		Math.max(Math.min(suppression / 2, inch(1)), suppression - backCapacity / (2 * (1 - frontDartShare))),
		suppression
	);
	// A front dart under 2 mm cannot be sewn: the side seam takes all of so little suppression.
	const sideShaping = 2 * (suppression - spread) * frontDartShare < minDartIntake ? suppression : spread;
	const halfDarts = 2 * (suppression - sideShaping);
	const darts = (total: number): DartSet => {
		const count = total === 0 ? 0 : total <= maxDartIntake ? 1 : input.maxDartsPerQuarter;
		return { count, intake: count ? total / count : 0, waist: quarterHip - sideShaping - total };
	};
	return {
		quarterHip,
		quarterWaist,
		sideShaping,
		front: darts(halfDarts * frontDartShare),
		back: darts(halfDarts * (1 - frontDartShare))
	};
}

export function skirtPiece(
	which: 'front' | 'back',
	input: SkirtInput,
	shaping: SkirtShaping,
	extra: { zipLength: number; centreBackSeam: number; slitLength: number }
): DraftPiece {
	const { quarterHip: q, sideShaping } = shaping;
	const { count: dartCount, intake: dartIntake, waist: quarterWaist } = shaping[which];
	const s = input.seam;
	const flare = input.flare ?? 0;
	const hemY = input.length + input.hem;
	// Raise the side hem so the flared side seam below the hip line is as long as the centre line.
	const d = hemY - input.waistToHip;
	const flareRaise = d - Math.sqrt(Math.max(d * d - flare * flare, 0));
	const sideWaist = pt(q - sideShaping + s, -sideRaise - s);
	const sideHip = pt(q + s, input.waistToHip);
	const sideHem = pt(q + s + flare, hemY - flareRaise);
	const centreX = which === 'back' ? -extra.centreBackSeam : 0;
	const outline: Point[] = [
		pt(centreX, -s),
		sideWaist,
		...quadCurve(sideWaist, pt(q + s, input.waistToHip * 0.35), sideHip),
		sideHem,
		...quadCurve(sideHem, pt((q + s + flare) * 0.5, hemY), pt(0, hemY)).slice(0, -1),
		pt(centreX, hemY)
	];
	const dartLength = which === 'front' ? frontDartLength : backDartLength;
	const darts = dartPositions(q - sideShaping, dartCount).map<PieceMark>((x) => ({
		kind: 'dart',
		label: 'dart',
		points: [pt(x - dartIntake / 2, 0), pt(x, dartLength), pt(x + dartIntake / 2, 0)]
	}));
	const marks: PieceMark[] = [
		{ kind: 'guide', points: [pt(0, input.waistToHip), pt(q + s, input.waistToHip)], label: 'hip line' },
		...darts
	];
	if (which === 'back') {
		marks.push({ kind: 'zip', points: [pt(0, 0), pt(0, extra.zipLength)], label: 'zip' });
		if (extra.slitLength > 0)
			marks.push({
				kind: 'slit',
				points: [pt(0, input.length - extra.slitLength), pt(0, input.length)],
				label: 'slit'
			});
	}
	const lines: PieceLine[] = [
		{
			id: 'hip_width',
			label: 'Width at hip line (with side seam)',
			mm: q + s,
			dimension: { from: pt(0, input.waistToHip), to: sideHip }
		},
		{ id: 'waist_width', label: 'Finished waist, centre to side', mm: quarterWaist },
		{
			id: 'hip_depth',
			label: 'Waist to hip line',
			mm: input.waistToHip,
			dimension: { from: pt(q + s + inch(0.8) + flare, 0), to: pt(q + s + inch(0.8) + flare, input.waistToHip) }
		},
		{ id: 'side_shaping', label: 'Side seam shaping at waist', mm: sideShaping },
		{ id: 'side_raise', label: 'Side waist raised', mm: sideRaise },
		{ id: 'dart_intake', label: dartCount === 2 ? 'Intake per dart (two darts)' : 'Intake per dart', mm: dartIntake },
		{ id: 'dart_length', label: 'Dart length', mm: dartCount ? dartLength : 0 },
		{ id: 'length', label: 'Finished length (waist seam to hem)', mm: input.length },
		{
			id: 'piece_length',
			label: 'Piece length with seam and hem',
			mm: hemY + s,
			dimension: { from: pt(-inch(0.8) + centreX, -s), to: pt(-inch(0.8) + centreX, hemY) }
		}
	];
	lines.push({
		id: 'hem_width',
		label: 'Width at hem (with side seam)',
		mm: q + s + flare,
		dimension: input.flare === null ? undefined : { from: pt(0, hemY), to: sideHem }
	});
	if (input.flare !== null) lines.push({ id: 'flare', label: 'Flare at side seam', mm: flare });
	if (which === 'back') {
		lines.push({ id: 'zip_length', label: 'Zip opening', mm: extra.zipLength });
		lines.push({ id: 'centre_back_seam', label: 'Centre back seam allowance', mm: extra.centreBackSeam });
		if (extra.slitLength > 0) lines.push({ id: 'slit_length', label: 'Walking slit', mm: extra.slitLength });
	}
	const grainX = (q + s) * 0.55;
	return {
		id: which,
		label: which === 'front' ? 'Front' : 'Back',
		cut:
			which === 'front'
				? { quantity: 1, onFold: true, pair: false, grain: 'lengthwise' }
				: { quantity: 2, onFold: false, pair: true, grain: 'lengthwise' },
		outline,
		marks,
		lines,
		grainline: [pt(grainX, input.waistToHip + inch(1)), pt(grainX, input.length - inch(2))]
	};
}

function dartPositions(waistToSide: number, count: number): number[] {
	if (count === 0) return [];
	if (count === 1) return [waistToSide * 0.45];
	return [waistToSide * 0.35, waistToSide * 0.65];
}
