import type { Box, Point } from './geometry';

/** An axis-aligned rectangle by its corners, in drawing units. */
export interface Rect {
	x0: number;
	y0: number;
	x1: number;
	y1: number;
}

export const rectsOverlap = (a: Rect, b: Rect) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

export const rectOf = (box: Box): Rect => ({ x0: box.x, y0: box.y, x1: box.x + box.width, y1: box.y + box.height });

/**
 * The box a line of text takes, centred on `at` and turned by `rotate` degrees. Poppins' glyphs are wide:
 * 0.62 em a character with 0.2 em either side errs on the large side.
 */
export function textRect(at: Point, content: string, fontSize: number, rotate = 0): Rect {
	const w = (content.length * 0.62 + 0.4) * fontSize;
	const h = fontSize * 1.25;
	const r = (rotate * Math.PI) / 180;
	const halfW = (Math.abs(Math.cos(r)) * w + Math.abs(Math.sin(r)) * h) / 2;
	const halfH = (Math.abs(Math.sin(r)) * w + Math.abs(Math.cos(r)) * h) / 2;
	return { x0: at.x - halfW, y0: at.y - halfH, x1: at.x + halfW, y1: at.y + halfH };
}

export interface DimensionLabel {
	from: Point;
	to: Point;
	text: string;
	at: Point;
	rotate: number;
	fontSize: number;
	rect: Rect;
}

/** Distances from the line (in font sizes, negative on the piece's side), then ever further out. */
const firstOffsets = [0.8, -0.8, 2, -2];
/** Places along the line to try, in order. */
const along = [0.5, 0.35, 0.65, 0.2, 0.8];

/**
 * Each dimension's label beside its line, clear of the labels placed before it and of `obstacles`:
 * first at the middle on the side away from the piece, then further along the line, then on the
 * piece's side, then further out until it is clear.
 */
export function placeDimensionLabels(
	dimensions: ReadonlyArray<{ from: Point; to: Point; text: string }>,
	fontSize: number,
	piece: Box,
	obstacles: readonly Rect[]
): DimensionLabel[] {
	const placed: DimensionLabel[] = [];
	// What a new label must stay clear of: the obstacles, then every label placed so far.
	const taken: Rect[] = [...obstacles];
	for (const { from, to, text } of dimensions) {
		const dx = to.x - from.x;
		const dy = to.y - from.y;
		const length = Math.hypot(dx, dy) || 1;
		const vertical = Math.abs(dy) > Math.abs(dx);
		const angle = (Math.atan2(dy, dx) * 180) / Math.PI;
		const rotate = vertical ? -90 : Math.abs(angle) > 90 ? angle - 180 : angle;
		const mid = { x: (from.x + to.x) / 2, y: (from.y + to.y) / 2 };
		let normal = { x: -dy / length, y: dx / length };
		const away = vertical ? (mid.x > piece.x + piece.width / 2 ? 1 : -1) : mid.y > piece.y + piece.height ? 1 : -1;
		if ((vertical ? normal.x : normal.y) * away < 0) normal = { x: -normal.x, y: -normal.y };
		// The label's box is the same wherever it goes: its half sides once, as textRect works them out.
		const size = textRect({ x: 0, y: 0 }, text, fontSize, rotate);
		const halfW = size.x1;
		const halfH = size.y1;
		// Obstacles are finite, so some distance out is always clear.
		let label: DimensionLabel | null = null;
		let k = 0;
		for (let step = 0; !label; step++) {
			k = step < firstOffsets.length ? firstOffsets[step] : step === firstOffsets.length ? 3.2 : k + 1.2;
			for (const t of along) {
				const at = {
					x: from.x + dx * t + normal.x * k * fontSize,
					y: from.y + dy * t + normal.y * k * fontSize
				};
				const rect = { x0: at.x - halfW, y0: at.y - halfH, x1: at.x + halfW, y1: at.y + halfH };
				if (taken.some((other) => rectsOverlap(rect, other))) continue;
				label = { from, to, text, at, rotate, fontSize, rect };
				break;
			}
		}
		placed.push(label);
		taken.push(label.rect);
	}
	return placed;
}
