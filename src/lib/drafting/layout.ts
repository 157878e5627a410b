/**
 * Two-dimensional strip packing: rectangles into a strip of fixed width and least length.
 * FFDH (First-Fit Decreasing Height; Coffman, Garey, Johnson & Tarjan, SIAM J. Comput. 9(4), 1980)
 * guarantees FFDH ≤ 1.7·OPT + h_max. packStrip also runs a skyline bottom-left packer over a few orderings
 * and keeps the shortest result, so it is never longer than FFDH and keeps FFDH's bound.
 */

export type Rotation = 'none' | '180' | 'any';
export type Algorithm = 'nfdh' | 'ffdh' | 'skyline';

export interface RectItem {
	w: number;
	h: number;
	quantity?: number;
	/** Quarter turns only with 'any'; a 180° turn leaves a rectangle's footprint unchanged. */
	rotate?: Rotation;
	/** Must touch the left edge of the strip (a piece cut on the fold). */
	anchorLeft?: boolean;
	/** Cloth actually used by one copy, when less than w × h (a piece's outline inside its box). */
	area?: number;
}

export interface Placement {
	item: number;
	copy: number;
	x: number;
	y: number;
	w: number;
	h: number;
	rotated: boolean;
}

export interface PackOptions {
	/** Every piece starts on a multiple of this (pattern repeat), 0 for none. */
	yStep?: number;
}

export interface PackResult {
	width: number;
	length: number;
	placements: Placement[];
	/** Σ item area ÷ (width × length). */
	efficiency: number;
	/** max(A/W, h_max): no packing can be shorter. */
	lowerBound: number;
	algorithm: Algorithm;
}

interface Unit {
	item: number;
	copy: number;
	w: number;
	h: number;
	canTurn: boolean;
	anchorLeft: boolean;
	area: number;
}

function expand(items: readonly RectItem[], width: number): Unit[] {
	const units: Unit[] = [];
	items.forEach((it, item) => {
		const canTurn = it.rotate === 'any' && it.h <= width;
		if (it.w > width + 1e-9 && !canTurn) {
			throw new RangeError(`Item ${item} (${it.w} wide) does not fit a strip ${width} wide`);
		}
		for (let copy = 0; copy < (it.quantity ?? 1); copy++) {
			units.push({
				item,
				copy,
				w: it.w,
				h: it.h,
				canTurn,
				anchorLeft: it.anchorLeft ?? false,
				area: it.area ?? it.w * it.h
			});
		}
	});
	return units;
}

/** Lay the longer side across when the item may turn and still fits: lower shelves (common FFDH variant). */
function shelfOrientation(u: Unit, width: number): { w: number; h: number; rotated: boolean } {
	const turned = { w: u.h, h: u.w, rotated: true };
	if (!u.canTurn) return { w: u.w, h: u.h, rotated: false };
	if (u.w > width) return turned;
	return u.h > u.w && u.h <= width ? turned : { w: u.w, h: u.h, rotated: false };
}

const stepUp = (y: number, step: number) => (step > 0 ? Math.max(0, Math.ceil(y / step - 1e-9) * step) : y);

function finish(units: Unit[], placements: Placement[], width: number, algorithm: Algorithm): PackResult {
	const length = placements.reduce((max, p) => Math.max(max, p.y + p.h), 0);
	const area = units.reduce((sum, u) => sum + u.area, 0);
	return {
		width,
		length,
		placements,
		efficiency: length > 0 ? area / (width * length) : 0,
		lowerBound: lowerBound(units, width),
		algorithm
	};
}

function lowerBound(units: Unit[], width: number): number {
	const area = units.reduce((sum, u) => sum + u.w * u.h, 0);
	const tallest = units.reduce((max, u) => Math.max(max, u.canTurn ? Math.min(u.w, u.h) : u.h), 0);
	return Math.max(area / width, tallest);
}

function shelfPack(items: readonly RectItem[], width: number, options: PackOptions, firstFit: boolean): PackResult {
	const units = expand(items, width);
	const oriented = units.map((u) => ({ u, ...shelfOrientation(u, width) }));
	oriented.sort((a, b) => b.h - a.h);
	const shelves: Array<{ y: number; height: number; used: number }> = [];
	const placements: Placement[] = [];
	for (const { u, w, h, rotated } of oriented) {
		const candidates = u.anchorLeft ? [] : firstFit ? shelves : shelves.slice(-1);
		let shelf = candidates.find((s) => s.used + w <= width + 1e-9);
		if (!shelf) {
			const top = shelves.reduce((max, s) => Math.max(max, s.y + s.height), 0);
			shelf = { y: stepUp(top, options.yStep ?? 0), height: h, used: 0 };
			shelves.push(shelf);
		}
		placements.push({ item: u.item, copy: u.copy, x: shelf.used, y: shelf.y, w, h, rotated });
		shelf.used += w;
	}
	return finish(units, placements, width, firstFit ? 'ffdh' : 'nfdh');
}

