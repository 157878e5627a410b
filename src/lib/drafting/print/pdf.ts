/**
 * The pattern at full size as a PDF: every piece once at 1:1, on tiles of home-printer paper (with
 * overlaps, registration marks and row/column names) or on one large sheet for a plotter.
 */
import {
	clip,
	degrees,
	endPath,
	PDFDocument,
	popGraphicsState,
	pushGraphicsState,
	rectangle,
	rgb,
	StandardFonts,
	type PDFFont,
	type PDFPage
} from 'pdf-lib';
import type { Point } from '../geometry';
import type { DraftPiece, PieceMark } from '../pieces';
import { cutText } from '../svg';
import { notches } from './notches';
import { paperSizes, ptPerMm, type PaperId } from './paper';
import { layOutSheet, tileName, type Sheet, type SheetPiece } from './sheet';

export interface PatternPdfInput {
	title: string;
	/** One or two lines under the title: whose measurements, which fit. */
	subtitle: string;
	pieces: DraftPiece[];
	paper: PaperId;
}

const ink = rgb(0.14, 0.15, 0.2);
const madder = rgb(0.66, 0.24, 0.15);
const grey = rgb(0.45, 0.47, 0.52);

/** 10 cm and 4 in: the two test squares, mm. */
export const testSquaresMm = [100, 101.6] as const;

interface Fonts {
	regular: PDFFont;
	bold: PDFFont;
}

/** One page's view of the sheet: which part it shows and where that lands on the paper. */
class View {
	constructor(
		readonly page: PDFPage,
		readonly left: number,
		readonly top: number,
		readonly width: number,
		readonly height: number,
		readonly marginMm: number
	) {}

	x(mm: number) {
		return (this.marginMm + mm - this.left) * ptPerMm;
	}
	y(mm: number) {
		return this.page.getHeight() - (this.marginMm + mm - this.top) * ptPerMm;
	}
	shows(box: { x: number; y: number; width: number; height: number }) {
		return (
			box.x < this.left + this.width &&
			box.x + box.width > this.left &&
			box.y < this.top + this.height &&
			box.y + box.height > this.top
		);
	}

	/** A path given in sheet millimetres, stroked `widthPt` wide. */
	path(d: string, widthPt: number, options: { colour?: typeof ink; dash?: number[]; fill?: typeof ink } = {}) {
		this.page.drawSvgPath(d, {
			x: this.x(0),
			y: this.y(0),
			scale: ptPerMm,
			borderWidth: widthPt / ptPerMm,
			borderColor: options.colour ?? ink,
			borderDashArray: options.dash?.map((dash) => dash / ptPerMm),
			color: options.fill
		});
	}

	line(a: Point, b: Point, widthPt: number, colour = ink, dash?: number[]) {
		this.path(`M ${a.x} ${a.y} L ${b.x} ${b.y}`, widthPt, { colour, dash });
	}

	text(
		at: Point,
		content: string,
		font: PDFFont,
		size: number,
		options: { rotate?: number; colour?: typeof ink; centre?: boolean } = {}
	) {
		const safe = printable(font, content);
		const width = font.widthOfTextAtSize(safe, size);
		const angle = ((options.rotate ?? 0) * Math.PI) / 180;
		const shift = options.centre === false ? 0 : width / 2;
		this.page.drawText(safe, {
			x: this.x(at.x) - shift * Math.cos(angle),
			y: this.y(at.y) - shift * Math.sin(angle) - (size / 3) * Math.cos(angle),
			size,
			font,
			color: options.colour ?? ink,
			rotate: degrees(options.rotate ?? 0)
		});
	}
}

/** The standard fonts cover Windows-1252 only: spell out what else a label may hold. */
function printable(font: PDFFont, text: string): string {
	const known = new Set(font.getCharacterSet());
	const spelled: Record<string, string> = { '⅛': '1/8', '⅜': '3/8', '⅝': '5/8', '⅞': '7/8', '→': '->', '←': '<-' };
	return [...text].map((c) => (known.has(c.codePointAt(0)!) ? c : (spelled[c] ?? '?'))).join('');
}

/** Breaks text into lines no wider than `widthMm` at `size`. */
function wrap(font: PDFFont, text: string, size: number, widthMm: number): string[] {
	const lines: string[] = [];
	let line = '';
	for (const word of printable(font, text).split(' ')) {
		const next = line ? `${line} ${word}` : word;
		if (line && font.widthOfTextAtSize(next, size) > widthMm * ptPerMm) {
			lines.push(line);
			line = word;
		} else line = next;
	}
	return line ? [...lines, line] : lines;
}

