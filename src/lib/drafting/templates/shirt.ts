import { isChildBody, type Finding } from '../checks';
import { bicepsEase, shirtEase } from '../ease';
import { lerp, pt, quadCurve, type Point } from '../geometry';
import type { Caution, DraftPiece, PieceLine, PieceMark } from '../pieces';
import { fitOf, fitOption, homeSeamAllowance, inch, lengthOption, need, num } from './common';
import { cubicCurve, cutOutline, lengthOf, pathLength, type NetEdge } from './seams';
import type { BodyMm, GarmentTemplate, ResolvedOptions } from './types';

/*
 * A shirt or blouse with set-in sleeves and a collar on a stand, after the blocks in Winifred Aldrich,
 * Metric Pattern Cutting for Women's Wear, 6th ed. (Wiley-Blackwell, 2015; that edition is from memory, the
 * 5th ed., Blackwell 2008, is the one a published tutorial cites): chapter 1, the close-fitting bodice block
 * and the one-piece sleeve block, and the shirt collar with a separate stand from the collars chapter. The
 * book is not at hand; every figure below is from memory unless a source is named. Sources named here:
 * seam allowance 5/8 in (Wikipedia, "Seam allowance"); chest, waist and hip ease (Central Washington
 * University course text, "Ch. 16 Ease in Clothing"; McCunn, How to Make Sewing Patterns); blocks drafted
 * for a B cup (modelistecreative.com: "most basic blocks are drafted to a standard B or sometimes C cup")
 * with EN 13402-3's cup bands (B = bust − under bust in (14, 16] cm, mobilefish.com's EN 13402 notes).
 *
 * Datums as the bodice block has them: the neck-point line at y = 0; the nape (centre back neck) the back neck
 * depth below it; scye depth, nape-to-waist and waist-to-hip lines squared down from the nape. Scye depth
 * bust/8 + 10 cm is from memory (close to the block's size-12 figure); a looser fit drops it (common practice).
 * Front and back are quarters of the chest with ease; a side bust dart (1 in for a B cup, as the shift dress)
 * lengthens the front. The one-piece sleeve is drafted from the armhole as drawn: its head, two S-curves from
 * the crown to the underarm points, is solved so that each half is that side's armhole plus half the sleeve
 * head ease; the cap height is a third of the armhole (from memory), lowered where the biceps would otherwise
 * give less than the biceps ease over the upper arm ("cap height, biceps and armhole: set two, the third
 * follows", dresspatternmaking.com, Understanding the Sleeve part 3).
 * Every edge is drafted on the seam line and the cutting line is the seam line moved out by its allowance.
 */

/** Back neck depth below the neck-point line, shoulder slope and the scye drop for looser fits (from memory). */
const backNeckDepth = 20;
const shoulderDrop = inch(1.5);
const scyeExtra = { fitted: 0, regular: 10, relaxed: 20 } as const;
/** Shirt button extension beyond the centre front (common practice for 1–1.2 cm buttons). */
export const buttonExtension = 15;
/** Grown-on front facing, folded back at the front edge (common practice, 5–7 cm). */
export const frontFacingWidth = 60;
/** Collar stand height and collar depth at the centre back, and how far the collar point reaches (from memory). */
export const standHeight = 30;
export const collarDepth = 45;
const collarPointDrop = 15;
const collarPointOut = 10;
/** A shirt collar is made about ½ in over the neck (common practice: collar size = neck + ½ in). */
export const collarEase = inch(0.5);
/** The most a side seam is shaped in at the waist (from memory). */
const maxSideShaping = 20;
/**
 * Bust dart: 1 in for the B cup the block is drafted for (from memory), the cup taken as the middle of
 * EN 13402-3's B band, bust − under bust 15 cm in (14, 16] (mobilefish.com, EN 13402 notes); blocks are
 * drafted for a B cup (modelistecreative.com). Where it sits on the side seam and how short of the bust
 * point it stops: from memory.
 */
