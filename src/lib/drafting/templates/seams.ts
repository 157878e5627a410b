import { distance, pt, type Point } from '../geometry';

/**
 * One edge of a piece as drafted on the seam line (net), from its first point to its last; the next edge
 * starts where this one ends. `allowance` is added outside it when the piece is cut (0 on a fold or a
 * neatened edge).
 */
export interface NetEdge {
	id: string;
	points: Point[];
	allowance: number;
}

export function pathLength(points: readonly Point[]): number {
	let length = 0;
	for (let i = 1; i < points.length; i++) length += distance(points[i - 1], points[i]);
	return length;
}

/** Points along a cubic Bézier from `from` to `to`, excluding `from`. */
export function cubicCurve(from: Point, c1: Point, c2: Point, to: Point, segments = 24): Point[] {
	const points: Point[] = [];
	for (let i = 1; i <= segments; i++) {
		const t = i / segments;
		const u = 1 - t;
		const a = u * u * u;
		const b = 3 * u * u * t;
		const c = 3 * u * t * t;
		const d = t * t * t;
		points.push(pt(a * from.x + b * c1.x + c * c2.x + d * to.x, a * from.y + b * c1.y + c * c2.y + d * to.y));
	}
	return points;
}

/** The closed seam line: every edge's points, each shared corner once. */
export function netOutline(edges: readonly NetEdge[]): Point[] {
	return edges.flatMap((e) => e.points.slice(0, -1));
}

function signedArea(points: readonly Point[]): number {
	let twice = 0;
	points.forEach((p, i) => {
		const q = points[(i + 1) % points.length];
		twice += p.x * q.y - q.x * p.y;
	});
	return twice / 2;
}

interface Segment {
	a: Point;
	b: Point;
	allowance: number;
}

function intersect(p: Point, d: Point, q: Point, e: Point): Point | null {
	const cross = d.x * e.y - d.y * e.x;
	if (Math.abs(cross) < 1e-9) return null;
	const t = ((q.x - p.x) * e.y - (q.y - p.y) * e.x) / cross;
	return pt(p.x + d.x * t, p.y + d.y * t);
}

/**
 * The cutting line: each edge moved out by its own allowance, neighbouring edges meeting where their
 * offset lines cross (a mitred corner, as a cutter squares off allowances), or bevelled where a corner
 * sharper than about 29° would throw the mitre further than four times the larger allowance from it.
 */
export function cutOutline(edges: readonly NetEdge[]): Point[] {
	const segments: Segment[] = [];
	for (const edge of edges) {
		for (let i = 1; i < edge.points.length; i++) {
			const a = edge.points[i - 1];
			const b = edge.points[i];
			if (distance(a, b) > 1e-6) segments.push({ a, b, allowance: edge.allowance });
		}
	}
	// With y down, a positive shoelace area runs clockwise on screen: outward is then (d.y, −d.x).
	const outward = signedArea(netOutline(edges)) > 0 ? 1 : -1;
	const offset = segments.map((s) => {
		const length = distance(s.a, s.b);
		const d = pt((s.b.x - s.a.x) / length, (s.b.y - s.a.y) / length);
		const n = pt(outward * d.y * s.allowance, -outward * d.x * s.allowance);
		return { a: pt(s.a.x + n.x, s.a.y + n.y), b: pt(s.b.x + n.x, s.b.y + n.y), d, corner: s.b, allowance: s.allowance };
	});
	const cut: Point[] = [];
	offset.forEach((s, i) => {
		const next = offset[(i + 1) % offset.length];
		const meet = intersect(s.a, s.d, next.a, next.d);
		const reach = 4 * Math.max(s.allowance, next.allowance, 1);
		if (meet && distance(meet, s.corner) <= reach) cut.push(meet);
		else if (distance(s.b, next.a) < 1e-6) cut.push(s.b);
		else cut.push(s.b, next.a);
	});
	return cut;
}

/** Length of one net edge along its seam line. */
export function lengthOf(edges: readonly NetEdge[], id: string): number {
	const edge = edges.find((e) => e.id === id);
	if (!edge) throw new Error(`No edge ${id}`);
	return pathLength(edge.points);
}
