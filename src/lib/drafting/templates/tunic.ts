import type { Finding } from '../checks';
import { looseEase } from '../ease';
import { pt, quadCurve, type Point } from '../geometry';
import type { Caution, DraftPiece, PieceLine, PieceMark } from '../pieces';
import { fitOf, fitOption, homeSeamAllowance, inch, lengthOption, need, num } from './common';
import { facingWidth, neckFacings } from './facings';
import type { GarmentTemplate } from './types';

/*
 * A loose tunic / kaftan: a rectangle on the fold with cut-in-one (dolman) sleeves and a deep underarm, side
 * slits, and a front neck slit that can close with ties (common practice). Dolman and raglan sleeves need
 * 20–30 % more bust ease than set-in sleeves (Gupta & Zakaria, Anthropometry, Apparel Sizing and Design,
 * ch. 9); the loose ease used here is far above that.
 */
const underarmDrop = inch(3);
const backNeckDepth = inch(1);
const neckSlit = inch(4);
/** Adult head girth is commonly 54–58 cm (from memory). */
const smallestHeadOpening = 560;

export const neckTieCaution: Caution = {
	code: 'neck_cords',
	message:
		'Cords and ties at the neck: on children’s clothes they are a known strangulation hazard. EN 14682 allows no drawstrings or functional cords in the hood and neck area up to age 7 and none with free ends up to 14; in the US, 16 CFR 1120 treats neck and hood drawstrings on children’s upper outerwear (sizes 2T–12) as a substantial product hazard. Leave ties off children’s garments and follow your local code.'
};

interface TunicFigures {
	quarter: number;
	seam: number;
	bodyWidth: number;
	shoulderPoint: number;
	sleeveEnd: number;
	sleeveOpening: number;
	underarmY: number;
	pieceLength: number;
	length: number;
	neckWidth: number;
	neckDepth: number;
	slitLength: number;
}

/** The neckline from the centre to the neck point on the seamed shoulder. */
function neckEdge(f: TunicFigures, neckDepth: number): Point[] {
	const centreNeck = pt(0, neckDepth);
	return [centreNeck, ...quadCurve(centreNeck, pt(f.neckWidth * 0.9, neckDepth * 0.95), pt(f.neckWidth, -f.seam))];
}

function tunicPiece(which: 'front' | 'back', f: TunicFigures, neckTies: boolean): DraftPiece {
	const front = which === 'front';
	const neckDepth = front ? f.neckDepth : backNeckDepth;
	const s = f.seam;
	// The overarm (shoulder) and underarm edges are seamed, so each carries the seam allowance.
	const sleeveBottom = pt(f.sleeveEnd, f.sleeveOpening + s);
	const side = pt(f.bodyWidth, f.underarmY + s);
	const outline: Point[] = [
		...neckEdge(f, neckDepth),
		pt(f.sleeveEnd, -s),
		sleeveBottom,
		...quadCurve(sleeveBottom, pt(f.bodyWidth, sleeveBottom.y), side),
		pt(f.bodyWidth, f.pieceLength),
		pt(0, f.pieceLength)
	];
	const marks: PieceMark[] = [
		{ kind: 'slit', points: [pt(f.bodyWidth, f.length - f.slitLength), pt(f.bodyWidth, f.length)], label: 'side slit' }
	];
	if (front)
		marks.push({
			kind: 'slit',
			points: [pt(0, neckDepth), pt(0, neckDepth + neckSlit)],
			label: neckTies ? 'neck slit, ties' : 'neck slit'
		});
	const lines: PieceLine[] = [
		{
			id: 'body_width',
			label: 'Body width from the fold (with side seam)',
			mm: f.bodyWidth,
			dimension: { from: pt(0, f.underarmY + inch(2)), to: pt(f.bodyWidth, f.underarmY + inch(2)) }
		},
		{ id: 'shoulder_point', label: 'Shoulder point from the fold', mm: f.shoulderPoint },
		{
			id: 'sleeve_end',
			label: 'Sleeve end from the fold',
			mm: f.sleeveEnd,
			dimension: { from: pt(0, -inch(0.6)), to: pt(f.sleeveEnd, -inch(0.6)) }
		},
		{
			id: 'sleeve_opening',
			label: 'Sleeve opening, finished (half round)',
			mm: f.sleeveOpening
		},
		{
			id: 'sleeve_edge_cut',
			label: 'Sleeve edge as cut (opening + 2 seams)',
			mm: f.sleeveOpening + 2 * s,
			dimension: { from: pt(f.sleeveEnd + inch(0.6), -s), to: pt(f.sleeveEnd + inch(0.6), f.sleeveOpening + s) }
		},
		{ id: 'underarm_depth', label: 'Underarm depth', mm: f.underarmY },
		{ id: 'neck_width', label: 'Neck width from the fold', mm: f.neckWidth },
		{ id: 'neck_depth', label: 'Neck depth', mm: neckDepth },
		{ id: 'side_slit', label: 'Side slit', mm: f.slitLength },
		{
			id: 'piece_length',
			label: 'Piece length with shoulder seam and hem',
			mm: f.pieceLength + s,
			dimension: { from: pt(-inch(0.8), -s), to: pt(-inch(0.8), f.pieceLength) }
		}
	];
	if (front) lines.push({ id: 'neck_slit', label: 'Neck slit', mm: neckSlit });
	return {
		id: which,
		label: front ? 'Front' : 'Back',
		cut: { quantity: 1, onFold: true, pair: false, grain: 'lengthwise' },
		outline,
		marks,
		lines,
		grainline: [pt(f.bodyWidth * 0.5, f.underarmY + inch(3)), pt(f.bodyWidth * 0.5, f.pieceLength - inch(3))]
	};
}

