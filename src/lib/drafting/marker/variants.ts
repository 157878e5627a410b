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
	/** The item's shapes as drafted, and the map and shift that give this variant's: shape = linear·base + offset. */
	base: BaseShapes;
	linear: Linear;
	offset: { x: number; y: number };
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

/** A linear map of the plane, p ↦ (a·x + b·y, c·x + d·y): the quarter turns and mirrors. */
export type Linear = readonly [number, number, number, number];

const turnMaps: Record<Turn, Linear> = { 0: [1, 0, 0, 1], 90: [0, -1, 1, 0], 180: [-1, 0, 0, -1], 270: [0, 1, -1, 0] };
const mirrorMap: Linear = [-1, 0, 0, 1];

export function compose(m: Linear, n: Linear): Linear {
	return [m[0] * n[0] + m[1] * n[2], m[0] * n[1] + m[1] * n[3], m[2] * n[0] + m[3] * n[2], m[2] * n[1] + m[3] * n[3]];
}

/** The inverse of a turn or mirror is its transpose. */
export const invert = (m: Linear): Linear => [m[0], m[2], m[1], m[3]];

/** The path under the map, kept counter-clockwise (a mirror reverses the sense of travel). */
export function applyLinear(m: Linear, path: Path64, dx = 0, dy = 0): Path64 {
	const mapped = path.map((p) => ({ x: m[0] * p.x + m[1] * p.y + dx, y: m[2] * p.x + m[3] * p.y + dy }));
	return m[0] * m[3] - m[1] * m[2] < 0 ? mapped.reverse() : mapped;
}

/** An item's nesting shapes as drafted (turn 0, not mirrored); every variant is a turn or mirror of them. */
export interface BaseShapes {
	shape: Path64;
	clear: Path64;
}

function baseShapes(item: MarkerItem, toleranceMm: number, gapMm: number): BaseShapes {
	let { shape, clear } = nestingShapes(item.outline, toleranceMm, gapMm);
	if (item.onFold) {
		const fold = Math.round(boundingBox(item.outline).x * unitsPerMm);
		shape = clipLeftOf(shape, fold);
		clear = clipLeftOf(clear, fold);
	}
	return { shape, clear: clear === shape ? shape : clear };
}

function makeVariant(item: MarkerItem, base: BaseShapes, turn: Turn, mirrored: boolean): Variant {
	// End for end on the fold means flipping about the grain so the fold edge stays on the left.
	const flipOnFold = item.onFold && turn === 180;
	const flip = mirrored !== flipOnFold;
	const outline = turnPoints(flip ? mirrorX(item.outline) : item.outline, turn);
	let grain = turnPoints(flip ? mirrorX(item.grainline) : item.grainline, turn) as [Point, Point];
	const laid = boundingBox(outline);
	if (turn === 90 || turn === 270) {
		// Cut across: the arrow still shows the cloth's lengthwise grain, through the middle of the piece.
		const x = laid.x + laid.width / 2;
		grain = [
			{ x, y: laid.y + laid.height * 0.2 },
			{ x, y: laid.y + laid.height * 0.8 }
		];
	}
	const linear = flip ? compose(turnMaps[turn], mirrorMap) : turnMaps[turn];
	return { turn, mirrored, outline, grainline: grain, ...shapesUnder(base, linear, outline) };
}

/**
 * The item's shapes under the map, moved so their bounding box's top-left corner is at the origin, and how the
 * mapped outline (mm) sits in that frame.
 */
function shapesUnder(base: BaseShapes, linear: Linear, outline: readonly Point[]) {
	const box = bounds(applyLinear(linear, base.shape));
	const offset = { x: -box.left, y: -box.top };
	const shape = applyLinear(linear, base.shape, offset.x, offset.y);
	return {
		shape,
		clear: base.clear === base.shape ? shape : applyLinear(linear, base.clear, offset.x, offset.y),
		base,
		linear,
		offset,
		width: box.right - box.left,
		height: box.bottom - box.top,
		shift: { x: -box.left / unitsPerMm, y: -box.top / unitsPerMm },
		topInset: Math.round(boundingBox(outline).y * unitsPerMm) - box.top
	};
}

/**
 * The allowed variants for each copy of an item: index 0 for plain copies, 1 for mirrored ones. An item whose
 * copies may take either hand gets every variant in both.
 */
export function variantsFor(item: MarkerItem, toleranceMm: number, gapMm: number): [Variant[], Variant[]] {
	const turns = turnsFor(item);
	const base = baseShapes(item, toleranceMm, gapMm);
	const plain = turns.map((t) => makeVariant(item, base, t, false));
	const hands = item.mirrorPairs || item.eitherHand;
	const mirrored = hands ? turns.map((t) => makeVariant(item, base, t, true)) : plain;
	if (item.eitherHand)
		return [
			[...plain, ...mirrored],
			[...plain, ...mirrored]
		];
	return [plain, mirrored];
}

const alongMap: Linear = [1, 0, 0, -1];

/**
 * The variant reflected end to end (y ↦ −y), for laying a marker from the far end: a layout of reflected
 * variants, reflected back as a whole, is a layout of the variants themselves.
 */
export function reflectAlong(v: Variant): Variant {
	const outline = v.outline.map((p) => ({ x: p.x, y: -p.y }));
	return {
		...v,
		outline,
		grainline: v.grainline.map((p) => ({ x: p.x, y: -p.y })) as [Point, Point],
		...shapesUnder(v.base, compose(alongMap, v.linear), outline)
	};
}
