import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { estimateFabric } from '../fabric';
import { straightSkirt } from './straight-skirt';
import { draftIn, standardBodyCm } from './test-support';

const inch = 25.4;
const body = {
	waist_girth: standardBodyCm.waist_girth,
	hip_girth: standardBodyCm.hip_girth,
	waist_to_hip: standardBodyCm.waist_to_hip
};
const seam = (5 / 8) * inch;

describe('straight skirt — ease (CWU "Ch. 16 Ease in Clothing": hip 2–2¾ in, skirt waist ½–¾ in)', () => {
	for (const fit of ['fitted', 'regular'] as const) {
		it(`${fit}: finished hip and waist carry wearing ease inside the published ranges`, () => {
			const draft = draftIn(straightSkirt, 'cm', body, { fit });
			const finishedHip = 4 * (draft.line('front.hip_width') * 10 - seam);
			const hipEase = (finishedHip - body.hip_girth * 10) / inch;
			expect(hipEase).toBeGreaterThanOrEqual(2 - 1e-9);
			expect(hipEase).toBeLessThanOrEqual(2.75 + 1e-9);
			const finishedWaist = 2 * (draft.line('front.waist_width') + draft.line('back.waist_width')) * 10;
			const waistEase = (finishedWaist - body.waist_girth * 10) / inch;
			expect(waistEase).toBeGreaterThanOrEqual(0.5 - 1e-9);
			expect(waistEase).toBeLessThanOrEqual(0.75 + 1e-9);
		});
	}
});

describe('straight skirt — construction', () => {
	const draft = draftIn(straightSkirt, 'cm', body);
	it('side shaping and darts take up exactly the hip-to-waist difference of each quarter', () => {
		const front = draft.pieces[0];
		const darts = front.marks.filter((m) => m.kind === 'dart').length;
		const quarterHip = draft.line('front.hip_width') * 10 - seam;
		const taken = draft.line('front.side_shaping') * 10 + darts * draft.line('front.dart_intake') * 10;
		expect(quarterHip - taken).toBeCloseTo(draft.line('front.waist_width') * 10, 9);
	});
	it('keeps each dart within 3 cm (common practice: skirt darts 1.5–3 cm, from memory)', () => {
		for (const waist of [60, 72, 90]) {
			const d = draftIn(straightSkirt, 'cm', { ...body, waist_girth: waist, hip_girth: 110 });
			expect(d.line('front.dart_intake')).toBeLessThanOrEqual(3 + 1e-9);
		}
	});
	it('cuts the front on the fold, the back as a pair with zip and slit', () => {
		expect(draft.pieces.map((p) => [p.id, p.cut.onFold, p.cut.quantity])).toEqual([
			['front', true, 1],
			['back', false, 2],
			['waistband', false, 1]
		]);
		expect(draft.pieces[1].marks.map((m) => m.kind)).toEqual(expect.arrayContaining(['zip', 'slit']));
	});
});

describe('straight skirt — fabric against a published yardage chart', () => {
	it('needs about the yardage Sewing For Dummies (3rd ed.) lists: 1 5/8 yd at 44/45 in wide', () => {
		// Chart values are for commercial patterns across sizes; the estimate for the 88-72-96 body should land
		// within 1/4 yd of it.
		const draft = draftIn(straightSkirt, 'cm', body);
		const estimate = estimateFabric(
			draft.pieces,
			{ widthMm: 45 * inch, folded: true, directional: false, shrinkagePercent: 0, repeatMm: 0 },
			'in'
		).estimate!;
		expect(Math.abs(estimate.rounded.value - 1.625)).toBeLessThanOrEqual(0.25);
	});
});

describe('straight skirt — properties', () => {
	it('hip width grows with hip, waistband with waist; cm and in agree', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 80, max: 150, noNaN: true }),
				fc.double({ min: 0.5, max: 10, noNaN: true }),
				(hip, grow) => {
					const waist = hip * 0.75;
					const a = draftIn(straightSkirt, 'cm', { ...body, hip_girth: hip, waist_girth: waist });
					const b = draftIn(straightSkirt, 'cm', { ...body, hip_girth: hip + grow, waist_girth: waist + grow });
					expect(b.line('front.hip_width')).toBeGreaterThan(a.line('front.hip_width'));
					expect(b.line('waistband.length')).toBeGreaterThan(a.line('waistband.length'));
					const inches = draftIn(
						straightSkirt,
						'in',
						{ hip_girth: hip / 2.54, waist_girth: waist / 2.54, waist_to_hip: body.waist_to_hip / 2.54 },
						{ length: 60 / 2.54 }
					);
					a.pieces[1].outline.forEach((p, i) => expect(p.x).toBeCloseTo(inches.pieces[1].outline[i].x, 6));
				}
			),
			{ numRuns: 50 }
		);
	});
});
