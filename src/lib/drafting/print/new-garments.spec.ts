import { describe, expect, it } from 'vitest';
import { decodePDFRawStream, PDFArray, PDFDocument, PDFRawStream, type PDFPage } from 'pdf-lib';
import type { DraftRequest } from '../schemas';
import { patternPdfForRequest } from './request';

function content(doc: PDFDocument, page: PDFPage): string {
	const contents = page.node.Contents();
	const streams = contents instanceof PDFArray ? contents.asArray().map((ref) => doc.context.lookup(ref)) : [contents];
	return streams.map((s) => new TextDecoder().decode(decodePDFRawStream(s as PDFRawStream).decode())).join('\n');
}

const hex = (text: string) =>
	[...text].map((c) => c.charCodeAt(0).toString(16).toUpperCase().padStart(2, '0')).join('');

// The EN 13402-3 pictogram body 88-72-96 with mid-range lengths (from memory), as the garment specs use.
const body = {
	bust_girth: 88,
	under_bust_girth: 73,
	waist_girth: 72,
	hip_girth: 96,
	neck_girth: 35,
	shoulder_width: 38,
	nape_to_waist: 41,
	waist_to_hip: 20.6,
	shoulder_to_bust_point: 25,
	bust_point_span: 18,
	upper_arm_girth: 28,
	arm_length: 58
};

const cases: Array<{ garment: DraftRequest['garment']; texts: string[] }> = [
	{ garment: 'shirt', texts: ['FRONT', 'BACK', 'SLEEVE', 'COLLAR STAND', 'COLLAR', 'Cut 2 on fold', 'Cut 2 (a pair)'] },
	{
		garment: 'waistcoat',
		texts: ['FRONT FACING', 'FRONT LINING', 'BACK LINING', 'LOWER WELT', 'Cut 2 (a pair) in lining', 'Cut 1']
	}
];

describe('full-size pattern PDF for the shirt and the waistcoat', { timeout: 30_000 }, () => {
	it.each(cases)('$garment: one 36 in roll page naming every piece and its cut', async ({ garment, texts }) => {
		const measurements = Object.fromEntries(
			Object.entries(body).filter(
				([code]) => garment === 'shirt' || !/bust_point|upper_arm|arm_length|under_bust/.test(code)
			)
		);
		const result = await patternPdfForRequest({ garment, unit: 'cm', measurements }, 'roll36');
		if (!result.ok) throw new Error(result.draft.errors.map((e) => e.message).join('; '));
		const doc = await PDFDocument.load(result.pdf);
		expect(doc.getPageCount()).toBe(1);
		// 36 in at 72 pt to the inch.
		expect(doc.getPage(0).getWidth()).toBeCloseTo(36 * 72, 2);
		const all = content(doc, doc.getPage(0));
		for (const text of texts) expect(all, text).toContain(hex(text));
	});
});
