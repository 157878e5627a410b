import { trouserEase } from '../ease';
import { distance, flattenPath, offsetSegment, pt, type CurvedPath, type PathStep, type Point } from '../geometry';
import type { DraftPiece, PieceLine } from '../pieces';
import { fitOf, fitOption, inch, lengthOption, need, num, waistbandPiece } from './common';
import type { Fit, GarmentTemplate } from './types';

/*
 * A working dressmaker's method for high-waisted wide-leg trousers (common practice), worked in inches on
 * quarters of the girth. Every depth is measured down from the waist seam, after the finished waistband
 * depth has been taken off the top. Widths include one seam allowance, as the method does.
 * The regular fit is the method exactly: front and back alike at hip and thigh, no ease there. The other
 * fits follow the usual trouser block in giving the back more than the front — 1 cm each side of the
 * quarter hip and 2 cm each side of the half thigh (Aldrich, Metric Pattern Cutting for Women's Wear,
 * trouser block; from memory) — and take their ease from the trouser ease table.
 */

const hipToCrotch = inch(1);
const crotchToThigh = inch(2.5);
const foldRoom = inch(6);
const centreFrontDrop = inch(1);
const backExtensionExtra = inch(2);
const backWaistIn = inch(1);
const backWaistRaise = inch(1.5);
const blockHipShift = 10;
const blockThighShift = 20;

export interface TrouserFigures {
	quarterHip: number;
	hipLineDepth: number;
	crotchDepth: number;
	thighLineDepth: number;
	front: { hipWidth: number; thighWidth: number; crotchExtension: number };
	back: { hipWidth: number; thighWidth: number; crotchExtension: number };
	waistWidth: number;
	legLength: number;
	foldWidth: number;
	hipEase: number;
	thighEase: number;
	seamAllowance: number;
}

type Side = TrouserFigures['front'];

export function trouserFigures(
	body: { hip: number; waist: number; thigh: number },
	o: {
		length: number;
		waistbandDepth: number;
		seamAllowance: number;
		hem: number;
		crotchEase: number;
		fit: Fit;
	}
): TrouserFigures {
	const ease = trouserEase[o.fit];
	const worked = o.fit === 'regular';
	const hipShift = worked ? 0 : blockHipShift;
	const thighShift = worked ? 0 : blockThighShift;
	const quarterHip = body.hip / 4;
	const hipLineDepth = quarterHip;
	const crotchDepth = hipLineDepth + hipToCrotch + o.crotchEase;
	const frontCrotchExtension = quarterHip / 4;
	const quarterWithEase = quarterHip + ease.hip / 4 + o.seamAllowance;
	const halfThigh = (body.thigh + ease.thigh + o.seamAllowance) / 2;
	return {
		quarterHip,
		hipLineDepth,
		crotchDepth,
		thighLineDepth: crotchDepth + crotchToThigh,
		front: {
			hipWidth: quarterWithEase - hipShift,
			thighWidth: halfThigh - thighShift,
			crotchExtension: frontCrotchExtension
		},
		back: {
			hipWidth: quarterWithEase + hipShift,
			thighWidth: halfThigh + thighShift,
			crotchExtension: frontCrotchExtension + backExtensionExtra
		},
		waistWidth: body.waist / 4 + ease.waistPerQuarter + o.seamAllowance,
		legLength: o.length - o.waistbandDepth + o.hem,
		foldWidth: quarterHip + ease.hip / 4 + hipShift + foldRoom,
		hipEase: ease.hip,
		thighEase: ease.thigh,
		seamAllowance: o.seamAllowance
	};
}

/**
 * What front and back share from the hip line down: the crotch curve out to the extension, the leg (thigh
 * width kept to the hem) and the side seam curving back up to the side waist. `seatControl` steers the
 * crotch curve so it leaves the hip line in the direction of the centre seam above it.
 */