/** Next-Fit Decreasing Height: NFDH < 2·A/W + h_max. */
export function packNfdh(items: readonly RectItem[], width: number, options: PackOptions = {}): PackResult {
	return shelfPack(items, width, options, false);
}

/** First-Fit Decreasing Height: FFDH ≤ 1.7·OPT + h_max. */
export function packFfdh(items: readonly RectItem[], width: number, options: PackOptions = {}): PackResult {
	return shelfPack(items, width, options, true);
}

type Segment = { x: number; y: number; w: number };
type Order = (a: Unit, b: Unit) => number;

const orders: Order[] = [
	(a, b) => Number(b.anchorLeft) - Number(a.anchorLeft) || b.h - a.h,
	(a, b) => b.h - a.h,
	(a, b) => b.w - a.w,
	(a, b) => b.w * b.h - a.w * a.h
];

/** Skyline bottom-left: each piece goes where its top ends lowest, then leftmost. */
export function packSkyline(
	items: readonly RectItem[],
	width: number,
	options: PackOptions = {},
	order: Order = orders[0]
): PackResult {
	const units = expand(items, width);
	const sorted = [...units].sort(order);
	let skyline: Segment[] = [{ x: 0, y: 0, w: width }];
	const placements: Placement[] = [];
	for (const u of sorted) {
		const shapes = u.canTurn
			? [
					{ w: u.w, h: u.h, rotated: false },
					{ w: u.h, h: u.w, rotated: true }
				]
			: [{ w: u.w, h: u.h, rotated: false }];
		let best: Placement | null = null;
		for (const shape of shapes) {
			if (shape.w > width + 1e-9) continue;
			for (const x of candidateXs(skyline, shape.w, width, u.anchorLeft)) {
				const y = stepUp(restingHeight(skyline, x, shape.w), options.yStep ?? 0);
				if (
					!best ||
					y + shape.h < best.y + best.h - 1e-9 ||
					(Math.abs(y + shape.h - best.y - best.h) <= 1e-9 && x < best.x)
				) {
					best = { item: u.item, copy: u.copy, x, y, w: shape.w, h: shape.h, rotated: shape.rotated };
				}
			}
		}
		if (!best) throw new RangeError(`Item ${u.item} does not fit a strip ${width} wide`);
		placements.push(best);
		skyline = raise(skyline, best.x, best.w, best.y + best.h);
	}
	return finish(units, placements, width, 'skyline');
}

function candidateXs(skyline: Segment[], w: number, width: number, anchorLeft: boolean): number[] {
	if (anchorLeft) return [0];
	const xs = new Set<number>();
	for (const s of skyline) {
		if (s.x + w <= width + 1e-9) xs.add(s.x);
		const rightAligned = s.x + s.w - w;
		if (rightAligned >= -1e-9) xs.add(Math.max(0, rightAligned));
	}
	return [...xs];
}

function restingHeight(skyline: Segment[], x: number, w: number): number {
	let y = 0;
	for (const s of skyline) {
		if (s.x < x + w - 1e-9 && s.x + s.w > x + 1e-9) y = Math.max(y, s.y);
	}
	return y;
}

function raise(skyline: Segment[], x: number, w: number, top: number): Segment[] {
	const next: Segment[] = [];
	for (const s of skyline) {
		const end = s.x + s.w;
		if (end <= x + 1e-9 || s.x >= x + w - 1e-9) {
			next.push(s);
			continue;
		}
		if (s.x < x) next.push({ x: s.x, y: s.y, w: x - s.x });
		if (end > x + w) next.push({ x: x + w, y: s.y, w: end - (x + w) });
	}
	next.push({ x, y: top, w });
	next.sort((a, b) => a.x - b.x);
	return next.reduce<Segment[]>((merged, s) => {
		const last = merged[merged.length - 1];
		if (last && Math.abs(last.y - s.y) < 1e-9) last.w += s.w;
		else merged.push({ ...s });
		return merged;
	}, []);
}

/** The shortest of FFDH and skyline packings over several orderings. */
export function packStrip(items: readonly RectItem[], width: number, options: PackOptions = {}): PackResult {
	let best = packFfdh(items, width, options);
	for (const order of orders) {
		const candidate = packSkyline(items, width, options, order);
		if (candidate.length < best.length - 1e-9) best = candidate;
	}
	return best;
}
