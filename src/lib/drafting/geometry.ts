/** Plane geometry for pattern pieces: millimetres, x across the cloth, y down along the grain. */
export interface Point {
	x: number;
	y: number;
}

export interface Box {
	x: number;
	y: number;
	width: number;
	height: number;
}

export const pt = (x: number, y: number): Point => ({ x, y });

export function distance(a: Point, b: Point): number {
	return Math.hypot(b.x - a.x, b.y - a.y);
}

export function lerp(a: Point, b: Point, t: number): Point {
	return { x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t };
}

export function boundingBox(points: readonly Point[]): Box {
	let minX = Infinity;
	let minY = Infinity;
	let maxX = -Infinity;
	let maxY = -Infinity;
	for (const { x, y } of points) {
		minX = Math.min(minX, x);
		minY = Math.min(minY, y);
		maxX = Math.max(maxX, x);
		maxY = Math.max(maxY, y);
	}
	return { x: minX, y: minY, width: maxX - minX, height: maxY - minY };
}

/** Shoelace formula; the absolute area of a simple polygon. */
export function polygonArea(points: readonly Point[]): number {
	let twice = 0;
	for (let i = 0; i < points.length; i++) {
		const a = points[i];
		const b = points[(i + 1) % points.length];
		twice += a.x * b.y - b.x * a.y;
	}
	return Math.abs(twice) / 2;
}

/** Points along a quadratic Bézier from `from` to `to`, excluding `from`. */
export function quadCurve(from: Point, control: Point, to: Point, segments = 8): Point[] {
	const points: Point[] = [];
	for (let i = 1; i <= segments; i++) {
		const t = i / segments;
		const u = 1 - t;
		points.push({
			x: u * u * from.x + 2 * u * t * control.x + t * t * to.x,
			y: u * u * from.y + 2 * u * t * control.y + t * t * to.y
		});
	}
	return points;
}

export function translate(points: readonly Point[], dx: number, dy: number): Point[] {
	return points.map((p) => ({ x: p.x + dx, y: p.y + dy }));
}

/** Mirror about the vertical line x = axis (the fold line when a piece is opened out). */
export function mirrorX(points: readonly Point[], axis = 0): Point[] {
	return points.map((p) => ({ x: 2 * axis - p.x, y: p.y }));
}

/** Turn 180° inside the box (keeps the grain direction, reverses its sense). */
export function turnHalf(points: readonly Point[], box: Box): Point[] {
	return points.map((p) => ({ x: 2 * box.x + box.width - p.x, y: 2 * box.y + box.height - p.y }));
}

/** Swap x and y (a quarter turn, then a flip), for layouts that allow any rotation. */
export function quarterTurn(points: readonly Point[], box: Box): Point[] {
	return points.map((p) => ({ x: box.x + (p.y - box.y), y: box.y + (p.x - box.x) }));
}

/** Offset a segment sideways by `d` (positive = to the right of travel when y points down). */
export function offsetSegment(a: Point, b: Point, d: number): [Point, Point] {
	const length = distance(a, b);
	const nx = -(b.y - a.y) / length;
	const ny = (b.x - a.x) / length;
	return [
		{ x: a.x - nx * d, y: a.y - ny * d },
		{ x: b.x - nx * d, y: b.y - ny * d }
	];
}

/** Point on the line through a and b at height y. */
export function atHeight(a: Point, b: Point, y: number): Point {
	const t = (y - a.y) / (b.y - a.y);
	return lerp(a, b, t);
}

/** One step of a piece's outline as drawn: a straight line or a quadratic Bézier curve. */
export type PathStep = { to: Point; control?: Point };

/** A closed outline with its curves; the last step returns to `start`. */
export interface CurvedPath {
	start: Point;
	steps: PathStep[];
}

/**
 * Chords along a quadratic Bézier that stay within `tolerance` of it. The second derivative of a
 * quadratic is the constant 2(P0 − 2P1 + P2), so a chord over a parameter step h strays at most
 * |P0 − 2P1 + P2|·h²/4 from the curve.
 */
function quadSegments(from: Point, control: Point, to: Point, tolerance: number): number {
	const bend = Math.hypot(from.x - 2 * control.x + to.x, from.y - 2 * control.y + to.y);
	return Math.max(1, Math.ceil(Math.sqrt(bend / (4 * tolerance))));
}

/** The outline as a polygon, curves flattened to chords within `tolerance` mm (the closing point left off). */
export function flattenPath(path: CurvedPath, tolerance = 1): Point[] {
	const points: Point[] = [path.start];
	let at = path.start;
	for (const step of path.steps) {
		if (step.control)
			points.push(...quadCurve(at, step.control, step.to, quadSegments(at, step.control, step.to, tolerance)));
		else points.push(step.to);
		at = step.to;
	}
	const last = points[points.length - 1];
	if (points.length > 1 && distance(last, path.start) < 1e-9) points.pop();
	return points;
}

/**
 * The part of a polygon on the left of the directed line a → b (y down, so "left" is where a turn from
 * a → b towards −y lies). One pass of Sutherland–Hodgman clipping (Sutherland & Hodgman, "Reentrant
 * polygon clipping", CACM 17(1), 1974).
 */
export function clipToSide(polygon: readonly Point[], a: Point, b: Point): Point[] {
	const side = (p: Point) => (b.x - a.x) * (p.y - a.y) - (b.y - a.y) * (p.x - a.x);
	const kept: Point[] = [];
	const push = (p: Point) => {
		const last = kept[kept.length - 1];
		if (!last || distance(last, p) > 1e-9) kept.push(p);
	};
	polygon.forEach((current, i) => {
		const previous = polygon[(i + polygon.length - 1) % polygon.length];
		const sc = side(current);
		const sp = side(previous);
		if (sc <= 0 !== sp <= 0) push(lerp(previous, current, sp / (sp - sc)));
		if (sc <= 0) push(current);
	});
	if (kept.length > 1 && distance(kept[0], kept[kept.length - 1]) <= 1e-9) kept.pop();
	return kept;
}