function lowerBody(f: TrouserFigures, side: Side, sideWaist: Point, seatControl: Point) {
	const crotchPoint = pt(side.hipWidth + side.crotchExtension, f.crotchDepth);
	const legCentre = crotchPoint.x / 2;
	const inThigh = pt(legCentre + side.thighWidth / 2, f.thighLineDepth);
	const outThigh = pt(legCentre - side.thighWidth / 2, f.thighLineDepth);
	const sideHip = pt(0, f.hipLineDepth);
	const steps: PathStep[] = [
		{ control: seatControl, to: crotchPoint },
		{ to: inThigh },
		{ to: pt(inThigh.x, f.legLength) },
		{ to: pt(outThigh.x, f.legLength) },
		{ to: outThigh },
		{ to: pt(0, f.crotchDepth) },
		{ to: sideHip },
		{ control: pt(0, f.hipLineDepth * 0.35), to: sideWaist }
	];
	return { crotchPoint, legCentre, inThigh, outThigh, sideHip, steps };
}

function closedPath(start: Point, steps: PathStep[]): { path: CurvedPath; outline: Point[] } {
	const path = { start, steps };
	return { path, outline: flattenPath(path) };
}

function easeLines(f: TrouserFigures): PieceLine[] {
	return [
		{ id: 'hip_ease', label: 'Hip ease over the body (all round)', mm: f.hipEase },
		{ id: 'thigh_ease', label: 'Thigh ease over the body (each leg)', mm: f.thighEase }
	];
}

function frontPiece(f: TrouserFigures): DraftPiece {
	const side = f.front;
	const sideWaist = pt(side.hipWidth - f.waistWidth, 0);
	const centreWaist = pt(side.hipWidth, centreFrontDrop);
	const centreHip = pt(side.hipWidth, f.hipLineDepth);
	const seatControl = pt(side.hipWidth, f.crotchDepth);
	const { crotchPoint, legCentre, inThigh, outThigh, sideHip, steps } = lowerBody(f, side, sideWaist, seatControl);
	const { path, outline } = closedPath(sideWaist, [{ to: centreWaist }, { to: centreHip }, ...steps]);
	const depthAt = (step: number) => -inch(1.1) * step;
	return {
		id: 'front',
		label: 'Front',
		cut: { quantity: 2, onFold: false, pair: true, grain: 'lengthwise' },
		outline,
		path,
		marks: [
			guide('hip line', 0, side.hipWidth, f.hipLineDepth),
			guide('crotch line', 0, crotchPoint.x, f.crotchDepth),
			guide('thigh line', outThigh.x, inThigh.x, f.thighLineDepth)
		],
		lines: [
			{ id: 'fold_width', label: 'Fold width needed (fabric folded double)', mm: f.foldWidth },
			{
				id: 'hip_line_depth',
				label: 'Hip line depth',
				mm: f.hipLineDepth,
				dimension: { from: pt(depthAt(1), 0), to: pt(depthAt(1), f.hipLineDepth) }
			},
			{
				id: 'crotch_depth',
				label: 'Crotch depth',
				mm: f.crotchDepth,
				dimension: { from: pt(depthAt(2), 0), to: pt(depthAt(2), f.crotchDepth) }
			},
			{
				id: 'thigh_line_depth',
				label: 'Thigh line depth',
				mm: f.thighLineDepth,
				dimension: { from: pt(depthAt(3), 0), to: pt(depthAt(3), f.thighLineDepth) }
			},
			{
				id: 'hip_width',
				label: 'Width at hip line',
				mm: side.hipWidth,
				dimension: { from: sideHip, to: centreHip }
			},
			{
				id: 'crotch_extension',
				label: 'Crotch extension',
				mm: side.crotchExtension,
				dimension: { from: pt(side.hipWidth, f.crotchDepth), to: crotchPoint }
			},
			{
				id: 'waist_width',
				label: 'Waist width',
				mm: f.waistWidth,
				dimension: { from: sideWaist, to: pt(side.hipWidth, 0) }
			},
			{ id: 'centre_front_drop', label: 'Centre front lowered', mm: centreFrontDrop },
			{
				id: 'thigh_width',
				label: 'Thigh width (half each side of the centre line)',
				mm: side.thighWidth,
				dimension: { from: outThigh, to: inThigh }
			},
			{
				id: 'leg_length',
				label: 'Leg length with hem',
				mm: f.legLength,
				dimension: { from: pt(depthAt(4), 0), to: pt(depthAt(4), f.legLength) }
			},
			...easeLines(f)
		],
		grainline: [pt(legCentre, f.thighLineDepth + inch(8)), pt(legCentre, f.legLength - inch(3))]
	};
}