const pathOf = (points: readonly Point[], close = true) =>
	points.map((p, i) => `${i ? 'L' : 'M'} ${p.x.toFixed(3)} ${p.y.toFixed(3)}`).join(' ') + (close ? ' Z' : '');

const moved = (points: readonly Point[], s: SheetPiece) => points.map((p) => ({ x: p.x + s.dx, y: p.y + s.dy }));

function arrowHead(view: View, from: Point, tip: Point, sizeMm: number, colour = ink) {
	const angle = Math.atan2(tip.y - from.y, tip.x - from.x);
	const a = { x: tip.x - sizeMm * Math.cos(angle - 0.4), y: tip.y - sizeMm * Math.sin(angle - 0.4) };
	const b = { x: tip.x - sizeMm * Math.cos(angle + 0.4), y: tip.y - sizeMm * Math.sin(angle + 0.4) };
	view.path(pathOf([tip, a, b]), 0.3, { colour, fill: colour });
}

function drawMark(view: View, mark: PieceMark, s: SheetPiece, fonts: Fonts) {
	const points = moved(mark.points, s);
	const d = pathOf(points, false);
	switch (mark.kind) {
		case 'dart':
			return view.path(d, 0.7, { colour: madder });
		case 'zip':
			return view.path(d, 1.2, { colour: madder, dash: [6, 3] });
		case 'slit':
			return view.path(d, 1, { colour: madder, dash: [2, 3] });
		case 'fold':
			return view.path(d, 0.6, { dash: [10, 3, 2, 3] });
		default:
			view.path(d, 0.5, { colour: grey, dash: [4, 3] });
			if (mark.label)
				view.text({ x: points[0].x + 4, y: points[0].y - 3 }, mark.label, fonts.regular, 8, {
					colour: grey,
					centre: false
				});
	}
}

/** Outline, marks, notches, grainline, fold bracket, name and cut count of one piece. */
function drawPiece(view: View, s: SheetPiece, fonts: Fonts) {
	const { piece } = s;
	view.path(pathOf(moved(piece.outline, s)), 1);
	for (const mark of piece.marks) drawMark(view, mark, s, fonts);
	for (const [at, tip] of notches(piece)) view.line(moved([at], s)[0], moved([tip], s)[0], 1);
	const [g0, g1] = moved(piece.grainline, s);
	view.line(g0, g1, 0.8);
	arrowHead(view, g1, g0, 5);
	arrowHead(view, g0, g1, 5);
	view.text({ x: g0.x + 3, y: (g0.y + g1.y) / 2 }, 'GRAIN', fonts.regular, 8, { rotate: 90 });
	const box = { x: s.box.x + s.dx, y: s.box.y + s.dy, width: s.box.width, height: s.box.height };
	if (piece.cut.onFold) {
		const x = box.x + 10;
		const top = box.y + box.height * 0.2;
		const bottom = box.y + box.height * 0.8;
		view.path(
			pathOf(
				[
					{ x: box.x, y: top },
					{ x, y: top },
					{ x, y: bottom },
					{ x: box.x, y: bottom }
				],
				false
			),
			1,
			{
				colour: madder
			}
		);
		arrowHead(view, { x, y: top }, { x: box.x, y: top }, 4, madder);
		arrowHead(view, { x, y: bottom }, { x: box.x, y: bottom }, 4, madder);
		view.text({ x: x + 5, y: box.y + box.height / 2 }, 'PLACE ON FOLD', fonts.bold, 10, { rotate: 90, colour: madder });
	}
	const centre = { x: box.x + box.width / 2 + 8, y: box.y + box.height * 0.35 };
	const upright = box.width < 70;
	const lines = [
		{ text: piece.label.toUpperCase(), font: fonts.bold, size: upright ? 12 : 16 },
		{ text: cutText(piece.cut), font: fonts.regular, size: upright ? 9 : 11 }
	];
	lines.forEach((l, i) => {
		const at = upright ? { x: centre.x + i * 6, y: box.y + box.height / 2 } : { x: centre.x, y: centre.y + i * 8 };
		view.text(at, l.text, l.font, l.size, { rotate: upright ? 90 : 0 });
	});
}

/** A target: circle and cross, to lay one page's over its neighbour's. */
function registrationMark(view: View, at: Point) {
	view.path(
		`M ${at.x - 6} ${at.y} L ${at.x + 6} ${at.y} M ${at.x} ${at.y - 6} L ${at.x} ${at.y + 6} ` +
			`M ${at.x + 4} ${at.y} A 4 4 0 1 0 ${at.x - 4} ${at.y} A 4 4 0 1 0 ${at.x + 4} ${at.y}`,
		0.5
	);
}

