import type { Point } from './geometry';

/**
 * Laying two copies of a piece side by side, the second turned end for end (180°), lets a piece that is
 * narrower at one end nest into the other ("head to tail", as cutting layouts without nap do; common
 * practice). Outlines are given inside their box: x from 0 to w, y from 0 to h.
 */

/** Leftmost and rightmost x of a simple polygon on the horizontal line at y. */
function extentAt(polygon: readonly Point[], y: number): { left: number; right: number } | null {
	let left = Infinity;
	let right = -Infinity;
	polygon.forEach((a, i) => {
		const b = polygon[(i + 1) % polygon.length];
		if ((a.y - y) * (b.y - y) > 0) return;
		if (a.y === b.y) {
			left = Math.min(left, a.x, b.x);
			right = Math.max(right, a.x, b.x);
			return;
		}
		const x = a.x + ((y - a.y) * (b.x - a.x)) / (b.y - a.y);
		left = Math.min(left, x);
		right = Math.max(right, x);
	});
	return left <= right ? { left, right } : null;
}

/**
 * How far right of the first copy the second must start so the two do not overlap, the second turned
 * 180° (`mirrored`: also flipped over, as the other half of a pair is cut). Between the outlines' corners
 * each edge is a straight line, so the closest approach is at a corner height of one copy or the other.
 */
export function headToTailOffset(shape: readonly Point[], w: number, h: number, mirrored: boolean): number {
	const second = shape.map((p) => (mirrored ? { x: p.x, y: h - p.y } : { x: w - p.x, y: h - p.y }));
	const heights = [...new Set([...shape.map((p) => p.y), ...second.map((p) => p.y)])];
	let offset = 0;
	for (const y of heights) {
		const a = extentAt(shape, y);
		const b = extentAt(second, y);
		if (a && b) offset = Math.max(offset, a.right - b.left);
	}
	return offset;
}

/** The second copy as laid: turned 180° (and flipped over for a pair), `offset` to the right. */
export function secondCopy(shape: readonly Point[], w: number, h: number, mirrored: boolean, offset: number): Point[] {
	return shape.map((p) => (mirrored ? { x: p.x + offset, y: h - p.y } : { x: w - p.x + offset, y: h - p.y }));
}
