import type { Finding } from '../checks';
import { pt, quadCurve, type Point } from '../geometry';
import type { DraftPiece, PieceLine, PieceMark } from '../pieces';
import { fitOf, fitOption, inch, lengthOption, need, num } from './common';
import { facingWidth, neckFacings } from './facings';
import type { Fit, GarmentTemplate } from './types';

/*
 * A working dressmaker's method for a cropped top with cut-in-one short sleeves and bust darts (common
 * practice), in inches on the quarter bust. The cloth is folded once lengthwise and front and back are each
 * cut with the centre on that fold. The front neck is the method's; the back neck is the bodice block's,
 * about 2 cm below the neck-point line (Aldrich, Metric Pattern Cutting for Women's Wear, close-fitting
 * bodice block; from memory). With no fastening the neck must pass over the head; when it is too small
 * the back gets a keyhole opening at the centre back, closed with a button and loop (common practice).
 */

/** Bust ease per quarter: "regular" is the method (4 in in all, McCunn's fitting ease with sleeves);
 * "fitted" is 2 in in all, the top of the CWU "Ease in Clothing" bodice range; "relaxed" is common practice. */
const bustEasePerQuarter: Record<Fit, number> = { fitted: inch(0.5), regular: inch(1), relaxed: inch(1.5) };

const foldRoom = inch(7);
const sleeveDrop = inch(1);
const waistShaping = inch(1.5);
const dartWidth = inch(1);
const dartLength = inch(5);
const sleeveHem = inch(1);
const backNeckDepth = 20;
const keyholeLength = inch(4);
/** Adult head girth is commonly 54–58 cm (from memory); an opening smaller than this will not go over. */
const smallestHeadOpening = 560;

export interface TopFigures {
	quarterBust: number;
	foldWidth: number;
	neckWidth: number;
	neckDepth: number;
	shoulderPoint: number;
	sleeveLength: number;
	sleeveEnd: number;
	sleeveOpening: number;
	bustLineDepth: number;
	bustWidth: number;
	pieceLength: number;
	finishedLength: number;
	waistShapingDepth: number;
	dartPosition: number;
}

export function topFigures(
	body: { bust: number; shoulder: number; shoulderToBust: number; bustSpan: number },
	o: {
		length: number;
		hem: number;
		seamAllowance: number;
		sleeveLength: number;
		sleeveOpening: number;
		neckWidth: number;
		neckDepth: number;
		fit: Fit;
	}
): TopFigures {
	const quarterBust = body.bust / 4;
	const shoulderPoint = body.shoulder / 2;
	const bustWidth = quarterBust + bustEasePerQuarter[o.fit] + o.seamAllowance;
	const sleeveLength = o.sleeveLength + o.seamAllowance;
	return {
		quarterBust,
		foldWidth: quarterBust + foldRoom,
		neckWidth: o.neckWidth,
		neckDepth: o.neckDepth,
		shoulderPoint,
		sleeveLength,
		sleeveEnd: shoulderPoint + sleeveLength,
		sleeveOpening: o.sleeveOpening,
		bustLineDepth: body.shoulderToBust,
		bustWidth,
		pieceLength: o.length + o.hem,
		finishedLength: o.length,
		waistShapingDepth: (body.shoulderToBust + o.length) / 2,
		dartPosition: body.bustSpan / 2
	};
}

/** The neckline from the centre to the neck point. */
function neckEdge(f: TopFigures, neckDepth: number): Point[] {
	const centreNeck = pt(0, neckDepth);
	return [centreNeck, ...quadCurve(centreNeck, pt(f.neckWidth * 0.9, neckDepth * 0.95), pt(f.neckWidth, 0))];
}

function outlineOf(f: TopFigures, neckDepth: number): Point[] {
	const sleeveTop = pt(f.sleeveEnd, sleeveDrop);
	const sleeveBottom = pt(f.sleeveEnd, sleeveDrop + f.sleeveOpening);
	const underarmY = Math.max(f.bustLineDepth, sleeveBottom.y + inch(0.5));
	const side = pt(f.bustWidth, underarmY);
	return [
		...neckEdge(f, neckDepth),
		pt(f.shoulderPoint, 0),
		sleeveTop,
		sleeveBottom,
		...quadCurve(sleeveBottom, pt(f.bustWidth, sleeveBottom.y), side),
		pt(f.bustWidth - waistShaping, Math.max(f.waistShapingDepth, underarmY)),
		pt(f.bustWidth, f.pieceLength),
		pt(0, f.pieceLength)
	];
}

