import { isChildBody, type Finding } from '../checks';
import { waistcoatEase } from '../ease';
import { distance, pt, quadCurve, type Point } from '../geometry';
import type { DraftPiece, PieceLine, PieceMark } from '../pieces';
import { fitOf, fitOption, inch, lengthOption, need, num } from './common';
import { cubicCurve, cutOutline, lengthOf, type NetEdge } from './seams';
import { childButtonCaution } from './shirt';
import type { BodyMm, GarmentTemplate, ResolvedOptions } from './types';

/*
 * A lined, single-breasted waistcoat with a V front, pointed front hem, two lower welt pockets and a breast
 * welt pocket, after the waistcoat block in Winifred Aldrich, Metric Pattern Cutting for Menswear, 5th ed.
 * (Wiley-Blackwell, 2011; edition and year from memory), the waistcoats chapter, which builds on the menswear
 * body block of chapter 1. The book is not at hand: the figures are from memory unless a source is named.
 * Sources named here: seam allowance 5/8 in (Wikipedia, "Seam allowance"); chest and waist ease (McCunn,
 * How to Make Sewing Patterns; Central Washington University course text, "Ch. 16 Ease in Clothing"). Datums as the bodice block:
 * neck-point line at y = 0, nape the back neck depth below it, scye depth and nape-to-waist squared down
 * from the nape. A waistcoat armhole is dropped about 4 cm below a shirt's and its shoulder is narrowed about
 * 2.5 cm so that it sits inside a jacket (from memory). Shaping is at the side seams only (at most 2.5 cm
 * each), a simplification of the block's waist darts. It is bagged out: every edge of the fronts, facings,
 * linings and back is a seam and carries the seam allowance. The back and the linings are cut in lining,
 * the usual practice for a waistcoat worn under a jacket.
 */

/**
 * Back neck depth, shoulder slope, the armhole dropped and the shoulder narrowed to sit inside a jacket, the
 * scye drop for looser fits and the most a side seam is shaped in (all from memory).
 */
const backNeckDepth = 20;
const shoulderDrop = inch(1.75);
const armholeDrop = 40;
const shoulderNarrowing = 25;
const scyeExtra = { fitted: 0, regular: 10, relaxed: 20 } as const;
const maxSideShaping = 25;
/** Button extension beyond the centre front for a waistcoat button (common practice). */
export const waistcoatExtension = 18;
/** Front facing width along the front edges (common practice: 4–6 cm for a waistcoat). */
export const waistcoatFacingWidth = 50;
/** A welt is folded: finished depth 2 cm for lower and breast pockets (from memory). */
export const weltDepth = 20;
/** Breast pocket mouth, pocket bag depths and the bag's overlap above the mouth (from memory). */
const breastMouth = 90;
const lowerBagDepth = 130;
const breastBagDepth = 110;
const bagOverlap = 15;
/** How far the front points drop below the side seam's hem (from memory). */
const pointRise = 40;

export interface WaistcoatFigures {
	seam: number;
	quarterChest: number;
	quarterWaist: number;
	quarterHem: number;
	chestEase: number;
	waistEase: number;
	napeY: number;
	scyeY: number;
	waistY: number;
	hemY: number;
	pointY: number;
	neckWidth: number;
	shoulderPoint: number;
	waistWidth: number;
	hemWidth: number;
	openingDepth: number;
	lowerMouth: number;
	lowerPocket: [Point, Point];
	breastPocket: [Point, Point] | null;
	buttons: number[];
}

export interface WaistcoatNet {
	front: NetEdge[];
	facing: NetEdge[];
	frontLining: NetEdge[];
	back: NetEdge[];
	lowerWelt: NetEdge[];
	breastWelt: NetEdge[];
	lowerBag: NetEdge[];
	breastBag: NetEdge[];
	figures: WaistcoatFigures;
}

function intersect(p: Point, q: Point, a: Point, b: Point): Point {
	const d = pt(q.x - p.x, q.y - p.y);
	const e = pt(b.x - a.x, b.y - a.y);
	const cross = d.x * e.y - d.y * e.x;
	if (Math.abs(cross) < 1e-9) return q;
	const t = ((a.x - p.x) * e.y - (a.y - p.y) * e.x) / cross;
	return pt(p.x + d.x * t, p.y + d.y * t);
}

