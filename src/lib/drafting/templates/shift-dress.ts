import { wearingEase } from '../ease';
import { pt, quadCurve, type Point } from '../geometry';
import type { DraftPiece, PieceLine, PieceMark } from '../pieces';
import { fitOf, fitOption, homeSeamAllowance, inch, lengthOption, need, num } from './common';
import { facingAbove, facingWidth } from './facings';
import type { BodyMm, GarmentTemplate, ResolvedOptions } from './types';

/*
 * A sleeveless shift: straight from underarm to hem with a little waist shaping, side bust darts on the front
 * and a centre-back zip. Built on quarters like a bodice block. As in Aldrich's close-fitting bodice block
 * (Metric Pattern Cutting for Women's Wear), the scye depth, nape-to-waist and waist-to-hip lines are squared
 * down from the nape, which lies the back neck depth below the neck-point line. Scye depth bust/8 + 10 cm is
 * from memory (it gives 21 cm at bust 88, close to the size-12 scye depth in Aldrich's metric blocks).
 */
const shoulderDrop = inch(1.5);
const maxSideShaping = inch(0.75);
/** A B-cup block is the usual base (blocks are drafted to a B, sometimes C cup); 1 in bust dart for it. */
const baseDartIntake = inch(1);
const baseCupDifference = 150;
const dartBelowUnderarm = inch(2);
const dartShortOfApex = inch(1);
const backNeckDepth = inch(1);
const centreBackSeam = inch(1);
const facingBelowUnderarm = inch(1.5);

export interface DressFigures {
	quarterBust: number;
	quarterWaist: number;
	quarterHip: number;
	armholeDepth: number;
	/** The nape below the neck-point line; the block's datum. */
	napeY: number;
	waistDepth: number;
	hipDepth: number;
	sideShaping: number;
	dartIntake: number;
	seam: number;
	hem: number;
	length: number;
	neckWidth: number;
	neckDepth: number;
	shoulderPoint: number;
	bustDepth: number;
	bustSpanHalf: number;
	zipLength: number;
}

export function dressFigures(body: BodyMm, options: ResolvedOptions): DressFigures {
	const ease = wearingEase[fitOf(options)];
	const bust = need(body, 'bust_girth');
	const quarterBust = (bust + ease.bust) / 4;
	const quarterWaist = (need(body, 'waist_girth') + ease.dressWaist) / 4;
	const quarterHip = (need(body, 'hip_girth') + ease.hip) / 4;
	const widest = Math.max(quarterBust, quarterHip, quarterWaist);
	const underBust = body.under_bust_girth;
	const cup = underBust === undefined ? baseCupDifference : bust - underBust;
	const dartIntake = Math.min(Math.max(baseDartIntake + (cup - baseCupDifference) / 2, inch(0.5)), inch(2.5));
	const napeY = backNeckDepth;
	const waistDepth = napeY + need(body, 'nape_to_waist');
	return {
		quarterBust,
		quarterWaist,
		quarterHip,
		armholeDepth: bust / 8 + 100 + (fitOf(options) === 'relaxed' ? inch(1) : 0),
		napeY,
		waistDepth,
		hipDepth: waistDepth + need(body, 'waist_to_hip'),
		sideShaping: Math.min(Math.max((widest - quarterWaist) / 2, 0), maxSideShaping),
		dartIntake,
		seam: num(options, 'seamAllowance'),
		hem: num(options, 'hem'),
		length: num(options, 'length'),
		neckWidth: num(options, 'neckWidth'),
		neckDepth: num(options, 'neckDepth'),
		shoulderPoint: need(body, 'shoulder_width') / 2,
		bustDepth: need(body, 'shoulder_to_bust_point'),
		bustSpanHalf: need(body, 'bust_point_span') / 2,
		zipLength: num(options, 'zipLength')
	};
}