function sharedLines(f: TopFigures, neckDepth: number): PieceLine[] {
	return [
		{ id: 'fold_width', label: 'Fold width needed', mm: f.foldWidth },
		{
			id: 'neck_width',
			label: 'Neck width from the fold',
			mm: f.neckWidth,
			dimension: { from: pt(0, -inch(0.6)), to: pt(f.neckWidth, -inch(0.6)) }
		},
		{
			id: 'neck_depth',
			label: 'Neck depth from the top',
			mm: neckDepth,
			dimension: { from: pt(inch(0.6), 0), to: pt(inch(0.6), neckDepth) }
		},
		{
			id: 'shoulder_point',
			label: 'Shoulder point from the fold',
			mm: f.shoulderPoint,
			dimension: { from: pt(0, -inch(1.4)), to: pt(f.shoulderPoint, -inch(1.4)) }
		},
		{
			id: 'sleeve_length',
			label: 'Sleeve beyond the shoulder point (with seam allowance)',
			mm: f.sleeveLength,
			dimension: { from: pt(f.shoulderPoint, -inch(0.6)), to: pt(f.sleeveEnd, -inch(0.6)) }
		},
		{ id: 'sleeve_drop', label: 'Sleeve end drop (shoulder slope)', mm: sleeveDrop },
		{
			id: 'sleeve_opening',
			label: 'Sleeve opening',
			mm: f.sleeveOpening,
			dimension: {
				from: pt(f.sleeveEnd + inch(0.6), sleeveDrop),
				to: pt(f.sleeveEnd + inch(0.6), sleeveDrop + f.sleeveOpening)
			}
		},
		{ id: 'sleeve_hem', label: 'Sleeve hem, turned twice', mm: sleeveHem },
		{
			id: 'bust_line_depth',
			label: 'Bust line depth',
			mm: f.bustLineDepth,
			dimension: { from: pt(-inch(0.8), 0), to: pt(-inch(0.8), f.bustLineDepth) }
		},
		{
			id: 'bust_width',
			label: 'Width at bust line',
			mm: f.bustWidth,
			dimension: { from: pt(0, f.bustLineDepth), to: pt(f.bustWidth, f.bustLineDepth) }
		},
		{ id: 'hem_width', label: 'Width at hem', mm: f.bustWidth },
		{ id: 'waist_shaping', label: 'Waist shaping in at the side', mm: waistShaping },
		{
			id: 'piece_length',
			label: 'Piece length with hem',
			mm: f.pieceLength,
			dimension: { from: pt(-inch(1.6), 0), to: pt(-inch(1.6), f.pieceLength) }
		}
	];
}

function dartOf(f: TopFigures): { mark: PieceMark; lines: PieceLine[] } {
	const apex = pt(f.dartPosition, f.finishedLength - dartLength);
	return {
		mark: {
			kind: 'dart',
			label: 'bust dart',
			points: [
				pt(f.dartPosition - dartWidth / 2, f.pieceLength),
				apex,
				pt(f.dartPosition + dartWidth / 2, f.pieceLength)
			]
		},
		lines: [
			{
				id: 'dart_position',
				label: 'Dart centre from the fold',
				mm: f.dartPosition,
				dimension: { from: pt(0, f.pieceLength + inch(0.6)), to: pt(f.dartPosition, f.pieceLength + inch(0.6)) }
			},
			{ id: 'dart_length', label: 'Dart length (up from the hemline)', mm: dartLength },
			{ id: 'dart_width', label: 'Dart width (half each side of its centre)', mm: dartWidth }
		]
	};
}

function piece(id: 'front' | 'back', f: TopFigures): DraftPiece {
	const front = id === 'front';
	const dart = front ? dartOf(f) : null;
	const neckDepth = front ? f.neckDepth : backNeckDepth;
	const keyhole: PieceMark[] =
		!front && needsKeyhole(f)
			? [{ kind: 'slit', points: [pt(0, neckDepth), pt(0, neckDepth + keyholeLength)], label: 'opening' }]
			: [];
	return {
		id,
		label: front ? 'Front' : 'Back',
		cut: { quantity: 1, onFold: true, pair: false, grain: 'lengthwise' },
		outline: outlineOf(f, neckDepth),
		marks: [
			{ kind: 'guide', points: [pt(0, f.bustLineDepth), pt(f.bustWidth, f.bustLineDepth)], label: 'bust line' },
			{ kind: 'guide', points: [pt(0, f.finishedLength), pt(f.bustWidth, f.finishedLength)], label: 'hemline' },
			...(dart ? [dart.mark] : []),
			...keyhole
		],
		lines: [
			...sharedLines(f, neckDepth),
			...(dart ? dart.lines : []),
			...(keyhole.length ? [{ id: 'back_opening', label: 'Centre-back opening (slit)', mm: keyholeLength }] : [])
		],
		grainline: [pt(f.bustWidth * 0.6, f.bustLineDepth + inch(1)), pt(f.bustWidth * 0.6, f.pieceLength - inch(1.5))]
	};
}

/** Ramanujan's first approximation to the perimeter of an ellipse with semi-axes a and b. */
export function ellipsePerimeter(a: number, b: number): number {
	return Math.PI * (3 * (a + b) - Math.sqrt((3 * a + b) * (a + 3 * b)));
}

