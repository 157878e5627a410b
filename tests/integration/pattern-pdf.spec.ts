import { describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
import { baseUrl } from './http';

// The working dressmaker's trouser method (common practice), worked example in inches.
const trousers = {
	garment: 'wide-leg-trousers',
	unit: 'in',
	measurements: { hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
	options: { length: 45.5 }
};

const patternUrl = (request: unknown, paper?: string) =>
	`${baseUrl}/api/v1/drafts/pattern.pdf?${paper ? `paper=${paper}&` : ''}request=${encodeURIComponent(
		typeof request === 'string' ? request : JSON.stringify(request)
	)}`;

describe('GET /api/v1/drafts/pattern.pdf', () => {
	it('answers the pattern on A4 tiles by default (ISO 216: 595.28 × 841.89 pt)', async () => {
		const response = await fetch(patternUrl(trousers));
		expect(response.status).toBe(200);
		expect(response.headers.get('content-type')).toBe('application/pdf');
		expect(response.headers.get('content-disposition')).toContain('wide-leg-trousers-pattern-a4.pdf');
		const doc = await PDFDocument.load(new Uint8Array(await response.arrayBuffer()));
		expect(doc.getPageCount()).toBeGreaterThan(4);
		expect(doc.getPage(0).getSize()).toEqual({ width: expect.closeTo(595.28, 2), height: expect.closeTo(841.89, 2) });
	});

	it('answers US Letter (8½ × 11 in = 612 × 792 pt) and the 36 in roll on request', async () => {
		const letter = await PDFDocument.load(
			new Uint8Array(await (await fetch(patternUrl(trousers, 'letter'))).arrayBuffer())
		);
		expect(letter.getPage(0).getSize()).toEqual({ width: expect.closeTo(612, 2), height: expect.closeTo(792, 2) });
		const roll = await PDFDocument.load(
			new Uint8Array(await (await fetch(patternUrl(trousers, 'roll36'))).arrayBuffer())
		);
		expect(roll.getPageCount()).toBe(1);
		expect(roll.getPage(0).getWidth()).toBeCloseTo(36 * 72, 2);
	});

	it('refuses an unknown paper, a request that is not JSON, and an invalid draft request with 400', async () => {
		const paper = await fetch(patternUrl(trousers, 'a3'));
		expect(paper.status).toBe(400);
		expect((await paper.json()).error.issues.map((i: { path: string }) => i.path)).toEqual(['paper']);
		const notJson = await fetch(patternUrl('{garment:'));
		expect(notJson.status).toBe(400);
		expect((await notJson.json()).error.code).toBe('invalid_json');
		const invalid = await fetch(patternUrl({ ...trousers, garment: 'cape' }));
		expect(invalid.status).toBe(400);
		expect((await invalid.json()).error.issues.map((i: { path: string }) => i.path)).toContain('request.garment');
	});

	it('refuses measurements no body has, and a draft still missing measurements, with 422', async () => {
		const implausible = await fetch(
			patternUrl({ ...trousers, measurements: { ...trousers.measurements, hip_girth: 9999 } })
		);
		expect(implausible.status).toBe(422);
		expect((await implausible.json()).error.code).toBe('implausible_measurements');
		const missing = await fetch(patternUrl({ ...trousers, measurements: { hip_girth: 40 } }));
		expect(missing.status).toBe(422);
		expect((await missing.json()).error.code).toBe('draft_incomplete');
	});
});