function dressPiece(which: 'front' | 'back', f: DressFigures): DraftPiece {
	const s = f.seam;
	const front = which === 'front';
	const drop = front ? f.dartIntake : 0;
	const centreX = front ? 0 : -centreBackSeam;
	const neckDepth = front ? f.neckDepth : backNeckDepth;
	const widest = Math.max(f.quarterBust, f.quarterHip, f.quarterWaist);
	const underarm = pt(f.quarterBust + s, f.napeY + f.armholeDepth);
	const shoulder = pt(f.shoulderPoint + s * 0.5, shoulderDrop);
	const waist = pt(widest - f.sideShaping + s, f.waistDepth + drop);
	const hip = pt(Math.max(f.quarterHip, f.quarterWaist) + s, f.hipDepth + drop);
	const hemY = f.length + f.hem;
	const dartTop = underarm.y + dartBelowUnderarm;
	const sideAt = (y: number) =>
		pt(underarm.x + ((waist.x - underarm.x) * (y - underarm.y)) / (waist.y - underarm.y), y);
	const outline: Point[] = [
		pt(centreX, neckDepth - s),
		pt(0, neckDepth - s),
		...quadCurve(pt(0, neckDepth - s), pt(f.neckWidth * 0.85, neckDepth * 0.9), pt(f.neckWidth - s * 0.3, -s)),
		pt(shoulder.x, shoulder.y - s),
		...quadCurve(pt(shoulder.x, shoulder.y - s), pt(shoulder.x - inch(0.5), underarm.y), underarm),
		...(front ? [sideAt(dartTop), sideAt(dartTop + drop)] : []),
		waist,
		...quadCurve(waist, pt(hip.x, (waist.y + hip.y) / 2), hip),
		pt(hip.x, hemY + drop),
		pt(centreX, hemY + drop)
	];
	const marks: PieceMark[] = [
		{ kind: 'guide', points: [pt(0, f.waistDepth + drop), pt(waist.x, f.waistDepth + drop)], label: 'waist line' },
		{ kind: 'guide', points: [pt(0, f.hipDepth + drop), pt(hip.x, f.hipDepth + drop)], label: 'hip line' }
	];
	const lines: PieceLine[] = [
		{
			id: 'bust_width',
			label: 'Width at underarm (with side seam)',
			mm: underarm.x,
			dimension: { from: pt(0, underarm.y), to: underarm }
		},
		{
			id: 'waist_width',
			label: 'Width at waist (with side seam)',
			mm: waist.x,
			dimension: { from: pt(0, waist.y), to: waist }
		},
		{ id: 'hip_width', label: 'Width at hip (with side seam)', mm: hip.x, dimension: { from: pt(0, hip.y), to: hip } },
		{
			id: 'armhole_depth',
			label: 'Armhole depth (scye depth, from the nape)',
			mm: f.armholeDepth,
			dimension: { from: pt(-inch(0.8) + centreX, f.napeY), to: pt(-inch(0.8) + centreX, underarm.y) }
		},
		{
			id: 'nape_to_waist',
			label: 'Nape to waist line',
			mm: f.waistDepth - f.napeY,
			dimension: front
				? undefined
				: { from: pt(-inch(2.4) + centreX, f.napeY), to: pt(-inch(2.4) + centreX, f.waistDepth) }
		},
		{ id: 'waist_depth', label: 'Neck-point line to waist', mm: f.waistDepth + drop },
		{ id: 'hip_depth', label: 'Neck-point line to hip', mm: f.hipDepth + drop },
		{
			id: 'piece_length',
			label: 'Piece length with hem',
			mm: hemY + drop + s,
			dimension: { from: pt(-inch(1.6) + centreX, -s), to: pt(-inch(1.6) + centreX, hemY + drop) }
		},
		{ id: 'neck_width', label: 'Neck width from centre', mm: f.neckWidth },
		{ id: 'neck_depth', label: 'Neck depth', mm: neckDepth },
		{ id: 'shoulder_point', label: 'Shoulder point from centre', mm: f.shoulderPoint },
		{ id: 'shoulder_drop', label: 'Shoulder drop', mm: shoulderDrop }
	];
	if (front) {
		const apex = pt(f.bustSpanHalf + dartShortOfApex, f.bustDepth);
		marks.push({ kind: 'dart', label: 'bust dart', points: [sideAt(dartTop), apex, sideAt(dartTop + drop)] });
		lines.push(
			{ id: 'bust_line_depth', label: 'Bust line depth', mm: f.bustDepth },
			{ id: 'dart_position', label: 'Bust point from centre front', mm: f.bustSpanHalf },
			{ id: 'dart_intake', label: 'Bust dart intake', mm: f.dartIntake },
			{ id: 'dart_length', label: 'Bust dart length', mm: Math.hypot(sideAt(dartTop).x - apex.x, dartTop - apex.y) }
		);
	} else {
		marks.push({ kind: 'zip', points: [pt(0, neckDepth), pt(0, neckDepth + f.zipLength)], label: 'zip' });
		lines.push(
			{ id: 'zip_length', label: 'Zip opening', mm: f.zipLength },
			{ id: 'centre_back_seam', label: 'Centre back seam allowance', mm: centreBackSeam }
		);
	}
	const grainX = f.quarterHip * 0.5;
	return {
		id: which,
		label: front ? 'Front' : 'Back',
		cut: front
			? { quantity: 1, onFold: true, pair: false, grain: 'lengthwise' }
			: { quantity: 2, onFold: false, pair: true, grain: 'lengthwise' },
		outline,
		marks,
		lines,
		grainline: [pt(grainX, f.waistDepth), pt(grainX, f.length - inch(3))]
	};
}

