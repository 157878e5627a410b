import { boundingBox, mirrorX, type Point } from '../geometry';
import type { Rotation } from '../layout';
import { bounds, clipLeftOf, nestingShape, unitsPerMm, type Path64 } from './polygons';

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
}

/** One way to lay a copy: the turned/mirrored outline and the grown shape that keeps the cutting gap. */
export interface Variant {
	turn: Turn;
	mirrored: boolean;
	outline: Point[];
	grainline: [Point, Point];
	/** Integer shape with its bounding box's top-left corner at the origin. */
	shape: Path64;
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
	if (item.rotation === 'none') return [0];
	// A piece on the fold keeps its fold edge on the fold, so it never takes a quarter turn.
	if (item.rotation === '180' || item.onFold) return [0, 180];
	return [0, 90, 180, 270];
}

function makeVariant(item: MarkerItem, turn: Turn, mirrored: boolean, toleranceMm: number, growMm: number): Variant {
	// End for end on the fold means flipping about the grain so the fold edge stays on the left.
	const flipOnFold = item.onFold && turn === 180;
	const base = mirrored !== flipOnFold ? mirrorX(item.outline) : item.outline;
	const outline = turnPoints(base, turn);
	const grainBase = mirrored !== flipOnFold ? mirrorX(item.grainline) : item.grainline;
	const grain = turnPoints(grainBase, turn) as [Point, Point];
	let shape = nestingShape(outline, toleranceMm, growMm);
	if (item.onFold) shape = clipLeftOf(shape, Math.round(boundingBox(outline).x * unitsPerMm));
	const box = bounds(shape);
	return {
		turn,
		mirrored,
		outline,
		grainline: grain,
		shape: shape.map((p) => ({ x: p.x - box.left, y: p.y - box.top })),
		width: box.right - box.left,
		height: box.bottom - box.top,
		shift: { x: -box.left / unitsPerMm, y: -box.top / unitsPerMm },
		topInset: Math.round(boundingBox(outline).y * unitsPerMm) - box.top
	};
}

/** The allowed variants for each copy of an item: index 0 for plain copies, 1 for mirrored ones. */
export function variantsFor(item: MarkerItem, toleranceMm: number, growMm: number): [Variant[], Variant[]] {
	const turns = turnsFor(item);
	const plain = turns.map((t) => makeVariant(item, t, false, toleranceMm, growMm));
	const mirrored = item.mirrorPairs ? turns.map((t) => makeVariant(item, t, true, toleranceMm, growMm)) : plain;
	return [plain, mirrored];
}