/**
 * The line `width` inside a clockwise run of edges (y down: inside is (−d.y, d.x) of travel), its corners
 * where neighbouring offset lines cross; the ends are left on the first and last offset lines.
 */
function insideLine(points: readonly Point[], width: number): Array<[Point, Point]> {
	const lines: Array<[Point, Point]> = [];
	for (let i = 1; i < points.length; i++) {
		const a = points[i - 1];
		const b = points[i];
		const length = distance(a, b);
		const n = pt((-(b.y - a.y) / length) * width, ((b.x - a.x) / length) * width);
		lines.push([pt(a.x + n.x, a.y + n.y), pt(b.x + n.x, b.y + n.y)]);
	}
	return lines;
}

function rectangle(width: number, height: number, allowance: number): NetEdge[] {
	return [
		{ id: 'top', points: [pt(0, 0), pt(width, 0)], allowance },
		{ id: 'right', points: [pt(width, 0), pt(width, height)], allowance },
		{ id: 'bottom', points: [pt(width, height), pt(0, height)], allowance },
		{ id: 'left', points: [pt(0, height), pt(0, 0)], allowance }
	];
}

/** The waistcoat on its seam lines, each edge with its allowance. */
export function waistcoatNet(body: BodyMm, options: ResolvedOptions): WaistcoatNet {
	const fit = fitOf(options);
	const ease = waistcoatEase[fit];
	const s = num(options, 'seamAllowance');
	const chest = need(body, 'bust_girth');
	const waist = need(body, 'waist_girth');
	const hip = need(body, 'hip_girth');
	const waistToHip = need(body, 'waist_to_hip');
	const belowWaist = num(options, 'belowWaist');
	// The girth at the hem, taken on the straight line from waist to hip (from memory; bodies vary).
	const hemGirth = waist + (hip - waist) * Math.min(1, belowWaist / waistToHip);
	const quarterChest = (chest + ease.chest) / 4;
	const quarterWaist = (waist + ease.waist) / 4;
	const quarterHem = (Math.max(hemGirth, waist) + ease.waist) / 4;
	const napeY = backNeckDepth;
	const scyeY = napeY + chest / 8 + 100 + armholeDrop + scyeExtra[fit];
	const waistY = napeY + need(body, 'nape_to_waist');
	const hemY = waistY + belowWaist;
	const pointY = hemY + num(options, 'pointDrop');
	const neckWidth = need(body, 'neck_girth') / 5 - 2;
	const shoulderPoint = Math.max(need(body, 'shoulder_width') / 2 - shoulderNarrowing, neckWidth + 60);
	const waistWidth = Math.max(quarterWaist, Math.max(quarterChest, quarterHem) - maxSideShaping);
	const hemWidth = Math.max(quarterHem, waistWidth);
	const openingDepth = Math.min(num(options, 'openingDepth'), waistY - 40);
	const shoulder = pt(shoulderPoint, shoulderDrop);
	const underarm = pt(quarterChest, scyeY);
	const armhole = (hollow: number) => [
		shoulder,
		...cubicCurve(
			shoulder,
			pt(shoulder.x - hollow, shoulder.y + (scyeY - shoulder.y) * 0.55),
			pt(shoulder.x - hollow, scyeY),
			underarm
		)
	];
	const side = [underarm, pt(waistWidth, waistY), pt(hemWidth, hemY)];

	const back: NetEdge[] = [
		{
			id: 'neck',
			points: [
				pt(0, backNeckDepth),
				...quadCurve(pt(0, backNeckDepth), pt(neckWidth * 0.6, backNeckDepth), pt(neckWidth, 0), 12)
			],
			allowance: s
		},
		{ id: 'shoulder', points: [pt(neckWidth, 0), shoulder], allowance: s },
		{ id: 'armhole', points: armhole(10), allowance: s },
		{ id: 'side', points: side, allowance: s },
		{ id: 'hem', points: [pt(hemWidth, hemY), pt(0, hemY)], allowance: s },
		{ id: 'centre_back', points: [pt(0, hemY), pt(0, backNeckDepth)], allowance: s }
	];

	const ext = waistcoatExtension;
	const breakPoint = pt(-ext, openingDepth);
	const cornerAbovePoint = pt(-ext, pointY - pointRise);
	const point = pt(20, pointY);
	const neckPoint = pt(neckWidth, 0);
	const sideHem = pt(hemWidth, hemY);
	const front: NetEdge[] = [
		{ id: 'shoulder', points: [neckPoint, shoulder], allowance: s },
		{ id: 'armhole', points: armhole(20), allowance: s },
		{ id: 'side', points: side, allowance: s },
		{ id: 'hem', points: [sideHem, point], allowance: s },
		{ id: 'front_point', points: [point, cornerAbovePoint], allowance: s },
		{ id: 'front_edge', points: [cornerAbovePoint, breakPoint], allowance: s },
		{ id: 'lapel_edge', points: [breakPoint, neckPoint], allowance: s }
	];

	// The facing: a band the facing width inside the front edges, from the hem to the shoulder.
	const edgeRun = [point, cornerAbovePoint, breakPoint, neckPoint];
	const inner = insideLine(edgeRun, waistcoatFacingWidth);
	const joins = inner.slice(1).map((line, i) => intersect(inner[i][0], inner[i][1], line[0], line[1]));
	const onHem = intersect(inner[0][1], inner[0][0], sideHem, point);
	const onShoulder = intersect(inner[inner.length - 1][0], inner[inner.length - 1][1], neckPoint, shoulder);
	const innerUp = [onHem, ...joins, onShoulder];
	const facing: NetEdge[] = [
		{ id: 'hem', points: [onHem, point], allowance: s },
		{ id: 'front_point', points: [point, cornerAbovePoint], allowance: s },
		{ id: 'front_edge', points: [cornerAbovePoint, breakPoint], allowance: s },
		{ id: 'lapel_edge', points: [breakPoint, neckPoint], allowance: s },
		{ id: 'shoulder', points: [neckPoint, onShoulder], allowance: s },
		{ id: 'lining_seam', points: [...innerUp].reverse(), allowance: s }
	];
	const frontLining: NetEdge[] = [
		{ id: 'shoulder', points: [onShoulder, shoulder], allowance: s },
		{ id: 'armhole', points: armhole(20), allowance: s },
		{ id: 'side', points: side, allowance: s },
		{ id: 'hem', points: [sideHem, onHem], allowance: s },
		{ id: 'facing_seam', points: innerUp, allowance: s }
	];

	// Lower welt pocket parallel to the hem, clear of the facing; breast pocket above the chest line.
	const along = (from: Point, length: number, rise: number): [Point, Point] => {
		const angle = Math.atan(rise);
		return [from, pt(from.x + length * Math.cos(angle), from.y - length * Math.sin(angle))];
	};
	const slope = (pointY - hemY) / (hemWidth - point.x);
	const lowerStart = pt(waistcoatFacingWidth + 10, waistY + 45);
	const lowerMouth = Math.min(num(options, 'pocketMouth'), (hemWidth - lowerStart.x - 20) * Math.cos(Math.atan(slope)));
	const lowerPocket = along(lowerStart, lowerMouth, slope);
	// The breast pocket sits below the dropped underarm line (about the chest line), clear of the armhole, rising 1 in 9.
	const breastEnd = quarterChest - 35;
	const breast = Math.min(breastMouth, breastEnd - waistcoatFacingWidth - 15);
	const breastPocket: [Point, Point] | null =
		options.breastPocket === true ? along(pt(breastEnd - breast, scyeY + 35), breast, 1 / 9) : null;

	const count = Number(options.buttons);
	const first = openingDepth + 15;
	const last = pointY - pointRise - 30;
	const buttons = Array.from({ length: count }, (_, i) => first + ((last - first) * i) / (count - 1));

	return {
		front,
		facing,
		frontLining,
		back,
		lowerWelt: rectangle(lowerMouth, 2 * weltDepth, s),
		breastWelt: rectangle(breast, 2 * weltDepth, s),
		lowerBag: rectangle(lowerMouth + 2 * bagOverlap, lowerBagDepth, s),
		breastBag: rectangle(breast + 2 * bagOverlap, breastBagDepth, s),
		figures: {
			seam: s,
			quarterChest,
			quarterWaist,
			quarterHem,
			chestEase: ease.chest,
			waistEase: ease.waist,
			napeY,
			scyeY,
			waistY,
			hemY,
			pointY,
			neckWidth,
			shoulderPoint,
			waistWidth,
			hemWidth,
			openingDepth,
			lowerMouth,
			lowerPocket,
			breastPocket,
			buttons
		}
	};
}