export const shiftDress: GarmentTemplate = {
	id: 'shift-dress',
	name: 'Shift dress',
	summary: 'Sleeveless, straight from underarm to hem, side bust darts, centre-back zip.',
	category: 'dress',
	requiredMeasurements: [
		'bust_girth',
		'waist_girth',
		'hip_girth',
		'shoulder_width',
		'nape_to_waist',
		'waist_to_hip',
		'shoulder_to_bust_point',
		'bust_point_span'
	],
	optionalMeasurements: ['under_bust_girth'],
	options: [
		fitOption,
		lengthOption('length', 'Finished length (shoulder line to hem)', 950, [600, 1500]),
		lengthOption('neckWidth', 'Neck width from centre', inch(3), [inch(2), inch(5)]),
		lengthOption('neckDepth', 'Front neck depth', inch(4), [inch(2), inch(8)]),
		lengthOption('seamAllowance', 'Seam allowance', homeSeamAllowance, [inch(0.25), inch(1.25)]),
		lengthOption('hem', 'Hem allowance', inch(1.5), [inch(0.5), inch(3)]),
		lengthOption('zipLength', 'Zip opening', inch(22), [inch(14), inch(24)])
	],
	defaultLabourHours: 7,
	method:
		'Quarter-bust bodice block extended to a shift; scye depth, waist and hip lines squared down from the nape as in Aldrich’s close-fitting bodice block (Metric Pattern Cutting for Women’s Wear); wearing ease from CWU “Ease in Clothing” and McCunn.',
	draft(body, options) {
		const f = dressFigures(body, options);
		const front = dressPiece('front', f);
		const back = dressPiece('back', f);
		// All-in-one facing: neck and armhole together, ending below the underarm, above the bust dart.
		const side = pt(f.quarterBust + f.seam, f.napeY + f.armholeDepth + facingBelowUnderarm);
		return {
			pieces: [
				front,
				back,
				facingAbove(front, {
					id: 'front_facing',
					label: 'Front facing',
					centre: pt(0, f.neckDepth + facingWidth),
					side,
					edgeAtCentre: f.neckDepth
				}),
				facingAbove(back, {
					id: 'back_facing',
					label: 'Back facing',
					centre: pt(-centreBackSeam, backNeckDepth + facingWidth),
					side,
					edgeAtCentre: backNeckDepth
				})
			],
			allowances: [
				{ id: 'seam', label: 'Seam allowance', mm: f.seam },
				{ id: 'centre_back', label: 'Centre back seam allowance (zip)', mm: centreBackSeam },
				{ id: 'hem', label: 'Hem allowance', mm: f.hem },
				{ id: 'bust_dart', label: 'Bust dart intake', mm: f.dartIntake }
			],
			notes: [
				'Cut the front on the fold and the back as a pair.',
				'The front is longer than the back by the dart intake; the dart takes it up at the side seam.',
				'Finish the neck and armholes with the all-in-one facings cut with the dress.'
			],
			cautions: [],
			warnings: []
		};
	}
};