function backPiece(f: TrouserFigures, zip: { length: number; width: number }): DraftPiece {
	const side = f.back;
	const centreWaist = pt(side.hipWidth - backWaistIn, -backWaistRaise);
	const run = Math.sqrt(Math.max(f.waistWidth ** 2 - backWaistRaise ** 2, 0));
	const sideWaist = pt(centreWaist.x - run, 0);
	const centreHip = pt(side.hipWidth, f.hipLineDepth);
	// The centre back seam runs on to the crotch line before it curves: no corner at the hip line.
	const seatControl = alongSegment(centreWaist, centreHip, distance(centreWaist, centreHip) * slantTo(f));
	const { crotchPoint, legCentre, inThigh, outThigh, sideHip, steps } = lowerBody(f, side, sideWaist, seatControl);
	// The zip allowance tapers back into the seam at 45° well above the hip line, with no step there.
	const centreSeam = distance(centreWaist, centreHip);
	const zipLength = Math.min(zip.length, centreSeam - zip.width);
	const zipEnd = alongSegment(centreWaist, centreHip, zipLength);
	const taperEnd = alongSegment(centreWaist, centreHip, zipLength + zip.width);
	const [zipTop, zipBottom] = offsetSegment(centreWaist, zipEnd, zip.width);
	const { path, outline } = closedPath(sideWaist, [
		{ to: centreWaist },
		{ to: zipTop },
		{ to: zipBottom },
		{ to: taperEnd },
		{ to: centreHip },
		...steps
	]);
	return {
		id: 'back',
		label: 'Back',
		cut: { quantity: 2, onFold: false, pair: true, grain: 'lengthwise' },
		outline,
		path,
		marks: [
			guide('hip line', 0, side.hipWidth, f.hipLineDepth),
			guide('crotch line', 0, crotchPoint.x, f.crotchDepth),
			{ kind: 'zip', points: [centreWaist, zipEnd], label: 'zip' }
		],
		lines: [
			{
				id: 'hip_width',
				label: 'Width at hip line',
				mm: side.hipWidth,
				dimension: { from: sideHip, to: centreHip }
			},
			{ id: 'crotch_depth', label: 'Crotch depth', mm: f.crotchDepth },
			{
				id: 'crotch_extension',
				label: 'Crotch extension',
				mm: side.crotchExtension,
				dimension: { from: pt(side.hipWidth, f.crotchDepth), to: crotchPoint }
			},
			{ id: 'waist_in', label: 'Centre back waist in from centre back', mm: backWaistIn },
			{ id: 'waist_raise', label: 'Back waist raised', mm: backWaistRaise },
			{
				id: 'waist_width',
				label: 'Waist width (on the slant)',
				mm: distance(sideWaist, centreWaist),
				dimension: { from: sideWaist, to: centreWaist }
			},
			{
				id: 'thigh_width',
				label: 'Thigh width',
				mm: side.thighWidth,
				dimension: { from: outThigh, to: inThigh }
			},
			{ id: 'leg_length', label: 'Leg length with hem (from the waist line)', mm: f.legLength },
			{ id: 'zip_allowance_length', label: 'Zip allowance length', mm: zipLength },
			{ id: 'zip_allowance_width', label: 'Zip allowance width', mm: zip.width }
		],
		grainline: [pt(legCentre, f.thighLineDepth + inch(8)), pt(legCentre, f.legLength - inch(3))]
	};
}

/** How far along the centre back line (as a multiple of waist-to-hip) it reaches the crotch line. */
function slantTo(f: TrouserFigures): number {
	return (f.crotchDepth + backWaistRaise) / (f.hipLineDepth + backWaistRaise);
}

