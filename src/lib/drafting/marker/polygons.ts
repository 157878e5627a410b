/**
 * The few polygon operations the marker needs, on Clipper2's integer paths.
 * Coordinates are held in hundredths of a millimetre, so rounding never moves a point by more than 0.005 mm.
 */
import {
	Clipper,
	Clipper64,
	ClipType,
	EndType,
	FillRule,
	JoinType,
	Minkowski,
	PointInPolygonResult,
	type Path64,
	type Paths64
} from '@countertype/clipper2-ts';
import type { Point } from '../geometry';

export type { Path64, Paths64 };

export const unitsPerMm = 100;

export function toPath(points: readonly Point[]): Path64 {
	const rounded = points.map((p) => ({ x: Math.round(p.x * unitsPerMm), y: Math.round(p.y * unitsPerMm) }));
	// A repeated point (an outline closed by repeating its start) has no direction and upsets offsetting.
	const path = Clipper.stripDuplicates(rounded, true);
	return Clipper.isPositive(path) ? path : path.reverse();
}

export function toPoints(path: Path64): Point[] {
	return path.map((p) => ({ x: p.x / unitsPerMm, y: p.y / unitsPerMm }));
}

/**
 * The outline as straight segments no further than `toleranceMm` from it (Ramer–Douglas–Peucker),
 * grown by `growMm` so that it still contains the outline. Mitred corners keep the vertex count low.
 */
export function nestingShape(outline: readonly Point[], toleranceMm: number, growMm: number): Path64 {
	const original = toPath(outline);
	const simplified = Clipper.ramerDouglasPeucker(original, toleranceMm * unitsPerMm);
	const grow = growMm * unitsPerMm + shortfall(original, simplified);
	if (grow <= 0) return simplified;
	return largest(Clipper.inflatePaths([simplified], grow, JoinType.Miter, EndType.Polygon, 2));
}

function segmentDistance(p: Point, a: Point, b: Point): number {
	const dx = b.x - a.x;
	const dy = b.y - a.y;
	const lengthSq = dx * dx + dy * dy;
	const t = lengthSq ? Math.min(1, Math.max(0, ((p.x - a.x) * dx + (p.y - a.y) * dy) / lengthSq)) : 0;
	return Math.hypot(p.x - a.x - t * dx, p.y - a.y - t * dy);
}

/** How far the original's vertices stick out of the simplified outline (at most the tolerance). */
function shortfall(original: Path64, simplified: Path64): number {
	let worst = 0;
	for (const p of original) {
		if (Clipper.pointInPolygon(p, simplified) !== PointInPolygonResult.IsOutside) continue;
		let nearest = Infinity;
		for (let i = 0; i < simplified.length; i++) {
			const a = simplified[i];
			const b = simplified[(i + 1) % simplified.length];
			nearest = Math.min(nearest, segmentDistance(p, a, b));
		}
		worst = Math.max(worst, nearest);
	}
	return Math.ceil(worst);
}

function largest(paths: Paths64): Path64 {
	return paths.reduce((best, p) => (Math.abs(Clipper.area(p)) > Math.abs(Clipper.area(best)) ? p : best), paths[0]);
}

/** Keeps the part of a shape at or right of x (a piece cut on the fold stops at the fold). */
export function clipLeftOf(shape: Path64, x: number): Path64 {
	const bounds = Clipper.getBounds(shape);
	const keep = [
		{ x, y: bounds.top - 1 },
		{ x: bounds.right + 1, y: bounds.top - 1 },
		{ x: bounds.right + 1, y: bounds.bottom + 1 },
		{ x, y: bounds.bottom + 1 }
	];
	return largest(Clipper.intersect([shape], [keep], FillRule.NonZero));
}

/**
 * No-fit polygon of `moving` around `fixed`, both with their reference point at the origin:
 * the positions of `moving` at which it overlaps `fixed`, i.e. fixed ⊕ (−moving).
 * Clipper's Minkowski sum of a closed path is the ring swept along it; adding one translate of `fixed`
 * fills the inside (any position off the ring with `moving` touching `fixed` has it wholly inside).
 */
export function noFitPolygon(fixed: Path64, moving: Path64): Paths64 {
	const reflected = moving.map((p) => ({ x: -p.x, y: -p.y }));
	const ring = Minkowski.sum(reflected, fixed, true);
	const inside = Clipper.translatePath(fixed, reflected[0].x, reflected[0].y);
	return Clipper.union([...ring, inside], FillRule.NonZero);
}

export function union(paths: Paths64): Paths64 {
	return Clipper.union(paths, FillRule.NonZero);
}

export function difference(subject: Paths64, clip: Paths64): Paths64 {
	return Clipper.difference(subject, clip, FillRule.NonZero);
}

export function translate(paths: Paths64, dx: number, dy: number): Paths64 {
	return Clipper.translatePaths(paths, dx, dy);
}

/** The parts of an open line that lie outside every `blocked` region. */
export function lineOutside(from: Point, to: Point, blocked: Paths64): Paths64 {
	const clipper = new Clipper64();
	clipper.addOpenSubject([[from, to]]);
	clipper.addClip(blocked);
	const closed: Paths64 = [];
	const open: Paths64 = [];
	clipper.execute(ClipType.Difference, FillRule.NonZero, closed, open);
	return open;
}

export function bounds(path: Path64) {
	return Clipper.getBounds(path);
}

/** The outline grown by `mm` all round, corners rounded (the cutting gap's reach). */
export function grownOutline(outline: readonly Point[], mm: number): Point[] {
	const grown = Clipper.inflatePaths([toPath(outline)], mm * unitsPerMm, JoinType.Round, EndType.Polygon);
	return toPoints(largest(grown));
}

/** Area of overlap of two outlines in mm² (zero when they only touch). */
export function overlapArea(a: readonly Point[], b: readonly Point[]): number {
	const common = Clipper.intersect([toPath(a)], [toPath(b)], FillRule.NonZero);
	return Math.abs(Clipper.areaPaths(common)) / unitsPerMm ** 2;
}

/** Area of the part of an outline outside the rectangle [0, width] × [0, length], in mm². */
export function areaOutside(outline: readonly Point[], width: number, length: number): number {
	const cloth = toPath([
		{ x: 0, y: 0 },
		{ x: width, y: 0 },
		{ x: width, y: length },
		{ x: 0, y: length }
	]);
	const outside = Clipper.difference([toPath(outline)], [cloth], FillRule.NonZero);
	return Math.abs(Clipper.areaPaths(outside)) / unitsPerMm ** 2;
}
