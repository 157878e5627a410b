import { describe, expect, it } from 'vitest';
import { decodePDFRawStream, PDFArray, PDFDocument, PDFRawStream, type PDFPage } from 'pdf-lib';
import { boundingBox } from '../geometry';
import { templates } from '../templates/index';
import { draftIn, standardBodyCm } from '../templates/test-support';
import type { DraftRequest } from '../schemas';
import { paperSizes, ptPerMm } from './paper';
import { patternPdfForRequest } from './request';
import { layOutSheet } from './sheet';

const request: DraftRequest = {
	garment: 'wide-leg-trousers',
	unit: 'cm',
	measurements: { waist_girth: 72, hip_girth: 96, thigh_girth: 56, waist_to_floor: 104 }
};

const made = new Map<string, Promise<PDFDocument>>();

/** Each paper's PDF is made once and read back by every test that needs it. */
function pdfFor(paper: keyof typeof paperSizes): Promise<PDFDocument> {
	if (!made.has(paper)) {
		made.set(
			paper,
			patternPdfForRequest(request, paper).then((result) => {
				if (!result.ok) throw new Error(result.draft.errors.map((e) => e.message).join('; '));
				return PDFDocument.load(result.pdf);
			})
		);
	}
	return made.get(paper)!;
}

function content(doc: PDFDocument, page: PDFPage): string {
	const contents = page.node.Contents();
	const streams = contents instanceof PDFArray ? contents.asArray().map((ref) => doc.context.lookup(ref)) : [contents];
	return streams.map((s) => new TextDecoder().decode(decodePDFRawStream(s as PDFRawStream).decode())).join('\n');
}

/**
 * Squares drawn on the page: closed four-sided paths `0 0 m 0 h l w h l w 0 l h` whose every transform
 * in the same graphics state is a plain move (scale 1), so their size on paper is their size in points.
 */
function squaresPt(stream: string): number[] {
	const sizes: number[] = [];
	for (const block of stream.split(/\nQ\n/)) {
		const shape = /0 0 m\n0 ([\d.]+) l\n([\d.]+) \1 l\n\2 0 l\nh/.exec(block);
		if (!shape || shape[1] !== shape[2]) continue;
		const transforms = [...block.matchAll(/([-\d.]+) ([-\d.]+) ([-\d.]+) ([-\d.]+) [-\d.]+ [-\d.]+ cm/g)];
		if (transforms.every((t) => t[1] === '1' && t[2] === '0' && t[3] === '0' && t[4] === '1')) {
			sizes.push(Number(shape[1]));
		}
	}
	return sizes;
}

const hex = (text: string) =>
	[...text].map((c) => c.charCodeAt(0).toString(16).toUpperCase().padStart(2, '0')).join('');

// Making a tiled PDF takes about a second; a loaded machine can take several.
describe('full-size pattern PDF', { timeout: 30_000 }, () => {
	it('tiles A4 pages (ISO 216: 210 × 297 mm = 595.28 × 841.89 pt) with both test squares on the first', async () => {
		const doc = await pdfFor('a4');
		expect(doc.getPageCount()).toBeGreaterThan(4);
		for (const page of doc.getPages()) {
			expect(page.getWidth()).toBeCloseTo(595.28, 2);
			expect(page.getHeight()).toBeCloseTo(841.89, 2);
		}
		const squares = squaresPt(content(doc, doc.getPage(0)));
		// 10 cm at 72 pt to the inch: 100 / 25.4 × 72 = 283.46 pt; 4 in = 288 pt.
		expect(squares.some((s) => Math.abs(s - 283.46) < 0.01)).toBe(true);
		expect(squares.some((s) => Math.abs(s - 288) < 0.01)).toBe(true);
	});

	it('tiles US Letter (ANSI A: 8½ × 11 in = 612 × 792 pt)', async () => {
		const doc = await pdfFor('letter');
		for (const page of doc.getPages()) {
			expect(page.getWidth()).toBeCloseTo(612, 2);
			expect(page.getHeight()).toBeCloseTo(792, 2);
		}
		expect(squaresPt(content(doc, doc.getPage(0))).filter((s) => Math.abs(s - 283.46) < 0.01)).toHaveLength(1);
	});

	it('names every tile and every piece, with its cut count, somewhere on the pages', async () => {
		const doc = await pdfFor('a4');
		const all = doc
			.getPages()
			.map((p) => content(doc, p))
			.join('\n');
		for (const text of ['A1', 'B2', 'joins A2', 'FRONT', 'BACK', 'WAISTBAND', 'Cut 2 (a pair)', 'GRAIN']) {
			expect(all).toContain(hex(text));
		}
	});

	it('puts the whole pattern on A0 sheets (841 × 1189 mm) and on one 36 in roll page', async () => {
		const a0 = await pdfFor('a0');
		for (const page of a0.getPages()) {
			expect(page.getWidth()).toBeCloseTo(841 * ptPerMm, 2);
			expect(page.getHeight()).toBeCloseTo(1189 * ptPerMm, 2);
		}
		expect(squaresPt(content(a0, a0.getPage(0))).some((s) => Math.abs(s - 283.46) < 0.01)).toBe(true);
		const roll = await pdfFor('roll36');
		expect(roll.getPageCount()).toBe(1);
		const page = roll.getPage(0);
		expect(page.getWidth()).toBeCloseTo(36 * 72, 2);
		// Long enough for the longest piece (a trouser leg over 1 m) at full size, plus the header band.
		expect(page.getHeight()).toBeGreaterThan(1000 * ptPerMm);
		expect(squaresPt(content(roll, page)).some((s) => Math.abs(s - 288) < 0.01)).toBe(true);
	});

	it('lays each piece once at 1:1 inside the sheet, none overlapping', () => {
		const { pieces } = draftIn(templates['a-line-skirt'], 'cm', standardBodyCm);
		const sheet = layOutSheet(pieces, paperSizes.a4);
		expect(sheet.pieces).toHaveLength(pieces.length);
		expect(new Set(sheet.pieces.map((s) => s.piece))).toEqual(new Set(pieces));
		const boxes = sheet.pieces.map((s) => ({ ...s.box, x: s.box.x + s.dx, y: s.box.y + s.dy }));
		for (const [i, b] of boxes.entries()) {
			// Full size: the piece on the sheet is as wide and long as its own outline.
			expect(b.width).toBeCloseTo(boundingBox(sheet.pieces[i].piece.outline).width, 9);
			expect(b.height).toBeCloseTo(boundingBox(sheet.pieces[i].piece.outline).height, 9);
			expect(b.x).toBeGreaterThanOrEqual(0);
			expect(b.x + b.width).toBeLessThanOrEqual(sheet.widthMm);
			for (const other of boxes.slice(i + 1)) {
				const apart =
					b.x + b.width <= other.x ||
					other.x + other.width <= b.x ||
					b.y + b.height <= other.y ||
					other.y + other.height <= b.y;
				expect(apart).toBe(true);
			}
		}
		expect(sheet.cols * sheet.stepX + paperSizes.a4.overlapMm).toBeCloseTo(sheet.widthMm, 9);
		expect((sheet.rows - 1) * sheet.stepY + sheet.windowH).toBeGreaterThanOrEqual(sheet.heightMm);
	});

	it('prints nothing for a draft that is stopped', async () => {
		const result = await patternPdfForRequest({ ...request, measurements: { hip_girth: 96 } }, 'a4');
		expect(result.ok).toBe(false);
	});
});
