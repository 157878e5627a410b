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

/** A straight run of the outline at least this long is a cut line another piece may share. */
export const sharedLineMinMm = 40;
/** How far a point may stray from a straight run and still lie on it, in shape units (0.05 mm). */
const straightSlack = 5;

/**
 * The outline split into its straight runs (collinear vertices over at least `sharedLineMinMm`) and the
 * chains between them, in order round the outline, each chain an open path from run to run. With no
 * straight run the whole outline is one closed chain.
 */
export function splitOutline(path: Path64): { runs: Array<{ points: Path64; straight: boolean }>; closed: boolean } {
	const n = path.length;
	const minLength = sharedLineMinMm * unitsPerMm;
	// Start the walk at the sharpest corner, so that no straight run wraps past the start.
	let start = 0;
	let sharpest = -Infinity;
	for (let i = 0; i < n; i++) {
		const a = path[(i + n - 1) % n];
		const b = path[i];
		const c = path[(i + 1) % n];
		const turn = Math.abs(
			Math.atan2(
				(b.x - a.x) * (c.y - b.y) - (b.y - a.y) * (c.x - b.x),
				(b.x - a.x) * (c.x - b.x) + (b.y - a.y) * (c.y - b.y)
			)
		);
		if (turn > sharpest) [sharpest, start] = [turn, i];
	}
	const ring = [...path.slice(start), ...path.slice(0, start), path[start]];
	const straightEdge = new Array<boolean>(n).fill(false);
	for (let i = 0; i < n;) {
		let j = i + 1;
		while (j + 1 <= n && collinear(ring, i, j + 1)) j++;
		if (Math.hypot(ring[j].x - ring[i].x, ring[j].y - ring[i].y) >= minLength) {
			for (let k = i; k < j; k++) straightEdge[k] = true;
			i = j;
		} else i++;
	}
	if (!straightEdge.some(Boolean)) return { runs: [{ points: path, straight: false }], closed: true };
	const runs: Array<{ points: Path64; straight: boolean }> = [];
	let current: Path64 = [ring[0]];
	let kind = straightEdge[0];
	for (let k = 0; k < n; k++) {
		if (straightEdge[k] !== kind) {
			runs.push({ points: current, straight: kind });
			current = [ring[k]];
			kind = straightEdge[k];
		}
		current.push(ring[k + 1]);
	}
	runs.push({ points: current, straight: kind });
	return { runs, closed: false };
}

/** Every vertex from i to j lies within the slack of the line from ring[i] to ring[j]. */
function collinear(ring: Path64, i: number, j: number): boolean {
	const a = ring[i];
	const b = ring[j];
	const length = Math.hypot(b.x - a.x, b.y - a.y);
	if (!length) return false;
	for (let k = i + 1; k < j; k++) {
		const p = ring[k];
		if (Math.abs((b.x - a.x) * (p.y - a.y) - (b.y - a.y) * (p.x - a.x)) / length > straightSlack) return false;
		const along = ((p.x - a.x) * (b.x - a.x) + (p.y - a.y) * (b.y - a.y)) / length;
		if (along < 0 || along > length) return false;
	}
	return true;
}

/** Two integer shapes for one outline: `shape` covers the cutting line, `clear` adds the gap around curves. */
export interface NestingShapes {
	shape: Path64;
	clear: Path64;
}

/**
 * The shapes the marker nests with. The cutting gap (common practice: room for the blade between two cut
 * lines) is kept like this:
 * - a straight run of the outline (at least `sharedLineMinMm`) may lie on another piece's straight run: the
 *   two pieces share one cutting line (common practice: a "common cut line"), so it carries no gap;
 * - every other part of the outline, the curves, keeps `gapMm` from every other piece (`clear` is the shape
 *   with the curved chains grown by the gap; two pieces may not have one's `clear` overlap the other's `shape`);
 * - the fold and the selvedges need no gap: the piece's edge is the cut line there (see nest.ts).
 * The curved chains are flattened to `toleranceMm` (Ramer–Douglas–Peucker) and grown by however far the
 * flattening strayed inside, so `shape` still contains the outline; straight runs are kept exact.
 */