/** The neck seam all round: half an ellipse at the front, half at the back, both as wide as the neck. */
export function neckOpening(f: TopFigures): number {
	return (ellipsePerimeter(f.neckWidth, f.neckDepth) + ellipsePerimeter(f.neckWidth, backNeckDepth)) / 2;
}

function needsKeyhole(f: TopFigures): boolean {
	return neckOpening(f) < smallestHeadOpening;
}

function topWarnings(f: TopFigures): Finding[] {
	const warnings: Finding[] = [];
	const opening = neckOpening(f) + (needsKeyhole(f) ? 2 * keyholeLength : 0);
	if (opening < smallestHeadOpening) {
		warnings.push({
			code: 'option_out_of_range',
			fields: ['neckWidth', 'neckDepth'],
			message:
				'The neckline may be too small to pass over the head, even with the centre-back opening. Widen or deepen it.'
		});
	}
	if (f.sleeveEnd < f.bustWidth + inch(1)) {
		warnings.push({
			code: 'unusual_relation',
			fields: ['shoulder_width', 'bust_girth'],
			message:
				'The shoulders are narrow for this bust: the cut-in-one sleeve barely clears the body. Consider a longer sleeve.'
		});
	}
	return warnings;
}

export const croppedTop: GarmentTemplate = {
	id: 'cropped-top',
	name: 'Cropped top with cut-in-one sleeves',
	summary: 'Front and back each cut on a lengthwise fold of the cloth; short cut-in-one sleeves and bust darts.',
	category: 'top',
	requiredMeasurements: ['bust_girth', 'shoulder_width', 'shoulder_to_bust_point', 'bust_point_span'],
	optionalMeasurements: [],
	options: [
		fitOption,
		lengthOption('length', 'Finished length (shoulder to hem)', inch(18), [inch(12), inch(30)]),
		lengthOption('sleeveLength', 'Sleeve beyond the shoulder point', inch(6), [inch(2), inch(12)]),
		lengthOption('sleeveOpening', 'Sleeve opening', inch(6), [inch(4), inch(10)], {
			help: 'More for a looser sleeve.'
		}),
		lengthOption('neckWidth', 'Neck width from the fold', inch(4), [inch(2.5), inch(6)]),
		lengthOption('neckDepth', 'Front neck depth', inch(4), [inch(2), inch(8)]),
		lengthOption('seamAllowance', 'Seam allowance', inch(1), [inch(0.25), inch(1.5)]),
		lengthOption('hem', 'Hem allowance', inch(1), [inch(0.5), inch(3)])
	],
	defaultLabourHours: 4,
	method: 'A working dressmaker’s quarter-bust method (common practice), as taught in inches.',
	draft(body, options) {
		const f = topFigures(
			{
				bust: need(body, 'bust_girth'),
				shoulder: need(body, 'shoulder_width'),
				shoulderToBust: need(body, 'shoulder_to_bust_point'),
				bustSpan: need(body, 'bust_point_span')
			},
			{
				fit: fitOf(options),
				length: num(options, 'length'),
				hem: num(options, 'hem'),
				seamAllowance: num(options, 'seamAllowance'),
				sleeveLength: num(options, 'sleeveLength'),
				sleeveOpening: num(options, 'sleeveOpening'),
				neckWidth: num(options, 'neckWidth'),
				neckDepth: num(options, 'neckDepth')
			}
		);
		const front = piece('front', f);
		const back = piece('back', f);
		return {
			pieces: [
				front,
				back,
				...neckFacings(front, back, {
					end: pt(f.neckWidth + facingWidth, 0),
					front: { edge: neckEdge(f, f.neckDepth), depth: f.neckDepth, slit: false },
					back: {
						edge: neckEdge(f, backNeckDepth),
						depth: backNeckDepth + (needsKeyhole(f) ? keyholeLength : 0),
						slit: needsKeyhole(f)
					}
				})
			],
			allowances: [
				{ id: 'seam', label: 'Seam allowance (included in widths)', mm: num(options, 'seamAllowance') },
				{ id: 'hem', label: 'Hem allowance', mm: num(options, 'hem') },
				{ id: 'sleeve_hem', label: 'Sleeve hem, turned twice', mm: sleeveHem }
			],
			notes: [
				'Fold the cloth once lengthwise; cut front and back each with its centre on the fold.',
				'Mark the bust darts on the front only.',
				'The back neck is shallower than the front, as a bodice block has it. Finish the neck with the neck facings.',
				needsKeyhole(f)
					? 'The neck alone is too small to pass over the head: slit the centre back where marked, take the back facing down past it, and close the opening at the neck with a button and loop.'
					: 'No fastening: check the neckline passes over the head before cutting.'
			],
			cautions: [],
			warnings: topWarnings(f)
		};
	}
};