function weltMarks(mouth: [Point, Point], label: string): PieceMark[] {
	const [a, b] = mouth;
	const length = distance(a, b);
	const up = pt(((b.y - a.y) / length) * weltDepth, (-(b.x - a.x) / length) * weltDepth);
	return [
		{ kind: 'slit', label: `${label} mouth`, points: [a, b] },
		{
			kind: 'guide',
			label,
			points: [a, b, pt(b.x + up.x, b.y + up.y), pt(a.x + up.x, a.y + up.y), a]
		}
	];
}

function box(net: NetEdge[]): { width: number; height: number } {
	const pts = net.flatMap((e) => e.points);
	return {
		width: Math.max(...pts.map((p) => p.x)) - Math.min(...pts.map((p) => p.x)),
		height: Math.max(...pts.map((p) => p.y)) - Math.min(...pts.map((p) => p.y))
	};
}

function piece(
	id: string,
	label: string,
	edges: NetEdge[],
	cut: DraftPiece['cut'],
	lines: PieceLine[],
	marks: PieceMark[] = []
): DraftPiece {
	const pts = edges.flatMap((e) => e.points);
	const minY = Math.min(...pts.map((p) => p.y));
	const maxY = Math.max(...pts.map((p) => p.y));
	const midX = pts.reduce((sum, p) => sum + p.x, 0) / pts.length;
	return {
		id,
		label,
		cut,
		outline: cutOutline(edges),
		marks,
		lines,
		grainline: [pt(midX, minY + (maxY - minY) * 0.25), pt(midX, minY + (maxY - minY) * 0.75)]
	};
}

