import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { boundingBox, polygonArea } from '../geometry';
import { garmentIds, measurementCodes, measurementInfo } from '../measurements';
import { garments, templates } from './index';
import { draftIn, standardBodyCm } from './test-support';

const girths = [
	'neck_girth',
	'bust_girth',
	'under_bust_girth',
	'waist_girth',
	'hip_girth',
	'thigh_girth',
	'upper_arm_girth'
] as const;

describe('garment registry', () => {
	it('lists the eight garments in order with their required measurements and labour hours', () => {
		expect(garments.map((g) => g.id)).toEqual([...garmentIds]);
		for (const g of garments) {
			expect(g.requiredMeasurements.every((code) => (measurementCodes as readonly string[]).includes(code))).toBe(true);
			expect(g.defaultLabourHours).toBeGreaterThan(0);
			expect(g.options.some((o) => o.id === 'fit')).toBe(true);
		}
	});

	it('agrees with the vocabulary about which garments use which measurement', () => {
		for (const code of measurementCodes) {
			const using = garments
				.filter((g) => g.requiredMeasurements.includes(code) || g.optionalMeasurements.includes(code))
				.map((g) => g.id);
			expect([...measurementInfo[code].garments].sort(), code).toEqual(using.sort());
		}
	});
});

describe.each(Object.values(templates))('$id drafts a whole body', (template) => {
	const draft = draftIn(template, 'cm', standardBodyCm);

	it('gives pieces with unique ids and stable snake_case line ids', () => {
		const ids = draft.pieces.map((p) => p.id);
		expect(new Set(ids).size).toBe(ids.length);
		for (const piece of draft.pieces) {
			const lineIds = piece.lines.map((l) => l.id);
			expect(new Set(lineIds).size).toBe(lineIds.length);
			for (const line of piece.lines) {
				expect(line.id).toMatch(/^[a-z][a-z0-9_]*$/);
				expect(Number.isFinite(line.mm) && line.mm >= 0, `${piece.id}.${line.id}`).toBe(true);
			}
		}
	});

	it('gives closed, finite outlines; cut-on-fold pieces have their fold at x = 0', () => {
		for (const piece of draft.pieces) {
			expect(piece.outline.length).toBeGreaterThanOrEqual(3);
			expect(piece.outline.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y))).toBe(true);
			expect(polygonArea(piece.outline)).toBeGreaterThan(0);
			if (piece.cut.onFold) expect(boundingBox(piece.outline).x).toBeCloseTo(0, 9);
		}
	});

	it('grows every piece when every girth grows, save neck facings and pocket pieces, which follow the neckline and pocket options (a pocket shortened to fit a narrow front may grow back) (property)', () => {
		fc.assert(
			fc.property(fc.double({ min: 1.01, max: 1.3, noNaN: true }), (factor) => {
				const bigger = { ...standardBodyCm } as Record<string, number>;
				for (const code of girths) bigger[code] = standardBodyCm[code] * factor;
				const grown = draftIn(template, 'cm', bigger);
				grown.pieces.forEach((piece, i) => {
					const before = polygonArea(draft.pieces[i].outline);
					if (/neck facing/i.test(piece.label)) expect(polygonArea(piece.outline), piece.id).toBeCloseTo(before, 6);
					else if (/welt|pocket bag/i.test(piece.label))
						expect(polygonArea(piece.outline), piece.id).toBeGreaterThanOrEqual(before - 1e-6);
					else expect(polygonArea(piece.outline), piece.id).toBeGreaterThan(before);
				});
			}),
			{ numRuns: 25 }
		);
	});
});