function registrationPoints(sheet: Sheet): Point[] {
	const { cols, rows, stepX, stepY, windowW, windowH, paper } = sheet;
	const half = paper.overlapMm / 2;
	const bandXs = Array.from({ length: cols - 1 }, (_, k) => (k + 1) * stepX + half);
	const bandYs = Array.from({ length: rows - 1 }, (_, k) => (k + 1) * stepY + half);
	const midXs = Array.from({ length: cols }, (_, c) => c * stepX + windowW / 2);
	const midYs = Array.from({ length: rows }, (_, r) => r * stepY + windowH / 2);
	return [
		...bandXs.flatMap((x) => [...bandYs, ...midYs].map((y) => ({ x, y }))),
		...bandYs.flatMap((y) => midXs.map((x) => ({ x, y })))
	];
}

function drawSquares(view: View, at: Point, fonts: Fonts, side: 'row' | 'column') {
	const [cm, inch] = testSquaresMm;
	const second = side === 'row' ? { x: at.x + cm + 10, y: at.y } : { x: at.x, y: at.y + cm + 12 };
	for (const [corner, size, label] of [
		[at, cm, '10 cm'],
		[second, inch, '4 in']
	] as const) {
		view.page.drawRectangle({
			x: view.x(corner.x),
			y: view.y(corner.y + size),
			width: size * ptPerMm,
			height: size * ptPerMm,
			borderColor: ink,
			borderWidth: 0.5
		});
		view.text({ x: corner.x + size / 2, y: corner.y + size / 2 }, `${label} test square`, fonts.bold, 11);
		view.text({ x: corner.x + size / 2, y: corner.y + size / 2 + 7 }, 'measure it before cutting', fonts.regular, 8);
	}
}

const instructions = [
	'Print at 100 % (actual size), never "fit to page".',
	'Check a test square with a ruler before printing the rest.',
	'Seam allowances are included: cut on the solid line.',
	'Notches: short cuts into the allowance; match them when sewing.'
];

function coverPage(doc: PDFDocument, sheet: Sheet, input: PatternPdfInput, fonts: Fonts) {
	const { paper } = sheet;
	const page = doc.addPage([paper.widthMm * ptPerMm, paper.heightMm! * ptPerMm]);
	const view = new View(page, 0, 0, sheet.windowW, sheet.windowH, paper.marginMm);
	view.text({ x: 0, y: 4 }, input.title, fonts.bold, 18, { centre: false });
	drawSquares(view, { x: 0, y: 16 }, fonts, 'column');
	const textX = testSquaresMm[1] + 8;
	const notes = [
		...wrap(fonts.regular, input.subtitle, 8, sheet.windowW - textX),
		'',
		...instructions,
		`${sheet.rows} rows (A, B, ...) by ${sheet.cols} columns: ${sheet.rows * sheet.cols} pages after this one.`,
		'Lay each page over its neighbour so the targets meet; tape.',
		'',
		...input.pieces.map((p) => `${p.label}: ${cutText(p.cut)}`)
	];
	notes.forEach((line, i) => view.text({ x: textX, y: 18 + i * 4.5 }, line, fonts.regular, 8, { centre: false }));
	pageMap(view, sheet, { x: textX, y: 22 + notes.length * 4.5 }, sheet.windowW - textX, fonts);
}

/** The sheet in miniature with its tiles named, so the pages can be laid out in order. */
function pageMap(view: View, sheet: Sheet, at: Point, widthMm: number, fonts: Fonts) {
	const scale = Math.min(widthMm / sheet.widthMm, (sheet.windowH - at.y) / sheet.heightMm);
	if (scale <= 0) return;
	const small = (p: Point) => ({ x: at.x + p.x * scale, y: at.y + p.y * scale });
	for (const s of sheet.pieces) view.path(pathOf(moved(s.piece.outline, s).map(small)), 0.4, { colour: grey });
	for (let r = 0; r < sheet.rows; r++) {
		for (let c = 0; c < sheet.cols; c++) {
			const corner = small({ x: c * sheet.stepX, y: r * sheet.stepY });
			const size = { x: sheet.windowW * scale, y: sheet.windowH * scale };
			view.path(
				pathOf([
					corner,
					{ x: corner.x + size.x, y: corner.y },
					{ x: corner.x + size.x, y: corner.y + size.y },
					{ x: corner.x, y: corner.y + size.y }
				]),
				0.4
			);
			view.text({ x: corner.x + size.x / 2, y: corner.y + size.y / 2 }, tileName(r, c), fonts.bold, 7);
		}
	}
}