const pair = (lining = false): DraftPiece['cut'] => ({
	quantity: 2,
	onFold: false,
	pair: true,
	grain: 'lengthwise',
	...(lining ? { cloth: 'lining' as const } : {})
});

function waistcoatPieces(net: WaistcoatNet, backInLining: boolean): DraftPiece[] {
	const f = net.figures;
	const s = f.seam;
	const buttonMarks: PieceMark[] = f.buttons.map((y, i) => ({
		kind: 'guide',
		label: i === 0 ? 'buttonholes' : '',
		points: [pt(-4, y), pt(14, y)]
	}));
	const frontMarks: PieceMark[] = [
		{ kind: 'guide', label: 'waist line', points: [pt(-waistcoatExtension, f.waistY), pt(f.waistWidth + s, f.waistY)] },
		...weltMarks(f.lowerPocket, 'welt pocket'),
		...(f.breastPocket ? weltMarks(f.breastPocket, 'breast welt (left front only)') : []),
		...buttonMarks
	];
	const frontEdges =
		lengthOf(net.front, 'front_point') + lengthOf(net.front, 'front_edge') + lengthOf(net.front, 'lapel_edge');
	const lowerWelt = box(net.lowerWelt);
	const breastWelt = box(net.breastWelt);
	const lowerBag = box(net.lowerBag);
	const breastBag = box(net.breastBag);
	const pieces: DraftPiece[] = [
		piece(
			'front',
			'Front',
			net.front,
			pair(),
			[
				{
					id: 'chest_width',
					label: 'Width at the chest line from the centre front (with side seam)',
					mm: f.quarterChest + s,
					dimension: { from: pt(0, f.scyeY), to: pt(f.quarterChest + s, f.scyeY) }
				},
				{ id: 'waist_width', label: 'Width at the waist line (with side seam)', mm: f.waistWidth + s },
				{ id: 'finished_chest', label: 'Finished chest, all round', mm: 4 * f.quarterChest },
				{ id: 'finished_waist', label: 'Finished waist, all round', mm: 4 * f.waistWidth },
				{ id: 'chest_ease', label: 'Chest ease over the body, all round', mm: f.chestEase },
				{ id: 'opening_depth', label: 'V opening, neck-point line to the top button', mm: f.openingDepth },
				{ id: 'front_edges', label: 'Front edges, neck point to the front point (seam line)', mm: frontEdges },
				{ id: 'armhole_seam', label: 'Front armhole seam', mm: lengthOf(net.front, 'armhole') },
				{ id: 'button_spacing', label: 'Button spacing', mm: f.buttons[1] - f.buttons[0] },
				{
					id: 'piece_length',
					label: 'Piece length with seams',
					mm: f.pointY + 2 * s,
					dimension: { from: pt(-inch(1.4), -s), to: pt(-inch(1.4), f.pointY + s) }
				}
			],
			frontMarks
		),
		piece('front_facing', 'Front facing', net.facing, pair(), [
			{ id: 'facing_width', label: 'Facing width', mm: waistcoatFacingWidth },
			{
				id: 'front_edges',
				label: 'Front edges, neck point to the front point (seam line)',
				mm:
					lengthOf(net.facing, 'front_point') + lengthOf(net.facing, 'front_edge') + lengthOf(net.facing, 'lapel_edge')
			}
		]),
		piece('front_lining', 'Front lining', net.frontLining, pair(true), [
			{ id: 'facing_seam', label: 'Seam to the facing', mm: lengthOf(net.frontLining, 'facing_seam') }
		]),
		piece(
			'back',
			'Back',
			net.back,
			pair(backInLining),
			[
				{
					id: 'chest_width',
					label: 'Width at the chest line from the centre back (with seams)',
					mm: f.quarterChest + 2 * s,
					dimension: { from: pt(-s, f.scyeY), to: pt(f.quarterChest + s, f.scyeY) }
				},
				{ id: 'armhole_depth', label: 'Armhole depth (scye depth, from the nape)', mm: f.scyeY - f.napeY },
				{ id: 'nape_to_waist', label: 'Nape to waist line', mm: f.waistY - f.napeY },
				{ id: 'below_waist', label: 'Back length below the waist', mm: f.hemY - f.waistY },
				{ id: 'armhole_seam', label: 'Back armhole seam', mm: lengthOf(net.back, 'armhole') }
			],
			[{ kind: 'guide', label: 'waist line', points: [pt(-s, f.waistY), pt(f.waistWidth + s, f.waistY)] }]
		),
		piece('back_lining', 'Back lining', net.back, pair(true), [
			{ id: 'centre_back', label: 'Centre back seam', mm: lengthOf(net.back, 'centre_back') }
		]),
		piece(
			'welt',
			'Lower welt',
			net.lowerWelt,
			{ quantity: 2, onFold: false, pair: true, grain: 'lengthwise' },
			[
				{ id: 'welt_length', label: 'Welt length, finished (the pocket mouth)', mm: lowerWelt.width },
				{ id: 'welt_depth', label: 'Welt depth, finished (cut double and folded)', mm: lowerWelt.height / 2 }
			],
			[{ kind: 'fold', label: 'fold', points: [pt(0, weltDepth), pt(lowerWelt.width, weltDepth)] }]
		),
		piece(
			'pocket_bag',
			'Lower pocket bag',
			net.lowerBag,
			{ quantity: 4, onFold: false, pair: true, grain: 'lengthwise', cloth: 'lining' },
			[
				{ id: 'bag_width', label: 'Bag width', mm: lowerBag.width },
				{ id: 'bag_depth', label: 'Bag depth', mm: lowerBag.height }
			]
		)
	];
	if (f.breastPocket) {
		pieces.push(
			piece(
				'breast_welt',
				'Breast welt',
				net.breastWelt,
				{ quantity: 1, onFold: false, pair: false, grain: 'lengthwise' },
				[
					{ id: 'welt_length', label: 'Welt length, finished (the pocket mouth)', mm: breastWelt.width },
					{ id: 'welt_depth', label: 'Welt depth, finished (cut double and folded)', mm: breastWelt.height / 2 }
				],
				[{ kind: 'fold', label: 'fold', points: [pt(0, weltDepth), pt(breastWelt.width, weltDepth)] }]
			),
			piece(
				'breast_bag',
				'Breast pocket bag',
				net.breastBag,
				{ quantity: 2, onFold: false, pair: true, grain: 'lengthwise', cloth: 'lining' },
				[
					{ id: 'bag_width', label: 'Bag width', mm: breastBag.width },
					{ id: 'bag_depth', label: 'Bag depth', mm: breastBag.height }
				]
			)
		);
	}
	return pieces;
}