const baseDartIntake = inch(1);
const baseCupDifference = 150;
const dartBelowUnderarm = inch(2);
const dartShortOfApex = inch(1);
/** Button spacing down the front and buttonhole length for a 1–1.2 cm shirt button (common practice). */
const buttonSpacing = 90;
const buttonholeLength = 14;
/** A hand passes through about 22 cm when slid in (from memory); a closed cuffless sleeve end needs that. */
const handPassage = 220;
/** The shortest underseam a set-in sleeve is drafted with (common practice: a short sleeve is about 5 cm). */
const minUnderseam = 50;
/** The least biceps ease a set-in sleeve should have (Threads, "Set-in sleeve solutions", 2021). */
const minimumBicepsEase = inch(2);

/** Buttons on a small child's garment (common practice; local rules on small parts may apply). */
export const childButtonCaution: Caution = {
	code: 'child_buttons',
	message:
		'Buttons on a small child’s garment: sew them on through a reinforcing stay with a thread shank and check they hold under a firm pull; a button that comes off is a choking hazard for children under three. Follow your local rules on small parts.'
};

export interface ShirtNet {
	front: NetEdge[];
	back: NetEdge[];
	sleeve: NetEdge[];
	stand: NetEdge[];
	collar: NetEdge[];
	figures: ShirtFigures;
}

export interface ShirtFigures {
	seam: number;
	hem: number;
	quarterChest: number;
	quarterWaist: number;
	quarterHip: number;
	chestEase: number;
	napeY: number;
	scyeY: number;
	waistY: number;
	hipY: number;
	hemY: number;
	neckWidth: number;
	frontNeckDepth: number;
	shoulderPoint: number;
	dartIntake: number;
	dartTop: number;
	apex: Point;
	waistWidth: number;
	hipWidth: number;
	armhole: number;
	capHeight: number;
	headEase: number;
	biceps: number;
	sleeveLength: number;
	requestedSleeveLength: number;
	sleeveOpening: number;
	standLength: number;
	buttons: number[];
}

function backNeck(nw: number): Point[] {
	return [pt(0, backNeckDepth), ...quadCurve(pt(0, backNeckDepth), pt(nw * 0.6, backNeckDepth), pt(nw, 0), 12)];
}

function frontNeck(nw: number, depth: number): Point[] {
	return [pt(0, depth), ...quadCurve(pt(0, depth), pt(nw * 0.95, depth * 0.95), pt(nw, 0), 16)];
}