export function nestingShapes(outline: readonly Point[], toleranceMm: number, gapMm: number): NestingShapes {
	const original = toPath(outline);
	const { runs, closed } = splitOutline(original);
	const epsilon = toleranceMm * unitsPerMm;
	const flat = runs.map((r) => ({
		...r,
		flat: r.straight || r.points.length <= 2 ? r.points : Clipper.ramerDouglasPeucker(r.points, epsilon)
	}));
	const chains = flat.filter((r) => !r.straight).map((r) => r.flat);
	let stray = 0;
	let body: Path64;
	if (closed) {
		body = chains[0];
		stray = shortfall(original, body);
	} else {
		// The outline again from its runs in order, each run's last point being the next one's first.
		body = flat.flatMap((r) => r.flat.slice(0, -1));
		for (const r of flat) if (!r.straight) stray = Math.max(stray, chainShortfall(r.points, r.flat));
	}
	const end = closed ? EndType.Polygon : EndType.Butt;
	const grow = (delta: number) =>
		delta > 0 ? Clipper.inflatePaths(chains, delta, JoinType.Miter, end, 2) : ([] as Paths64);
	const shape = largest(Clipper.union([body, ...grow(Math.ceil(stray))], FillRule.NonZero));
	const clear =
		gapMm > 0
			? largest(Clipper.union([shape, ...grow(Math.ceil(stray + gapMm * unitsPerMm))], FillRule.NonZero))
			: shape;
	return { shape, clear };
}

/** How far the original chain's vertices lie from the flattened one. */
function chainShortfall(original: Path64, simplified: Path64): number {
	let worst = 0;
	for (const p of original) {
		let nearest = Infinity;
		for (let i = 0; i + 1 < simplified.length; i++)
			nearest = Math.min(nearest, segmentDistance(p, simplified[i], simplified[i + 1]));
		worst = Math.max(worst, nearest);
	}
	return worst;
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
 * No-fit polygon of `moving` around `fixed`, both with their reference point at the origin: the positions of
 * `moving` at which it overlaps `fixed`, i.e. fixed ⊕ (−moving).
 * Every edge of the sum's boundary is an edge of one polygon moved by a vertex of the other, so the sum is the
 * union of `fixed` moved by each vertex of −moving and −moving moved by each vertex of `fixed`, with the holes
 * of that union filled (far fewer, larger polygons than Clipper's edge-by-edge quads: several times faster).
 * Filling also fills the sum's own holes: a place a piece could only reach by being dropped into a pocket
 * is given up. A hole Clipper joins to the outside by a zero-width channel is closed first by growing the
 * union by 3 hundredths of a millimetre and shrinking it by 1: the polygon errs 0.02 mm on the blocked side.
 */
export function noFitPolygon(fixed: Path64, moving: Path64): Paths64 {
	const reflected = moving.map((p) => ({ x: -p.x, y: -p.y }));
	const copies = [
		...fixed.map((a) => Clipper.translatePath(reflected, a.x, a.y)),
		...reflected.map((b) => Clipper.translatePath(fixed, b.x, b.y))
	];
	const outer = (paths: Paths64) => paths.filter((p) => Clipper.isPositive(p));
	const sum = outer(Clipper.union(copies, FillRule.NonZero));
	const closed = outer(Clipper.inflatePaths(sum, 3, JoinType.Miter, EndType.Polygon, 2));
	return outer(Clipper.inflatePaths(closed, -1, JoinType.Miter, EndType.Polygon, 2));
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

/** The curved runs of an outline (everything but its straight runs), in mm; `closed` when it is all curve. */
export function curvedRuns(outline: readonly Point[]): Array<{ points: Point[]; closed: boolean }> {
	const { runs, closed } = splitOutline(toPath(outline));
	return runs.filter((r) => !r.straight).map((r) => ({ points: toPoints(r.points), closed }));
}

/** The ground within `mm` of the lines: round joins, square-cut ends (a closed line's reach all round). */
export function reachOf(lines: ReadonlyArray<{ points: Point[]; closed: boolean }>, mm: number): Point[][] {
	return lines.flatMap(({ points, closed }) => {
		const path = points.map((p) => ({ x: Math.round(p.x * unitsPerMm), y: Math.round(p.y * unitsPerMm) }));
		const end = closed ? EndType.Polygon : EndType.Butt;
		const reach = Clipper.inflatePaths([path], mm * unitsPerMm, JoinType.Round, end);
		return (closed ? Clipper.union([...reach, path], FillRule.NonZero) : reach).map(toPoints);
	});
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