function guide(label: string, x0: number, x1: number, y: number) {
	return { kind: 'guide' as const, points: [pt(x0, y), pt(x1, y)], label };
}

function alongSegment(a: Point, b: Point, length: number): Point {
	const t = length / distance(a, b);
	return pt(a.x + (b.x - a.x) * t, a.y + (b.y - a.y) * t);
}

export const wideLegTrousers: GarmentTemplate = {
	id: 'wide-leg-trousers',
	name: 'Wide-leg high-waisted trousers',
	summary: 'Front, back and a separate waistband, with a centre-back zip.',
	category: 'trousers',
	requiredMeasurements: ['hip_girth', 'waist_girth', 'thigh_girth'],
	optionalMeasurements: ['waist_to_floor'],
	options: [
		fitOption,
		lengthOption('length', 'Finished length (top of waistband to hem)', null, [inch(20), inch(60)], {
			defaultFrom: 'waist_to_floor'
		}),
		lengthOption('waistbandDepth', 'Finished waistband depth', inch(1.5), [inch(0.75), inch(4)]),
		lengthOption('crotchEase', 'Crotch ease', inch(0.5), [inch(0.5), inch(1)]),
		lengthOption('seamAllowance', 'Seam allowance', inch(1), [inch(0.25), inch(1.5)]),
		lengthOption('hem', 'Hem allowance', inch(2), [inch(0.5), inch(4)]),
		lengthOption('waistbandSeam', 'Waistband seam allowance', inch(0.5), [inch(0.25), inch(1)]),
		lengthOption('overlap', 'Waistband overlap', inch(1.5), [0, inch(3)]),
		lengthOption('zipLength', 'Zip allowance length', inch(10), [inch(6), inch(14)])
	],
	defaultLabourHours: 8,
	method: 'A working dressmaker’s quarter-hip method (common practice), as taught in inches.',
	draft(body, options) {
		const o = {
			fit: fitOf(options),
			length: num(options, 'length'),
			waistbandDepth: num(options, 'waistbandDepth'),
			seamAllowance: num(options, 'seamAllowance'),
			hem: num(options, 'hem'),
			crotchEase: num(options, 'crotchEase'),
			waistbandSeam: num(options, 'waistbandSeam'),
			overlap: num(options, 'overlap')
		};
		const f = trouserFigures(
			{ hip: need(body, 'hip_girth'), waist: need(body, 'waist_girth'), thigh: need(body, 'thigh_girth') },
			o
		);
		const zip = { length: num(options, 'zipLength'), width: inch(1) };
		return {
			pieces: [
				frontPiece(f),
				backPiece(f, zip),
				waistbandPiece({
					finishedWaist: need(body, 'waist_girth'),
					depth: o.waistbandDepth,
					seam: o.waistbandSeam,
					overlap: o.overlap,
					lengthLabel: 'Cut length (waist + overlap + seams)'
				})
			],
			allowances: [
				{ id: 'seam', label: 'Seam allowance (included in widths)', mm: o.seamAllowance },
				{ id: 'hem', label: 'Hem allowance', mm: o.hem },
				{ id: 'waistband_depth', label: 'Finished waistband depth', mm: o.waistbandDepth },
				{ id: 'waistband_seam', label: 'Waistband seam allowance', mm: o.waistbandSeam },
				{ id: 'crotch_ease', label: 'Crotch ease', mm: o.crotchEase },
				{ id: 'zip', label: 'Centre-back zip allowance (length)', mm: zip.length }
			],
			notes: [
				'Fold the fabric double and cut front and back as pairs.',
				'Mark the hip, crotch and thigh lines; the wide leg keeps the thigh width down to the hem.',
				'Widths include one seam allowance at the side seam, as the method does.',
				o.fit === 'regular'
					? 'Regular fit is the method as taught: no ease at the hip or thigh over the body (see the front’s hip and thigh ease).'
					: 'This fit takes the hip and thigh ease shown on the front, and cuts the back wider than the front at hip and thigh, as the trouser block does.'
			],
			cautions: [],
			warnings: []
		};
	}
};
