/**
 * A lower bound on the length of any marker of some items: the shortest length two of the pieces need on
 * their own. For two pieces this is exact: every place one piece may take beside the other (under the grain
 * rules, inside the width) is read off the no-fit polygon, so two pieces that cannot share a stretch of the
 * cloth side by side, nor interlock, bound the marker by the sum of their lengths.
 * Computed on the cutting lines themselves (no flattening, no cutting gap) and erring only on the side of a
 * shorter bound, so no marker, by any method, is shorter than it.
 */
import { Clipper, EndType, FillRule, JoinType, type Path64, type Paths64 } from '@countertype/clipper2-ts';
import { polygonArea } from '../geometry';
import { difference, toPath, unitsPerMm } from './polygons';
import { variantsFor, type MarkerItem } from './variants';

interface Laid {
	path: Path64;
	width: number;
	height: number;
	onFold: boolean;
}

/** Each way an item may lie (every turn the grain allows, either hand), its cutting line at the origin. */
function waysToLay(item: MarkerItem): Laid[] {
	const [plain, mirrored] = variantsFor(item, 0, 0);
	return [...new Set([...plain, ...mirrored])].map((v) => {
		const path = toPath(v.outline);
		const box = Clipper.getBounds(path);
		return {
			path: Clipper.translatePath(path, -box.left, -box.top),
			width: box.right - box.left,
			height: box.bottom - box.top,
			onFold: item.onFold
		};
	});
}

/**
 * fixed ⊕ (−moving), exactly: the sum of the two outlines' edges, and one copy of each polygon whole (the sum of
 * two polygons is the sum of their boundaries with either one's inside).
 */
function minkowski(fixed: Path64, moving: Path64): Paths64 {
	const reflected = moving.map((p) => ({ x: -p.x, y: -p.y }));
	const sweep = Clipper.minkowskiSum(reflected, fixed, true);
	return Clipper.union(
		[
			...sweep,
			Clipper.translatePath(fixed, reflected[0].x, reflected[0].y),
			Clipper.translatePath(reflected, fixed[0].x, fixed[0].y)
		],
		FillRule.NonZero
	);
}

/** The shortest stretch of cloth `width` wide (shape units) on which both pieces lie without overlapping. */
function twoPieceLength(a: Laid, b: Laid, width: number): number {
	const xRange = (p: Laid) => (p.onFold ? [0, 0] : [0, width - p.width]);
	const [aMin, aMax] = xRange(a);
	const [bMin, bMax] = xRange(b);
	if (aMax < aMin || bMax < bMin) return Infinity;
	const stacked = a.height + b.height;
	// Where b's corner may stand relative to a's: inside the width, from just above a to just below it.
	// One unit of slack on every side keeps a fit with nothing to spare (a line of places) from vanishing.
	const room: Path64 = [
		{ x: bMin - aMax - 1, y: -b.height },
		{ x: bMax - aMin + 1, y: -b.height },
		{ x: bMax - aMin + 1, y: a.height },
		{ x: bMin - aMax - 1, y: a.height }
	];
	const overlapping = Clipper.inflatePaths(minkowski(a.path, b.path), -1, JoinType.Miter, EndType.Polygon, 2);
	const free = difference([room], overlapping);
	// With b's top dy below a's, the two reach from min(0, dy) to max(a.height, dy + b.height).
	const spanAt = (dy: number) => Math.max(a.height, dy + b.height) - Math.min(0, dy);
	const [lo, hi] = [Math.min(0, a.height - b.height), Math.max(0, a.height - b.height)];
	let best = stacked;
	for (const region of free) {
		const box = Clipper.getBounds(region);
		const dy = box.bottom < lo ? box.bottom : box.top > hi ? box.top : Math.max(lo, box.top);
		best = Math.min(best, spanAt(dy));
	}
	return best;
}

export interface PairBound {
	/** mm: no marker of the items is shorter. */
	length: number;
	/** The two pieces that set it. */
	pieces: [string, string];
}

/**
 * The longest of the two-piece lengths over every pair of copies. Bands that may also be cut across or in two
 * are left out (their other forms are not all items here); leaving pieces out only lowers the bound.
 */
export function pairBound(items: readonly MarkerItem[], widthMm: number): PairBound | null {
	const width = Math.round(widthMm * unitsPerMm);
	const kept = items.filter((item) => !item.crosswise && polygonArea(item.outline) > 0);
	const ways = kept.map(waysToLay);
	let bound: PairBound | null = null;
	for (let i = 0; i < kept.length; i++) {
		for (let j = i; j < kept.length; j++) {
			if (i === j && kept[i].quantity < 2) continue;
			let shortest = Infinity;
			for (const a of ways[i]) for (const b of ways[j]) shortest = Math.min(shortest, twoPieceLength(a, b, width));
			const length = shortest / unitsPerMm;
			if (Number.isFinite(length) && (!bound || length > bound.length))
				bound = { length, pieces: [kept[i].label, kept[j].label] };
		}
	}
	return bound;
}
