import { boundingBox, clipToSide, pt, type Point } from '../geometry';
import type { CutInstruction, DraftPiece } from '../pieces';
import { inch } from './common';

/** A facing reaches this far in from the edge it finishes (2–3 in is usual; common practice, from memory). */
export const facingWidth = inch(2.5);

function inside(p: Point, polygon: readonly Point[]): boolean {
	let crossings = 0;
	polygon.forEach((a, i) => {
		const b = polygon[(i + 1) % polygon.length];
		if (a.y > p.y !== b.y > p.y && p.x < a.x + ((p.y - a.y) * (b.x - a.x)) / (b.y - a.y)) crossings++;
	});
	return crossings % 2 === 1;
}

/** Each inner point of `edge` moved `width` into the body along the mean normal of its two segments. */
function offsetInto(body: readonly Point[], edge: readonly Point[], width: number): Point[] {
	const normal = (a: Point, b: Point) => {
		const length = Math.hypot(b.x - a.x, b.y - a.y) || 1;
		return { x: -(b.y - a.y) / length, y: (b.x - a.x) / length };
	};
	const first = normal(edge[0], edge[1]);
	const mid = pt((edge[0].x + edge[1].x) / 2, (edge[0].y + edge[1].y) / 2);
	const sign = inside(pt(mid.x + first.x, mid.y + first.y), body) ? 1 : -1;
	return edge.slice(1, -1).map((p, i) => {
		const before = normal(edge[i], p);
		const after = normal(p, edge[i + 2]);
		const n = { x: before.x + after.x, y: before.y + after.y };
		const length = Math.hypot(n.x, n.y) || 1;
		return pt(p.x + (sign * width * n.x) / length, p.y + (sign * width * n.y) / length);
	});
}

/**
 * A facing that follows `edge` (points along a cut edge of `body`, in order) `facingWidth` into the body.
 * Its inner edge starts at `end` (on the seam the edge runs into) and finishes with `back`, the points that
 * lead to the edge's first point (down the fold or seam it starts on).
 */
export function facingAlong(
	body: DraftPiece,
	facing: { id: string; label: string; edge: Point[]; end: Point; back: Point[]; clearOfFold?: boolean }
): DraftPiece {
	// Beside a slit on the fold the facing runs straight down, a facing width clear of the fold.
	const inner = offsetInto(body.outline, facing.edge, facingWidth)
		.reverse()
		.filter((p) => !facing.clearOfFold || p.x >= facingWidth);
	return facingPiece(facing.id, facing.label, body.cut, [...facing.edge, facing.end, ...inner, ...facing.back], {
		id: 'facing_width',
		label: 'Facing width',
		mm: facingWidth
	});
}

/**
 * An all-in-one facing (neck and armhole together): the top of `body` above the straight line from
 * `centre` (on the centre line) to `side` (on the side seam below the underarm).
 */
export function facingAbove(
	body: DraftPiece,
	facing: { id: string; label: string; centre: Point; side: Point; edgeAtCentre: number }
): DraftPiece {
	return facingPiece(facing.id, facing.label, body.cut, clipToSide(body.outline, facing.centre, facing.side), {
		id: 'depth_at_centre',
		label: 'Facing depth at the centre line',
		mm: facing.centre.y - facing.edgeAtCentre
	});
}

function facingPiece(
	id: string,
	label: string,
	cut: CutInstruction,
	outline: Point[],
	line: { id: string; label: string; mm: number }
): DraftPiece {
	const box = boundingBox(outline);
	const midX = box.x + box.width / 2;
	return {
		id,
		label,
		cut: { ...cut },
		outline,
		marks: [],
		lines: [line],
		grainline: [pt(midX, box.y + box.height * 0.25), pt(midX, box.y + box.height * 0.75)]
	};
}

/** A neckline to face: its edge from the centre out, and how deep at the centre (the neck or a slit's foot). */
export interface FacedNeck {
	edge: Point[];
	depth: number;
	slit: boolean;
}

/** Front and back neck facings for pieces cut on the fold, meeting the shoulder seam at `end`. */
export function neckFacings(
	front: DraftPiece,
	back: DraftPiece,
	neck: { end: Point; front: FacedNeck; back: FacedNeck }
): DraftPiece[] {
	const facing = (body: DraftPiece, side: 'front' | 'back', faced: FacedNeck) => {
		const foot = faced.depth + facingWidth;
		return facingAlong(body, {
			id: `${side}_facing`,
			label: `${side === 'front' ? 'Front' : 'Back'} neck facing`,
			edge: faced.edge,
			end: neck.end,
			back: faced.slit ? [pt(facingWidth, foot), pt(0, foot)] : [pt(0, foot)],
			clearOfFold: faced.slit
		});
	};
	return [facing(front, 'front', neck.front), facing(back, 'back', neck.back)];
}
