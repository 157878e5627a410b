import { boundingBox, type Box } from '../geometry';
import { packStrip } from '../layout';
import type { DraftPiece } from '../pieces';
import { isTiled, type Paper } from './paper';

/** Room around each piece on the sheet, mm. */
const padMm = 12;
/** Band at the top of a large sheet for the title and the test squares, mm. */
export const headerMm = 135;
/** PDF viewers and plotters accept pages up to 200 in (Adobe's implementation limit). */
const longestPageMm = 5080;

export interface SheetPiece {
	piece: DraftPiece;
	/** Add to the piece's own coordinates to place it on the sheet. */
	dx: number;
	dy: number;
	box: Box;
}

export interface Sheet {
	paper: Paper;
	tiled: boolean;
	widthMm: number;
	heightMm: number;
	pieces: SheetPiece[];
	cols: number;
	rows: number;
	/** The part of the sheet one page shows, and how far the next page along starts. */
	windowW: number;
	windowH: number;
	stepX: number;
	stepY: number;
	/** Where the pieces start (below the header band on a large sheet). */
	top: number;
}

function pack(pieces: readonly DraftPiece[], width: number) {
	const boxes = pieces.map((p) => boundingBox(p.outline));
	const packed = packStrip(
		boxes.map((b) => ({ w: b.width + 2 * padMm, h: b.height + 2 * padMm })),
		width
	);
	return { boxes, packed };
}

/** Every piece once, at full size, laid on a sheet sized for the paper's pages with as few pages as it can. */
export function layOutSheet(pieces: readonly DraftPiece[], paper: Paper): Sheet {
	const tiled = isTiled(paper);
	const windowW = paper.widthMm - 2 * paper.marginMm;
	const stepX = windowW - paper.overlapMm;
	const widest = Math.max(...pieces.map((p) => boundingBox(p.outline).width + 2 * padMm));
	const fewestCols = Math.max(1, Math.ceil((widest - paper.overlapMm) / stepX));
	const top = tiled ? 0 : headerMm;
	let best: Sheet | null = null;
	let fewestPages = Infinity;
	for (let cols = fewestCols; cols <= fewestCols + (tiled ? 3 : 0); cols++) {
		const widthMm = cols * stepX + paper.overlapMm;
		const { boxes, packed } = pack(pieces, widthMm);
		const heightMm = top + packed.length;
		const windowH = paper.heightMm
			? paper.heightMm - 2 * paper.marginMm
			: Math.min(heightMm, longestPageMm - 2 * paper.marginMm);
		const stepY = windowH - paper.overlapMm;
		const rows = Math.max(1, Math.ceil((heightMm - paper.overlapMm) / stepY));
		if (cols * rows >= fewestPages) continue;
		fewestPages = cols * rows;
		best = {
			paper,
			tiled,
			widthMm,
			heightMm,
			cols,
			rows,
			windowW,
			windowH,
			stepX,
			stepY,
			top,
			pieces: packed.placements.map((p) => {
				const box = boxes[p.item];
				return { piece: pieces[p.item], dx: p.x + padMm - box.x, dy: top + p.y + padMm - box.y, box };
			})
		};
	}
	return best!;
}

/** Row letter and column number of a page, as printed on it: A1 is top left. */
export function tileName(row: number, col: number): string {
	let letters = '';
	for (let n = row + 1; n > 0; n = Math.floor((n - 1) / 26))
		letters = String.fromCharCode(65 + ((n - 1) % 26)) + letters;
	return `${letters}${col + 1}`;
}
