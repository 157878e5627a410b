import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { DraftPiece } from '../pieces';
import { aLineSkirt } from './a-line-skirt';
import { straightSkirt } from './straight-skirt';
import { draftIn } from './test-support';

const inch = 25.4;
const seam = (5 / 8) * inch;

/** Finished waist seam of one piece, read from its outline and dart marks: side waist point less seam, less darts. */
function waistSeam(piece: DraftPiece): number {
	const darts = piece.marks.filter((m) => m.kind === 'dart').reduce((sum, m) => sum + m.points[2].x - m.points[0].x, 0);
	return piece.outline[1].x - seam - darts;
}

/** Plausible adult bodies (cm) including waists larger than the hip (ANSUR II men reach waist/hip 1.02). */
const bodies = fc.record({
	waist_girth: fc.double({ min: 55, max: 150, noNaN: true }),
	hip_girth: fc.double({ min: 80, max: 150, noNaN: true }),
	waist_to_hip: fc.double({ min: 16, max: 26, noNaN: true })
});

describe.each([straightSkirt, aLineSkirt])('$id — ease over every girth, band equals the waist seam', (template) => {
	it('gives at least the CWU minimum ease at hip (2 in) and waist (½ in) for any body (property)', () => {
		// CWU "Ch. 16 Ease in Clothing": skirt hip 2–2¾ in, skirt & pants waist ½–¾ in.
		fc.assert(
			fc.property(bodies, fc.constantFrom('fitted', 'regular', 'relaxed'), (body, fit) => {
				const draft = draftIn(template, 'cm', body, { fit });
				const [front, back] = draft.pieces;
				const finishedWaist = 2 * (waistSeam(front) + waistSeam(back));
				expect(finishedWaist - body.waist_girth * 10).toBeGreaterThanOrEqual(0.5 * inch - 1e-6);
				const finishedHip = 4 * (draft.line('front.hip_width') * 10 - seam);
				expect(finishedHip - body.hip_girth * 10).toBeGreaterThanOrEqual(2 * inch - 1e-6);
				// The band is cut to the seam it is sewn to: cut length = waist seam + 1½ in overlap + 2 seams.
				const band = draft.line('waistband.length') * 10;
				expect(band - 1.5 * inch - 2 * seam).toBeCloseTo(finishedWaist, 6);
			}),
			{ numRuns: 200 }
		);
	});

	it('drafts a waist larger than the hip as a straight tube without darts', () => {
		const draft = draftIn(template, 'cm', { waist_girth: 110, hip_girth: 104, waist_to_hip: 20 });
		for (const piece of draft.pieces.slice(0, 2)) expect(piece.marks.some((m) => m.kind === 'dart')).toBe(false);
		expect(2 * (waistSeam(draft.pieces[0]) + waistSeam(draft.pieces[1]))).toBeGreaterThan(1100);
	});
});

describe('skirt front and back suppression', () => {
	it('takes markedly less dart intake at the front than at the back (Aldrich, close-fitting skirt block, from memory: back darts about twice the front)', () => {
		const draft = draftIn(straightSkirt, 'cm', { waist_girth: 72, hip_girth: 96, waist_to_hip: 20.6 });
		const intake = (p: DraftPiece) =>
			p.marks.filter((m) => m.kind === 'dart').reduce((sum, m) => sum + m.points[2].x - m.points[0].x, 0);
		const [front, back] = draft.pieces;
		expect(intake(front)).toBeGreaterThan(0);
		expect(intake(back) / intake(front)).toBeCloseTo(2, 6);
		// The same hip width on both, so the front waist is wider than the back by what its darts do not take.
		expect(draft.line('front.hip_width')).toBeCloseTo(draft.line('back.hip_width'), 9);
		expect(waistSeam(front)).toBeGreaterThan(waistSeam(back));
	});
});