function tunicWarnings(f: TunicFigures, upperArm: number | undefined): Finding[] {
	const warnings: Finding[] = [];
	const depth = (f.neckDepth + neckSlit + backNeckDepth) / 2;
	if (2 * Math.PI * Math.sqrt((f.neckWidth ** 2 + depth ** 2) / 2) < smallestHeadOpening) {
		warnings.push({
			code: 'option_out_of_range',
			fields: ['neckWidth', 'neckDepth'],
			message: 'The neck opening may be too small to pass over the head. Widen or deepen it.'
		});
	}
	if (upperArm !== undefined && 2 * f.sleeveOpening < upperArm + inch(2)) {
		warnings.push({
			code: 'unusual_relation',
			fields: ['options.sleeveOpening', 'upper_arm_girth'],
			message: 'The sleeve opening is tight for this upper arm; a loose sleeve needs at least 2 in more than the arm.'
		});
	}
	return warnings;
}

export const tunic: GarmentTemplate = {
	id: 'tunic',
	name: 'Loose tunic / kaftan',
	summary: 'Front and back on the fold with cut-in-one sleeves, side slits and a neck slit (ties optional).',
	category: 'top',
	requiredMeasurements: ['bust_girth', 'hip_girth', 'shoulder_width'],
	optionalMeasurements: ['upper_arm_girth', 'arm_length'],
	options: [
		fitOption,
		lengthOption('length', 'Finished length (shoulder to hem)', 800, [500, 1500]),
		lengthOption('sleeveLength', 'Sleeve beyond the shoulder point', 250, [0, 600]),
		lengthOption('sleeveOpening', 'Sleeve opening (half round)', inch(9), [inch(6), inch(14)]),
		lengthOption('neckWidth', 'Neck width from the fold', inch(3.5), [inch(2.5), inch(6)]),
		lengthOption('neckDepth', 'Front neck depth', inch(3), [inch(1.5), inch(8)]),
		lengthOption('slitLength', 'Side slits', inch(6), [0, inch(14)]),
		lengthOption('seamAllowance', 'Seam allowance', homeSeamAllowance, [inch(0.25), inch(1.25)]),
		lengthOption('hem', 'Hem allowance', inch(1), [inch(0.5), inch(3)]),
		{
			id: 'neckTies',
			label: 'Ties at the neck slit',
			kind: 'boolean',
			default: false,
			help: 'Not for children’s garments.'
		}
	],
	defaultLabourHours: 3,
	method: 'Rectangle-and-fold kaftan construction (common practice), loose design ease.',
	draft(body, options) {
		const s = num(options, 'seamAllowance');
		const ease = looseEase[fitOf(options)];
		const quarter = (Math.max(need(body, 'bust_girth'), need(body, 'hip_girth')) + ease) / 4;
		const shoulderPoint = need(body, 'shoulder_width') / 2;
		const sleeveOpening = num(options, 'sleeveOpening');
		const f: TunicFigures = {
			quarter,
			seam: s,
			bodyWidth: quarter + s,
			shoulderPoint,
			sleeveEnd: Math.max(shoulderPoint + num(options, 'sleeveLength') + s, quarter + s + inch(1)),
			sleeveOpening,
			underarmY: sleeveOpening + underarmDrop,
			pieceLength: num(options, 'length') + num(options, 'hem'),
			length: num(options, 'length'),
			neckWidth: num(options, 'neckWidth'),
			neckDepth: num(options, 'neckDepth'),
			slitLength: num(options, 'slitLength')
		};
		const neckTies = options.neckTies === true;
		const front = tunicPiece('front', f, neckTies);
		const back = tunicPiece('back', f, neckTies);
		return {
			pieces: [
				front,
				back,
				...neckFacings(front, back, {
					end: pt(f.neckWidth + facingWidth, -s),
					front: { edge: neckEdge(f, f.neckDepth), depth: f.neckDepth + neckSlit, slit: true },
					back: { edge: neckEdge(f, backNeckDepth), depth: backNeckDepth, slit: false }
				})
			],
			allowances: [
				{ id: 'seam', label: 'Seam allowance', mm: s },
				{ id: 'hem', label: 'Hem allowance', mm: num(options, 'hem') },
				{ id: 'ease', label: 'Ease at bust/hip (total)', mm: ease }
			],
			notes: [
				'Cut front and back each on the fold.',
				'Face the neck and its slit with the neck facings; stitch the side seams down to the slits.'
			],
			cautions: [neckTieCaution],
			warnings: tunicWarnings(f, body.upper_arm_girth)
		};
	}
};
