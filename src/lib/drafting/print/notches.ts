import { distance, type Point } from '../geometry';
import type { DraftPiece } from '../pieces';

/** Length of a notch cut into the seam allowance, mm (common practice: about a quarter inch). */
export const notchMm = 6;
/** A construction line ending this close to the cutting line meets it there, mm. */
const reachMm = 1.5;

function insidePolygon(p: Point, polygon: readonly Point[]): boolean {
	let inside = false;
	for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
		const a = polygon[i];
		const b = polygon[j];
		if (a.y > p.y !== b.y > p.y && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
	}
	return inside;
}

function nearestOnEdge(p: Point, polygon: readonly Point[]) {
	let best = { at: p, along: { x: 1, y: 0 }, gap: Infinity };
	polygon.forEach((a, i) => {
		const b = polygon[(i + 1) % polygon.length];
		const length = distance(a, b);
		if (length === 0) return;
		const t = Math.min(1, Math.max(0, ((p.x - a.x) * (b.x - a.x) + (p.y - a.y) * (b.y - a.y)) / length ** 2));
		const at = { x: a.x + t * (b.x - a.x), y: a.y + t * (b.y - a.y) };
		const gap = distance(p, at);
		if (gap < best.gap) best = { at, along: { x: (b.x - a.x) / length, y: (b.y - a.y) / length }, gap };
	});
	return best;
}

/**
 * Balance notches where the piece's construction lines (hip and knee lines, dart legs) meet the cutting
 * line, as short cuts square to the edge into the piece (common practice for matching seams).
 */
export function notches(piece: DraftPiece): Array<[Point, Point]> {
	const ends = piece.marks
		.filter((m) => m.kind === 'guide' || m.kind === 'dart')
		.flatMap((m) => [m.points[0], m.points[m.points.length - 1]]);
	const cuts: Array<[Point, Point]> = [];
	for (const end of ends) {
		const edge = nearestOnEdge(end, piece.outline);
		if (edge.gap > reachMm) continue;
		const normal = { x: -edge.along.y, y: edge.along.x };
		const probe = { x: edge.at.x + normal.x, y: edge.at.y + normal.y };
		const inward = insidePolygon(probe, piece.outline) ? 1 : -1;
		const tip = { x: edge.at.x + inward * normal.x * notchMm, y: edge.at.y + inward * normal.y * notchMm };
		if (!cuts.some(([at]) => distance(at, edge.at) < 1)) cuts.push([edge.at, tip]);
	}
	return cuts;
}
