import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { estimateFabric } from '../fabric';
import { distance } from '../geometry';
import { aLineSkirt } from './a-line-skirt';
import { straightSkirt } from './straight-skirt';
import { draftIn, standardBodyCm } from './test-support';

const inch = 25.4;
const body = {
	waist_girth: standardBodyCm.waist_girth,
	hip_girth: standardBodyCm.hip_girth,
	waist_to_hip: standardBodyCm.waist_to_hip
};
const folded = (width: number) => ({
	widthMm: width * inch,
	folded: true,
	directional: false,
	shrinkagePercent: 0,
	repeatMm: 0
});

describe('A-line skirt — construction (common practice)', () => {
	const draft = draftIn(aLineSkirt, 'cm', body);
	it('adds the flare at the hem of each side seam', () => {
		expect(draft.line('front.hem_width')).toBeCloseTo(draft.line('front.hip_width') + 2.5 * 2.54, 9);
		expect(draft.line('back.flare')).toBeCloseTo(6.35, 9);
	});
	it('curves the hem up at the side so the flared side seam is as long as the centre below the hip line', () => {
		const front = draft.pieces[0];
		const hip = front.lines.find((l) => l.id === 'hip_width')!.dimension!.to;
		const hem = front.lines.find((l) => l.id === 'hem_width')!.dimension!.to;
		const centreBelowHip = (draft.line('front.length') + 2.54) * 10 - hip.y;
		expect(distance(hip, hem)).toBeCloseTo(centreBelowHip, 6);
	});
	it('uses at most one dart a quarter', () => {
		for (const piece of draft.pieces.slice(0, 2))
			expect(piece.marks.filter((m) => m.kind === 'dart').length).toBeLessThanOrEqual(1);
	});
});

describe('A-line skirt — fabric against a published yardage chart (Sewing For Dummies, 3rd ed.)', () => {
	const aLine = draftIn(aLineSkirt, 'cm', body);
	const straight = draftIn(straightSkirt, 'cm', body);
	const yards = (pieces: typeof aLine.pieces, width: number) =>
		estimateFabric(pieces, folded(width), 'in').estimate!.rounded.value;
	it('is within 1/4 yd of the chart’s 1 3/4 yd at 44/45 in', () => {
		expect(Math.abs(yards(aLine.pieces, 45) - 1.75)).toBeLessThanOrEqual(0.25);
	});
	it('needs at least as much as a straight skirt, and more on narrow cloth with the band cut whole (chart: 2 1/4 vs 2 yd at 35/36 in)', () => {
		const bandWhole = (pieces: typeof aLine.pieces) => pieces.map((p) => ({ ...p, mayCut: undefined }));
		expect(yards(aLine.pieces, 45)).toBeGreaterThanOrEqual(yards(straight.pieces, 45));
		expect(yards(aLine.pieces, 36)).toBeGreaterThanOrEqual(yards(straight.pieces, 36));
		// The chart's patterns cut the band whole; cut in two it fits beside the flared front.
		expect(yards(bandWhole(aLine.pieces), 36)).toBeGreaterThan(yards(bandWhole(straight.pieces), 36));
	});
});

describe('A-line skirt — properties', () => {
	it('hem width grows with flare and with hip', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 0, max: 7, noNaN: true }),
				fc.double({ min: 0.1, max: 1, noNaN: true }),
				fc.double({ min: 85, max: 140, noNaN: true }),
				(flare, more, hip) => {
					const a = draftIn(aLineSkirt, 'in', { waist_girth: 28, hip_girth: hip / 2.54, waist_to_hip: 8 }, { flare });
					const b = draftIn(
						aLineSkirt,
						'in',
						{ waist_girth: 28, hip_girth: hip / 2.54 + more, waist_to_hip: 8 },
						{ flare: flare + more }
					);
					const hemWidth = (d: typeof a) => d.line('front.hip_width') + d.line('back.flare');
					expect(hemWidth(b)).toBeGreaterThan(hemWidth(a));
				}
			),
			{ numRuns: 50 }
		);
	});
});