/** The neck width (front neck depth 1 cm more) whose neck seam, centre front to centre front, is `girth`. */
function neckWidthFor(girth: number): number {
	const seam = (nw: number) => 2 * (pathLength(backNeck(nw)) + pathLength(frontNeck(nw, nw + 10)));
	let lo = 20;
	let hi = 200;
	for (let i = 0; i < 50; i++) {
		const mid = (lo + hi) / 2;
		if (seam(mid) < girth) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}

function armholeCurve(shoulder: Point, underarm: Point, hollow: number): Point[] {
	const across = shoulder.x - hollow;
	const depth = underarm.y - shoulder.y;
	return cubicCurve(shoulder, pt(across, shoulder.y + depth * 0.55), pt(across, underarm.y), underarm, 24);
}

/** One half of the sleeve head, underarm (0, h) up to the crown (b, 0). */
function headHalf(b: number, h: number, front: boolean): Point[] {
	const start = pt(0, h);
	return [start, ...cubicCurve(start, pt((front ? 0.5 : 0.4) * b, h), pt((front ? 0.5 : 0.55) * b, 0), pt(b, 0), 24)];
}

function halfWidthFor(target: number, h: number, front: boolean): number {
	let lo = 0;
	let hi = target;
	for (let i = 0; i < 50; i++) {
		const mid = (lo + hi) / 2;
		if (pathLength(headHalf(mid, h, front)) < target) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}

function dartIntakeFor(body: BodyMm): number {
	const bust = need(body, 'bust_girth');
	const cup = body.under_bust_girth === undefined ? baseCupDifference : bust - body.under_bust_girth;
	return Math.min(Math.max(baseDartIntake + (cup - baseCupDifference) / 2, inch(0.5)), inch(2.5));
}

/** The side seam from the underarm through waist and hip to the hem line, cut off at the hem. */
function sideSeam(points: Point[], hemY: number): Point[] {
	const kept = [points[0]];
	for (let i = 1; i < points.length; i++) {
		const p = points[i];
		if (p.y < hemY - 1e-6) {
			kept.push(p);
			continue;
		}
		const q = points[i - 1];
		kept.push(lerp(q, p, (hemY - q.y) / (p.y - q.y)));
		return kept;
	}
	const last = kept[kept.length - 1];
	kept.push(pt(last.x, hemY));
	return kept;
}

/** The whole shirt on its seam lines, each edge with its allowance. */
export function shirtNet(body: BodyMm, options: ResolvedOptions): ShirtNet {
	const fit = fitOf(options);
	const ease = shirtEase[fit];
	const s = num(options, 'seamAllowance');
	const hem = num(options, 'hem');
	const bust = need(body, 'bust_girth');
	const quarterChest = (bust + ease.bust) / 4;
	const quarterWaist = (need(body, 'waist_girth') + ease.waist) / 4;
	const quarterHip = (need(body, 'hip_girth') + ease.hip) / 4;
	const napeY = backNeckDepth;
	const scyeY = napeY + bust / 8 + 100 + scyeExtra[fit];
	const waistY = napeY + need(body, 'nape_to_waist');
	const hipY = waistY + need(body, 'waist_to_hip');
	const hemY = napeY + num(options, 'length');
	const neckWidth = neckWidthFor(need(body, 'neck_girth') + collarEase);
	const frontNeckDepth = neckWidth + 10;
	const shoulderPoint = Math.max(need(body, 'shoulder_width') / 2, neckWidth + 60);
	const widest = Math.max(quarterChest, quarterHip);
	const waistWidth = Math.max(quarterWaist, widest - maxSideShaping);
	const hipWidth = Math.max(quarterHip, quarterWaist);
	const dartIntake = dartIntakeFor(body);
	const dartTop = scyeY + dartBelowUnderarm;
	const shoulder = pt(shoulderPoint, shoulderDrop);
	const underarm = pt(quarterChest, scyeY);

	const backArmhole = [shoulder, ...armholeCurve(shoulder, underarm, 10)];
	const backSide = sideSeam([underarm, pt(waistWidth, waistY), pt(hipWidth, hipY), pt(hipWidth, hemY)], hemY);
	const back: NetEdge[] = [
		{ id: 'neck', points: backNeck(neckWidth), allowance: s },
		{ id: 'shoulder', points: [pt(neckWidth, 0), shoulder], allowance: s },
		{ id: 'armhole', points: backArmhole, allowance: s },
		{ id: 'side', points: backSide, allowance: s },
		{ id: 'hem', points: [backSide[backSide.length - 1], pt(0, hemY)], allowance: hem },
		{ id: 'fold', points: [pt(0, hemY), pt(0, backNeckDepth)], allowance: 0 }
	];

	// The front below the bust dart lies lower by the dart's intake; the dart takes it up at the side seam.
	const frontArmhole = [shoulder, ...armholeCurve(shoulder, underarm, 20)];
	const lowered = backSide.slice(1).map((p) => pt(p.x, p.y + dartIntake));
	const sideAt = (y: number) => lerp(underarm, lowered[0], (y - underarm.y) / (lowered[0].y - underarm.y));
	const frontSide = [underarm, sideAt(dartTop), sideAt(dartTop + dartIntake), ...lowered];
	const frontHemY = hemY + dartIntake;
	const edgeX = -buttonExtension;
	const facingX = edgeX - frontFacingWidth;
	const neck = [pt(edgeX, frontNeckDepth), ...frontNeck(neckWidth, frontNeckDepth)];
	// The grown-on facing folds back at the front edge: its top is the neck edge mirrored about the fold.
	const mirrored: Point[] = [];
	for (let i = 0; i < neck.length; i++) {
		const p = neck[i];
		if (p.x - edgeX <= frontFacingWidth) {
			mirrored.push(pt(2 * edgeX - p.x, p.y));
			continue;
		}
		const q = neck[i - 1];
		mirrored.push(pt(facingX, lerp(q, p, (edgeX + frontFacingWidth - q.x) / (p.x - q.x)).y));
		break;
	}
	const facingTop = mirrored.reverse();
	const front: NetEdge[] = [
		{ id: 'facing_neck', points: facingTop, allowance: s },
		{ id: 'neck', points: neck, allowance: s },
		{ id: 'shoulder', points: [pt(neckWidth, 0), shoulder], allowance: s },
		{ id: 'armhole', points: frontArmhole, allowance: s },
		{ id: 'side', points: frontSide, allowance: s },
		{ id: 'hem', points: [frontSide[frontSide.length - 1], pt(facingX, frontHemY)], allowance: hem },
		// The facing's long edge is neatened, not seamed.
		{ id: 'facing_edge', points: [pt(facingX, frontHemY), facingTop[0]], allowance: 0 }
	];

	const armhole = pathLength(backArmhole) + pathLength(frontArmhole);
	const headEase = num(options, 'sleeveHeadEase');
	const upperArm = body.upper_arm_girth;
	const sleeveFor = (h: number) => {
		const bB = halfWidthFor(pathLength(backArmhole) + headEase / 2, h, false);
		const bF = halfWidthFor(pathLength(frontArmhole) + headEase / 2, h, true);
		return { h, bB, bF, biceps: bB + bF };
	};
	let sleeve = sleeveFor(armhole / 3);
	if (upperArm !== undefined && sleeve.biceps < upperArm + bicepsEase[fit]) {
		let lo = armhole / 6;
		let hi = armhole / 3;
		for (let i = 0; i < 40; i++) {
			const mid = (lo + hi) / 2;
			if (sleeveFor(mid).biceps < upperArm + bicepsEase[fit]) hi = mid;
			else lo = mid;
		}
		sleeve = sleeveFor(lo);
	}
	const { h, bB, bF } = sleeve;
	// The underseam needs some length below the underarm; a sleeve shorter than that is a cap sleeve.
	const sleeveLength = Math.max(num(options, 'sleeveLength'), h + minUnderseam);
	const opening = num(options, 'sleeveOpening');
	const headBack = headHalf(bB, h, false);
	const headFront = headHalf(bF, h, true)
		.map((p) => pt(bB + bF - p.x, p.y))
		.reverse();
	const hemRight = pt(bB + opening / 2, sleeveLength);
	const hemLeft = pt(bB - opening / 2, sleeveLength);
	const sleeveEdges: NetEdge[] = [
		{ id: 'head_back', points: headBack, allowance: s },
		{ id: 'head_front', points: headFront, allowance: s },
		{ id: 'underseam_front', points: [pt(bB + bF, h), hemRight], allowance: s },
		{ id: 'hem', points: [hemRight, hemLeft], allowance: hem },
		{ id: 'underseam_back', points: [hemLeft, pt(0, h)], allowance: s }
	];

	// The stand runs from the centre back (on the fold) to the front edge; the collar to the centre front.
	const standLength = pathLength(backNeck(neckWidth)) + pathLength(neck);
	const stand: NetEdge[] = [
		{ id: 'collar_seam', points: [pt(0, 0), pt(standLength, 0)], allowance: s },
		{ id: 'front_end', points: [pt(standLength, 0), pt(standLength, standHeight)], allowance: s },
		{ id: 'neck_seam', points: [pt(standLength, standHeight), pt(0, standHeight)], allowance: s },
		{ id: 'fold', points: [pt(0, standHeight), pt(0, 0)], allowance: 0 }
	];
	const collarLength = standLength - buttonExtension;
	const point = pt(collarLength + collarPointOut, -collarPointDrop);
	const collar: NetEdge[] = [
		{ id: 'outer', points: [pt(0, 0), point], allowance: s },
		{ id: 'end', points: [point, pt(collarLength, collarDepth)], allowance: s },
		{ id: 'stand_seam', points: [pt(collarLength, collarDepth), pt(0, collarDepth)], allowance: s },
		{ id: 'fold', points: [pt(0, collarDepth), pt(0, 0)], allowance: 0 }
	];

	const firstButton = frontNeckDepth + 70;
	const lastButton = frontHemY - 100;
	const count = Math.max(2, Math.floor((lastButton - firstButton) / buttonSpacing) + 1);
	const step = count > 1 ? (lastButton - firstButton) / (count - 1) : 0;
	const buttons = Array.from({ length: count }, (_, i) => firstButton + i * step);

	return {
		front,
		back,
		sleeve: sleeveEdges,
		stand,
		collar,
		figures: {
			seam: s,
			hem,
			quarterChest,
			quarterWaist,
			quarterHip,
			chestEase: ease.bust,
			napeY,
			scyeY,
			waistY,
			hipY,
			hemY,
			neckWidth,
			frontNeckDepth,
			shoulderPoint,
			dartIntake,
			dartTop,
			apex: pt(need(body, 'bust_point_span') / 2, need(body, 'shoulder_to_bust_point')),
			waistWidth,
			hipWidth,
			armhole,
			capHeight: h,
			headEase,
			biceps: bB + bF,
			sleeveLength,
			requestedSleeveLength: num(options, 'sleeveLength'),
			sleeveOpening: opening,
			standLength,
			buttons
		}
	};
}

const guide = (label: string, from: Point, to: Point): PieceMark => ({ kind: 'guide', label, points: [from, to] });

/**
 * Balance notches for setting the sleeve (common practice: one notch on the front armhole, two on the back,
 * the same distance from the underarm on bodice and sleeve, the head's ease held between them and the crown).
 */
export const armholeNotches = { front: [75], back: [85, 95] } as const;

/** The point `distance` along an edge from its start (or from its end), with the edge's direction there. */
export function alongEdge(points: readonly Point[], distance: number, fromEnd = false) {
	const run = fromEnd ? [...points].reverse() : points;
	let left = distance;
	for (let i = 1; i < run.length; i++) {
		const a = run[i - 1];
		const b = run[i];
		const length = Math.hypot(b.x - a.x, b.y - a.y);
		if (left <= length || i === run.length - 1) {
			const at = lerp(a, b, Math.min(left / length, 1));
			const sign = fromEnd ? -1 : 1;
			return { at, dir: pt((sign * (b.x - a.x)) / length, (sign * (b.y - a.y)) / length) };
		}
		left -= length;
	}
	return { at: run[0], dir: pt(1, 0) };
}

/** A notch mark from the seam line straight out to the cutting line of a clockwise piece. */
function notchMark(points: readonly Point[], distance: number, fromEnd: boolean, allowance: number): PieceMark {
	const { at, dir } = alongEdge(points, distance, fromEnd);
	return guide('', at, pt(at.x + dir.y * allowance, at.y - dir.x * allowance));
}

function bodyPiece(which: 'front' | 'back', net: ShirtNet): DraftPiece {
	const f = net.figures;
	const front = which === 'front';
	const edges = front ? net.front : net.back;
	const drop = front ? f.dartIntake : 0;
	const s = f.seam;
	const hemY = f.hemY + drop;
	const marks: PieceMark[] = [];
	if (f.waistY < f.hemY) marks.push(guide('waist line', pt(0, f.waistY + drop), pt(f.waistWidth + s, f.waistY + drop)));
	if (f.hipY < f.hemY) marks.push(guide('hip line', pt(0, f.hipY + drop), pt(f.hipWidth + s, f.hipY + drop)));
	const lines: PieceLine[] = [
		{
			id: 'chest_width',
			label: `Width at the chest line from the centre ${front ? 'front' : 'back'} (with side seam)`,
			mm: f.quarterChest + s,
			dimension: { from: pt(0, f.scyeY), to: pt(f.quarterChest + s, f.scyeY) }
		},
		{ id: 'waist_width', label: 'Width at the waist line (with side seam)', mm: f.waistWidth + s },
		{ id: 'hip_width', label: 'Width at the hip line (with side seam)', mm: f.hipWidth + s },
		{ id: 'finished_chest', label: 'Finished chest, all round', mm: 4 * f.quarterChest },
		{ id: 'chest_ease', label: 'Chest ease over the body, all round', mm: f.chestEase },
		{ id: 'armhole_seam', label: `${front ? 'Front' : 'Back'} armhole seam`, mm: lengthOf(edges, 'armhole') },
		{
			id: 'neck_seam',
			label: front ? 'Front neck seam, front edge to neck point' : 'Back neck seam, centre back to neck point',
			mm: lengthOf(edges, 'neck')
		},
		{ id: 'shoulder_seam', label: 'Shoulder seam', mm: lengthOf(edges, 'shoulder') },
		{
			id: 'piece_length',
			label: 'Piece length with seam and hem',
			mm: hemY + f.hem + s,
			dimension: { from: pt(-inch(0.8), -s), to: pt(-inch(0.8), hemY + f.hem) }
		}
	];
	const armhole = edges.find((e) => e.id === 'armhole')!.points;
	marks.push(...armholeNotches[which].map((d) => notchMark(armhole, d, true, s)));
	if (front) {
		const apex = pt(f.apex.x + dartShortOfApex, f.apex.y);
		const side = net.front.find((e) => e.id === 'side')!.points;
		// The dart legs run out to the cutting line, where they are notched.
		const out = (p: Point) => {
			const { dir } = alongEdge([side[0], side[3]], 0);
			return pt(p.x + dir.y * s, p.y - dir.x * s);
		};
		marks.push(
			{ kind: 'dart', label: 'bust dart', points: [out(side[1]), side[1], apex, side[2], out(side[2])] },
			{
				kind: 'fold',
				label: 'front edge: fold the facing back',
				points: [pt(-buttonExtension, f.frontNeckDepth), pt(-buttonExtension, hemY)]
			},
			...f.buttons.map((y, i) =>
				guide(i === 0 ? 'buttonholes (right front)' : '', pt(-3, y), pt(buttonholeLength - 3, y))
			)
		);
		lines.push(
			{ id: 'dart_intake', label: 'Bust dart intake', mm: f.dartIntake },
			{ id: 'button_extension', label: 'Button extension beyond centre front', mm: buttonExtension },
			{ id: 'facing_width', label: 'Grown-on facing width', mm: frontFacingWidth },
			{
				id: 'button_spacing',
				label: 'Button spacing',
				mm: f.buttons.length > 1 ? f.buttons[1] - f.buttons[0] : 0
			}
		);
	} else {
		lines.push(
			{
				id: 'armhole_depth',
				label: 'Armhole depth (scye depth, from the nape)',
				mm: f.scyeY - f.napeY,
				dimension: { from: pt(-inch(1.6), f.napeY), to: pt(-inch(1.6), f.scyeY) }
			},
			{ id: 'nape_to_waist', label: 'Nape to waist line', mm: f.waistY - f.napeY }
		);
	}
	const grainX = f.quarterChest * 0.5;
	return {
		id: which,
		label: front ? 'Front' : 'Back',
		cut: front
			? { quantity: 2, onFold: false, pair: true, grain: 'lengthwise' }
			: { quantity: 1, onFold: true, pair: false, grain: 'lengthwise' },
		outline: cutOutline(edges),
		marks,
		lines,
		grainline: [pt(grainX, f.scyeY + inch(1)), pt(grainX, Math.max(f.scyeY + inch(3), hemY - inch(2)))]
	};
}

function sleevePiece(net: ShirtNet): DraftPiece {
	const f = net.figures;
	const s = f.seam;
	const crownX = net.sleeve[0].points[net.sleeve[0].points.length - 1].x;
	const head = lengthOf(net.sleeve, 'head_back') + lengthOf(net.sleeve, 'head_front');
	return {
		id: 'sleeve',
		label: 'Sleeve',
		cut: { quantity: 2, onFold: false, pair: true, grain: 'lengthwise' },
		outline: cutOutline(net.sleeve),
		marks: [
			guide('shoulder point', pt(crownX, -s), pt(crownX, inch(1))),
			...armholeNotches.back.map((d) => notchMark(net.sleeve[0].points, d, false, s)),
			...armholeNotches.front.map((d) => notchMark(net.sleeve[1].points, d, true, s)),
			guide('biceps line', pt(0, f.capHeight), pt(f.biceps, f.capHeight))
		],
		lines: [
			{ id: 'head_seam', label: 'Sleeve head seam', mm: head },
			{ id: 'armhole', label: 'Armhole it is set into (front and back)', mm: f.armhole },
			{ id: 'head_ease', label: 'Sleeve head ease (eased into the armhole)', mm: head - f.armhole },
			{
				id: 'cap_height',
				label: 'Cap height',
				mm: f.capHeight,
				dimension: { from: pt(crownX + inch(0.8), 0), to: pt(crownX + inch(0.8), f.capHeight) }
			},
			{
				id: 'biceps',
				label: 'Finished biceps width',
				mm: f.biceps,
				dimension: { from: pt(0, f.capHeight + inch(1)), to: pt(f.biceps, f.capHeight + inch(1)) }
			},
			{
				id: 'sleeve_length',
				label: 'Sleeve length, finished (shoulder point to hem)',
				mm: f.sleeveLength,
				dimension: { from: pt(-inch(1.2), 0), to: pt(-inch(1.2), f.sleeveLength) }
			},
			{ id: 'sleeve_opening', label: 'Sleeve end, finished, all round', mm: f.sleeveOpening }
		],
		grainline: [pt(crownX, f.capHeight * 0.6), pt(crownX, f.sleeveLength - inch(2))]
	};
}

function collarPieces(net: ShirtNet): DraftPiece[] {
	const f = net.figures;
	const s = f.seam;
	const centreFront = f.standLength - buttonExtension;
	const collarSeam = lengthOf(net.collar, 'stand_seam');
	return [
		{
			id: 'collar_stand',
			label: 'Collar stand',
			cut: { quantity: 2, onFold: true, pair: false, grain: 'lengthwise' },
			outline: cutOutline(net.stand),
			marks: [guide('centre front', pt(centreFront, -s), pt(centreFront, standHeight + s))],
			lines: [
				{
					id: 'neck_seam',
					label: 'Neck seam, centre back to front edge',
					mm: lengthOf(net.stand, 'neck_seam'),
					dimension: { from: pt(0, standHeight + s + 8), to: pt(f.standLength, standHeight + s + 8) }
				},
				{ id: 'collar_size', label: 'Collar size (centre front to centre front)', mm: 2 * centreFront },
				{ id: 'stand_height', label: 'Stand height', mm: standHeight }
			],
			// Grain parallel to the centre back, which lies on the fold (the usual shirt collar cut).
			grainline: [pt(f.standLength * 0.5, standHeight * 0.2), pt(f.standLength * 0.5, standHeight * 0.8)]
		},
		{
			id: 'collar',
			label: 'Collar',
			cut: { quantity: 2, onFold: true, pair: false, grain: 'lengthwise' },
			outline: cutOutline(net.collar),
			marks: [],
			lines: [
				{ id: 'stand_seam', label: 'Seam to the stand, centre back to centre front', mm: collarSeam },
				{ id: 'collar_depth', label: 'Collar depth at the centre back', mm: collarDepth }
			],
			grainline: [pt(collarSeam * 0.5, collarDepth * 0.2), pt(collarSeam * 0.5, collarDepth * 0.8)]
		}
	];
}

function shirtWarnings(net: ShirtNet, body: BodyMm): Finding[] {
	const f = net.figures;
	const warnings: Finding[] = [];
	const arm = body.upper_arm_girth;
	if (arm !== undefined && f.biceps < arm + minimumBicepsEase - 0.5) {
		warnings.push({
			code: 'unusual_relation',
			fields: ['upper_arm_girth', 'bust_girth'],
			message:
				'The sleeve is tight over this upper arm even with the sleeve head lowered: a set-in sleeve needs its biceps at least 2 in over the arm. Choose a looser fit.'
		});
	}
	if (f.sleeveLength > f.requestedSleeveLength + 1e-6) {
		warnings.push({
			code: 'option_out_of_range',
			fields: ['options.sleeveLength'],
			message: `A set-in sleeve needs its underseam: the sleeve is drafted ${Math.round(f.sleeveLength / 10)} cm long, the cap height plus 5 cm.`
		});
	}
	// Above the elbow the sleeve end goes round the upper arm, so it needs the arm and a little ease.
	const armAtEnd = body.upper_arm_girth ?? f.biceps - minimumBicepsEase;
	if (f.sleeveLength < 0.55 * (body.arm_length ?? Infinity) && f.sleeveOpening < armAtEnd + inch(1)) {
		warnings.push({
			code: 'option_out_of_range',
			fields: ['options.sleeveOpening'],
			message:
				'A short sleeve ends round the upper arm: make its end at least 1 in more than the upper arm, or it will bind.'
		});
	}
	if (f.sleeveOpening < handPassage && f.sleeveLength > 0.8 * (body.arm_length ?? Infinity)) {
		warnings.push({
			code: 'option_out_of_range',
			fields: ['options.sleeveOpening'],
			message: 'A sleeve end this narrow will not pass the hand without an opening; widen it or add a placket and cuff.'
		});
	}
	if (f.hemY < f.waistY + 50) {
		warnings.push({
			code: 'option_out_of_range',
			fields: ['options.length'],
			message: 'The shirt ends at or above the waist; check the length.'
		});
	}
	return warnings;
}

export const shirt: GarmentTemplate = {
	id: 'shirt',
	name: 'Shirt / blouse with set-in sleeves',
	summary: 'Button front, side bust darts, one-piece set-in sleeves and a collar on a stand.',
	category: 'top',
	requiredMeasurements: [
		'bust_girth',
		'waist_girth',
		'hip_girth',
		'neck_girth',
		'shoulder_width',
		'nape_to_waist',
		'waist_to_hip',
		'shoulder_to_bust_point',
		'bust_point_span',
		'arm_length'
	],
	optionalMeasurements: ['under_bust_girth', 'upper_arm_girth'],
	options: [
		fitOption,
		lengthOption('length', 'Finished length (nape to hem)', 700, [450, 1100]),
		lengthOption('sleeveLength', 'Sleeve length (shoulder point to hem)', null, [100, 850], {
			defaultFrom: 'arm_length',
			help: 'Arm length gives a full-length sleeve; shorten it for a short sleeve.'
		}),
		lengthOption('sleeveOpening', 'Sleeve end, all round', 260, [180, 500], {
			help: 'A closed sleeve end must pass the hand.'
		}),
		lengthOption('sleeveHeadEase', 'Sleeve head ease', 30, [0, 60], {
			help: 'How much longer the sleeve head is than the armhole; eased in when setting the sleeve.'
		}),
		lengthOption('seamAllowance', 'Seam allowance', homeSeamAllowance, [inch(0.25), inch(1)]),
		lengthOption('hem', 'Hem allowance', 20, [10, 50])
	],
	defaultLabourHours: 8,
	method:
		'Close-fitting bodice block and one-piece sleeve block after Aldrich, Metric Pattern Cutting for Women’s Wear (6th ed., ch. 1), with a shirt collar on a stand; scye depth, waist and hip lines squared down from the nape; sleeve head solved to the armhole plus its ease; chest ease from CWU “Ease in Clothing” and McCunn.',
	draft(body, options) {
		const net = shirtNet(body, options);
		const f = net.figures;
		return {
			pieces: [bodyPiece('front', net), bodyPiece('back', net), sleevePiece(net), ...collarPieces(net)],
			allowances: [
				{ id: 'seam', label: 'Seam allowance', mm: f.seam },
				{ id: 'hem', label: 'Hem allowance (body and sleeves)', mm: f.hem },
				{ id: 'chest_ease', label: 'Chest ease (total)', mm: f.chestEase },
				{ id: 'head_ease', label: 'Sleeve head ease', mm: f.headEase },
				{ id: 'bust_dart', label: 'Bust dart intake', mm: f.dartIntake }
			],
			notes: [
				'Cut the back on the fold and the fronts as a pair; the front facing is cut in one with each front and folds back at the front edge.',
				'Interface the collar stand, the collar and the grown-on facings.',
				'Sew the bust darts and shoulders, set the sleeves (ease the head between the notches), then sew the side and underarm seams in one.',
				`${f.buttons.length} buttons down the front and one on the stand; buttonholes on the right front for a woman’s shirt, on the left for a man’s.`
			],
			cautions: isChildBody(body) ? [childButtonCaution] : [],
			warnings: shirtWarnings(net, body)
		};
	}
};
