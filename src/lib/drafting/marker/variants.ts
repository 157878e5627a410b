import { boundingBox, mirrorX, type Point } from '../geometry';
import type { Rotation } from '../layout';
import { bounds, clipLeftOf, nestingShapes, unitsPerMm, type Path64 } from './polygons';

export type Turn = 0 | 90 | 180 | 270;

/** One piece to lay, `quantity` times, in the cloth's frame: x across, y along the lengthwise grain. */
export interface MarkerItem {
	id: string;
	label: string;
	/** The cutting line as laid (a cut-on-fold piece already opened out when the cloth is open). */
	outline: Point[];
	grainline: [Point, Point];
	quantity: number;
	/** 'none': one way only (nap or one-way print); '180': may be turned end for end; 'any': grain free. */
	rotation: Rotation;
	/** The edge at the outline's least x goes on the fold of folded cloth. */
	onFold: boolean;
	/** Every second copy is the mirror image (left and right of a pair on open cloth). */
	mirrorPairs: boolean;
	/**
	 * Either mirror image will do for any copy: a pair cut through both layers of folded cloth gives a left and
	 * a right whichever way up the pattern lies.
	 */
	eitherHand?: boolean;
	/** The piece may also be cut across the cloth (a band): a quarter turn is allowed besides the grain rule. */
	crosswise?: boolean;
}

/** One way to lay a copy: the turned/mirrored outline and the grown shape that keeps the cutting gap. */
export interface Variant {
	turn: Turn;
	mirrored: boolean;
	outline: Point[];
	grainline: [Point, Point];
	/** Integer shape with its bounding box's top-left corner at the origin. */
	shape: Path64;
	/** The shape with the cutting gap round its curves, in the same frame (see polygons.ts `nestingShapes`). */
	clear: Path64;
	width: number;
	height: number;
	/** Add to the outline (mm) to bring it into the shape's frame. */
	shift: Point;
	/** How far below the shape's top the cutting line's top lies, in shape units. */
	topInset: number;
}

function turnPoints(points: readonly Point[], turn: Turn): Point[] {
	switch (turn) {
		case 0:
			return points.map((p) => ({ ...p }));
		case 90:
			return points.map((p) => ({ x: -p.y, y: p.x }));
		case 180:
			return points.map((p) => ({ x: -p.x, y: -p.y }));
		case 270:
			return points.map((p) => ({ x: p.y, y: -p.x }));
	}
}

function turnsFor(item: MarkerItem): Turn[] {
	// A piece on the fold keeps its fold edge on the fold, so it never takes a quarter turn.
	if (item.onFold) return item.rotation === 'none' ? [0] : [0, 180];
	// A band that may be cut across: with a nap one quarter turn (every crosswise copy the same way), else both.
	if (item.rotation === 'none') return item.crosswise ? [0, 90] : [0];
	if (item.rotation === '180' && !item.crosswise) return [0, 180];
	return [0, 90, 180, 270];
}

function makeVariant(item: MarkerItem, turn: Turn, mirrored: boolean, toleranceMm: number, gapMm: number): Variant {
	// End for end on the fold means flipping about the grain so the fold edge stays on the left.
	const flipOnFold = item.onFold && turn === 180;
	const base = mirrored !== flipOnFold ? mirrorX(item.outline) : item.outline;
	const outline = turnPoints(base, turn);
	const grainBase = mirrored !== flipOnFold ? mirrorX(item.grainline) : item.grainline;
	let grain = turnPoints(grainBase, turn) as [Point, Point];
	const laid = boundingBox(outline);
	if (turn === 90 || turn === 270) {
		// Cut across: the arrow still shows the cloth's lengthwise grain, through the middle of the piece.
		const x = laid.x + laid.width / 2;
		grain = [
			{ x, y: laid.y + laid.height * 0.2 },
			{ x, y: laid.y + laid.height * 0.8 }
		];
	}
	let { shape, clear } = nestingShapes(outline, toleranceMm, gapMm);
	if (item.onFold) {
		const fold = Math.round(laid.x * unitsPerMm);
		shape = clipLeftOf(shape, fold);
		clear = clipLeftOf(clear, fold);
	}
	const box = bounds(shape);
	const frame = (path: Path64) => path.map((p) => ({ x: p.x - box.left, y: p.y - box.top }));
	return {
		turn,
		mirrored,
		outline,
		grainline: grain,
		shape: frame(shape),
		clear: frame(clear),
		width: box.right - box.left,
		height: box.bottom - box.top,
		shift: { x: -box.left / unitsPerMm, y: -box.top / unitsPerMm },
		topInset: Math.round(laid.y * unitsPerMm) - box.top
	};
}

/**
 * The allowed variants for each copy of an item: index 0 for plain copies, 1 for mirrored ones. An item whose
 * copies may take either hand gets every variant in both.
 */
export function variantsFor(item: MarkerItem, toleranceMm: number, gapMm: number): [Variant[], Variant[]] {
	const turns = turnsFor(item);
	const plain = turns.map((t) => makeVariant(item, t, false, toleranceMm, gapMm));
	const hands = item.mirrorPairs || item.eitherHand;
	const mirrored = hands ? turns.map((t) => makeVariant(item, t, true, toleranceMm, gapMm)) : plain;
	if (item.eitherHand) return [[...plain, ...mirrored], [...plain, ...mirrored]];
	return [plain, mirrored];
}