function header(view: View, sheet: Sheet, input: PatternPdfInput, fonts: Fonts) {
	view.text({ x: 10, y: 10 }, input.title, fonts.bold, 24, { centre: false });
	wrap(fonts.regular, input.subtitle, 11, sheet.widthMm - 20).forEach((line, i) =>
		view.text({ x: 10, y: 19 + i * 5 }, line, fonts.regular, 11, { centre: false })
	);
	drawSquares(view, { x: 10, y: 30 }, fonts, 'row');
	const notesX = 10 + testSquaresMm[0] + testSquaresMm[1] + 24;
	[...instructions, ...input.pieces.map((p) => `${p.label}: ${cutText(p.cut)}`)].forEach((line, i) =>
		view.text({ x: notesX, y: 34 + i * 6 }, line, fonts.regular, 10, { centre: false })
	);
	view.line({ x: 0, y: sheet.top - 2 }, { x: sheet.widthMm, y: sheet.top - 2 }, 0.3, grey, [3, 3]);
}

function tilePage(doc: PDFDocument, sheet: Sheet, row: number, col: number, input: PatternPdfInput, fonts: Fonts) {
	const { paper } = sheet;
	const heightMm = paper.heightMm ?? sheet.windowH + 2 * paper.marginMm;
	const page = doc.addPage([paper.widthMm * ptPerMm, heightMm * ptPerMm]);
	const view = new View(page, col * sheet.stepX, row * sheet.stepY, sheet.windowW, sheet.windowH, paper.marginMm);
	page.pushOperators(
		pushGraphicsState(),
		rectangle(view.x(view.left), view.y(view.top + view.height), view.width * ptPerMm, view.height * ptPerMm),
		clip(),
		endPath()
	);
	if (!sheet.tiled && row === 0) header(view, sheet, input, fonts);
	for (const s of sheet.pieces) {
		const box = { x: s.box.x + s.dx - 15, y: s.box.y + s.dy - 15, width: s.box.width + 30, height: s.box.height + 30 };
		if (view.shows(box)) drawPiece(view, s, fonts);
	}
	for (const p of registrationPoints(sheet))
		if (view.shows({ x: p.x - 6, y: p.y - 6, width: 12, height: 12 })) registrationMark(view, p);
	page.pushOperators(popGraphicsState());
	if (sheet.rows * sheet.cols === 1) return;
	const name = tileName(row, col);
	const centre = { x: view.left + view.width / 2, y: view.top + view.height / 2 };
	view.text(centre, name, fonts.bold, 60, { colour: rgb(0.85, 0.86, 0.88) });
	const edge = paper.overlapMm + 4;
	const neighbours: Array<[number, number, Point]> = [
		[row - 1, col, { x: centre.x, y: view.top + edge }],
		[row + 1, col, { x: centre.x, y: view.top + view.height - edge }],
		[row, col - 1, { x: view.left + edge, y: centre.y }],
		[row, col + 1, { x: view.left + view.width - edge, y: centre.y }]
	];
	for (const [r, c, at] of neighbours) {
		if (r < 0 || c < 0 || r >= sheet.rows || c >= sheet.cols) continue;
		view.text(at, `joins ${tileName(r, c)}`, fonts.regular, 8, { colour: grey, rotate: c !== col ? 90 : 0 });
	}
	view.text(
		{ x: view.left + 2, y: view.top + view.height - 3 },
		`${name} · ${input.title} · row ${row + 1} of ${sheet.rows}, column ${col + 1} of ${sheet.cols}`,
		fonts.regular,
		7,
		{ colour: grey, centre: false }
	);
}

/** The full-size pattern as PDF bytes. */
export async function patternPdf(input: PatternPdfInput): Promise<Uint8Array> {
	const paper = paperSizes[input.paper];
	const sheet = layOutSheet(input.pieces, paper);
	const doc = await PDFDocument.create();
	doc.setTitle(`${input.title}: full-size pattern`);
	doc.setCreator('Tackline');
	doc.setProducer('Tackline');
	const fonts = {
		regular: await doc.embedFont(StandardFonts.Helvetica),
		bold: await doc.embedFont(StandardFonts.HelveticaBold)
	};
	if (sheet.tiled) coverPage(doc, sheet, input, fonts);
	for (let row = 0; row < sheet.rows; row++) {
		for (let col = 0; col < sheet.cols; col++) tilePage(doc, sheet, row, col, input, fonts);
	}
	return doc.save();
}