function waistcoatWarnings(net: WaistcoatNet): Finding[] {
	const f = net.figures;
	const warnings: Finding[] = [];
	if (f.lowerMouth < 90) {
		warnings.push({
			code: 'unusual_relation',
			fields: ['bust_girth', 'options.pocketMouth'],
			message:
				'The fronts are narrow for a lower welt pocket: the pocket mouth has been shortened to fit. Check it takes a hand.'
		});
	}
	return warnings;
}

export const waistcoat: GarmentTemplate = {
	id: 'waistcoat',
	name: 'Lined waistcoat',
	summary: 'Single-breasted, V front with points, welt pockets; fronts faced, fully lined, back in lining.',
	category: 'top',
	requiredMeasurements: [
		'bust_girth',
		'waist_girth',
		'hip_girth',
		'neck_girth',
		'shoulder_width',
		'nape_to_waist',
		'waist_to_hip'
	],
	optionalMeasurements: [],
	options: [
		fitOption,
		lengthOption('belowWaist', 'Back length below the waist', 60, [0, 200]),
		lengthOption('pointDrop', 'Front points below the back hem', 70, [0, 150]),
		lengthOption('openingDepth', 'V opening, neck-point line to the top button', 260, [150, 420]),
		{
			id: 'buttons',
			label: 'Buttons',
			kind: 'choice',
			choices: ['4', '5', '6'].map((value) => ({ value, label: value })),
			default: '5'
		},
		lengthOption('pocketMouth', 'Lower pocket mouth', 120, [90, 160]),
		{ id: 'breastPocket', label: 'Breast welt pocket', kind: 'boolean', default: true },
		{
			id: 'backInLining',
			label: 'Back cut in lining',
			kind: 'boolean',
			default: true,
			help: 'Usual under a jacket; turn off to cut the back in the cloth.'
		},
		lengthOption('seamAllowance', 'Seam allowance', 10, [5, 25])
	],
	defaultLabourHours: 10,
	method:
		'Waistcoat block after Aldrich, Metric Pattern Cutting for Menswear (5th ed., waistcoats chapter, on the chapter 1 body block); scye depth and waist line squared down from the nape; bagged out and lined; chest ease from McCunn and CWU “Ease in Clothing” with room for the shirt beneath.',
	draft(body, options) {
		const net = waistcoatNet(body, options);
		const f = net.figures;
		const backInLining = options.backInLining !== false;
		return {
			pieces: waistcoatPieces(net, backInLining),
			allowances: [
				{ id: 'seam', label: 'Seam allowance, every edge (bagged out)', mm: f.seam },
				{ id: 'chest_ease', label: 'Chest ease (total)', mm: f.chestEase },
				{ id: 'waist_ease', label: 'Waist ease (total)', mm: f.waistEase },
				{ id: 'welt_depth', label: 'Welt depth', mm: weltDepth }
			],
			notes: [
				'Cut the fronts, front facings and welts in the cloth; the front and back linings, the pocket bags and ' +
					(backInLining ? 'the back' : 'no back (the back is in the cloth)') +
					' in lining.',
				'Interface the fronts and the welts. Make the welt pockets where marked before joining the facing.',
				'Sew each front facing to its front lining, then bag the waistcoat out: front edges, hem, neck and armholes, and turn through the side seams.',
				`${f.buttons.length} buttons; buttonholes on the left front for a man’s waistcoat, on the right for a woman’s.`
			],
			cautions: isChildBody(body) ? [childButtonCaution] : [],
			warnings: waistcoatWarnings(net)
		};
	}
};
