import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { boundingBox, distance, polygonArea, type Point } from '../geometry';
import { pieceSvg } from '../svg';
import { draftIn } from './test-support';
import { wideLegTrousers } from './wide-leg-trousers';

// The working dressmaker's trouser method, worked example in inches: hip 40, waist 28, thigh 25,
// finished length 45.5, waistband 1.5 deep. Common practice (a trade method, no published source).
const example = draftIn(wideLegTrousers, 'in', { hip_girth: 40, waist_girth: 28, thigh_girth: 25 }, { length: 45.5 });

describe('wide-leg trousers — the dressmaker’s method (common practice)', () => {
	it('front fold width = quarter hip + 6', () => {
		expect(example.line('front.fold_width')).toBeCloseTo(16, 9);
	});
	it('hip line depth = quarter hip (hip 40 → 10)', () => {
		expect(example.line('front.hip_line_depth')).toBeCloseTo(10, 9);
	});
	it('crotch depth = hip line depth + 1 + crotch ease 0.5 (→ 11.5)', () => {
		expect(example.line('front.crotch_depth')).toBeCloseTo(11.5, 9);
	});
	it('thigh line depth = crotch depth + 2.5 (→ 14)', () => {
		expect(example.line('front.thigh_line_depth')).toBeCloseTo(14, 9);
	});
	it('width at hip line = quarter hip + 1 seam allowance (→ 11)', () => {
		expect(example.line('front.hip_width')).toBeCloseTo(11, 9);
	});
	it('front crotch extension = quarter hip ÷ 4 (→ 2.5)', () => {
		expect(example.line('front.crotch_extension')).toBeCloseTo(2.5, 9);
	});
	it('front waist width = quarter waist + 1 ease + 1 seam allowance (waist 28 → 9)', () => {
		expect(example.line('front.waist_width')).toBeCloseTo(9, 9);
	});
	it('thigh width = (thigh + 1) ÷ 2 (thigh 25 → 13, 6.5 each side of the centre line)', () => {
		expect(example.line('front.thigh_width')).toBeCloseTo(13, 9);
		const front = example.pieces.find((p) => p.id === 'front')!;
		const centre = front.grainline[0].x;
		const thigh = front.lines.find((l) => l.id === 'thigh_width')!.dimension!;
		expect((centre - thigh.from.x) / 25.4).toBeCloseTo(6.5, 9);
		expect((thigh.to.x - centre) / 25.4).toBeCloseTo(6.5, 9);
	});
	it('leg length = length − waistband depth + 2 hem (45.5 → 46)', () => {
		expect(example.line('front.leg_length')).toBeCloseTo(46, 9);
	});
	it('centre-front waist is lowered 1', () => {
		expect(example.line('front.centre_front_drop')).toBeCloseTo(1, 9);
	});
	it('back crotch extension = front + 2 (→ 4.5); back waist in 1 and raised 1.5', () => {
		expect(example.line('back.crotch_extension')).toBeCloseTo(4.5, 9);
		expect(example.line('back.waist_in')).toBeCloseTo(1, 9);
		expect(example.line('back.waist_raise')).toBeCloseTo(1.5, 9);
	});
	it('back waist width equals the front waist width, measured on the slant', () => {
		expect(example.line('back.waist_width')).toBeCloseTo(9, 9);
	});
	it('centre-back zip allowance 10 long × 1 wide', () => {
		expect(example.line('back.zip_allowance_length')).toBeCloseTo(10, 9);
		expect(example.line('back.zip_allowance_width')).toBeCloseTo(1, 9);
	});
	it('waistband cut width = 2 × 1.5 + 2 × 0.5 (→ 4); length = waist + overlap + seams', () => {
		expect(example.line('waistband.cut_width')).toBeCloseTo(4, 9);
		expect(example.line('waistband.length')).toBeCloseTo(28 + 1.5 + 1, 9);
	});
	it('crotch ease option 1 deepens the crotch to 12', () => {
		const looser = draftIn(
			wideLegTrousers,
			'in',
			{ hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
			{ length: 45.5, crotchEase: 1 }
		);
		expect(looser.line('front.crotch_depth')).toBeCloseTo(12, 9);
	});
});

describe('wide-leg trousers — geometry', () => {
	it('front outline spans side seam to crotch point and waist to hem', () => {
		const box = boundingBox(example.pieces[0].outline);
		expect(box.width / 25.4).toBeCloseTo(13.5, 6); // 11 hip width + 2.5 crotch extension
		expect(box.height / 25.4).toBeCloseTo(46, 6);
	});
	it('the back zip allowance sits outside the centre back seam and tapers back into it above the hip line', () => {
		const back = example.pieces.find((p) => p.id === 'back')!;
		const zip = back.marks.find((m) => m.kind === 'zip')!;
		const outward = back.outline.filter((p) => p.y < zip.points[1].y && p.x > zip.points[0].x + 20);
		expect(outward.length).toBeGreaterThanOrEqual(2);
		// Below the zip the outline is back on the centre seam line before the hip line (common practice).
		const steps = back.path!.steps;
		const hipAt = steps.findIndex((s) => s.control) - 1;
		const taper = steps[hipAt - 1].to;
		const centreWaist = steps[0].to;
		const hip = steps[hipAt].to;
		const offLine =
			((hip.x - centreWaist.x) * (taper.y - centreWaist.y) - (hip.y - centreWaist.y) * (taper.x - centreWaist.x)) /
			Math.hypot(hip.x - centreWaist.x, hip.y - centreWaist.y);
		expect(Math.abs(offLine)).toBeLessThan(1e-6);
		expect(taper.y).toBeLessThan(example.line('front.hip_line_depth') * 25.4);
	});
	it('length defaults to waist to floor', () => {
		const fromFloor = draftIn(wideLegTrousers, 'in', {
			hip_girth: 40,
			waist_girth: 28,
			thigh_girth: 25,
			waist_to_floor: 45.5
		});
		expect(fromFloor.line('front.leg_length')).toBeCloseTo(46, 9);
	});
});

describe('wide-leg trousers — properties', () => {
	const girth = (min: number, max: number) => fc.double({ min, max, noNaN: true });
	it('hip-based lines grow with hip girth; waist and thigh widths with their girths', () => {
		fc.assert(
			fc.property(girth(32, 60), girth(0.1, 6), girth(24, 50), girth(18, 34), (hip, grow, waist, thigh) => {
				const a = draftIn(
					wideLegTrousers,
					'in',
					{ hip_girth: hip, waist_girth: waist, thigh_girth: thigh },
					{ length: 40 }
				);
				const b = draftIn(
					wideLegTrousers,
					'in',
					{ hip_girth: hip + grow, waist_girth: waist + grow, thigh_girth: thigh + grow },
					{ length: 40 }
				);
				for (const id of [
					'front.hip_line_depth',
					'front.crotch_depth',
					'front.thigh_line_depth',
					'front.hip_width',
					'front.crotch_extension',
					'front.fold_width',
					'back.crotch_extension',
					'front.waist_width',
					'front.thigh_width',
					'waistband.length'
				]) {
					expect(b.line(id), id).toBeGreaterThan(a.line(id));
				}
				expect(polygonArea(b.pieces[0].outline)).toBeGreaterThan(polygonArea(a.pieces[0].outline));
			}),
			{ numRuns: 60 }
		);
	});
	it('the same body in cm and in gives the same geometry', () => {
		fc.assert(
			fc.property(girth(32, 60), girth(24, 50), girth(18, 34), girth(34, 48), (hip, waist, thigh, length) => {
				const inches = draftIn(
					wideLegTrousers,
					'in',
					{ hip_girth: hip, waist_girth: waist, thigh_girth: thigh },
					{ length }
				);
				const cm = draftIn(
					wideLegTrousers,
					'cm',
					{ hip_girth: hip * 2.54, waist_girth: waist * 2.54, thigh_girth: thigh * 2.54 },
					{ length: length * 2.54 }
				);
				inches.pieces.forEach((piece, i) => {
					piece.outline.forEach((p, j) => {
						expect(p.x).toBeCloseTo(cm.pieces[i].outline[j].x, 6);
						expect(p.y).toBeCloseTo(cm.pieces[i].outline[j].y, 6);
					});
				});
			}),
			{ numRuns: 40 }
		);
	});
});

describe('wide-leg trousers — fits beyond the worked method', () => {
	const body = { hip_girth: 40, waist_girth: 28, thigh_girth: 25 };
	const relaxed = draftIn(wideLegTrousers, 'in', body, { length: 45.5, fit: 'relaxed' });
	const seam = 1;
	const finishedHip = (d: typeof relaxed) =>
		2 * (d.line('front.hip_width') - seam) + 2 * (d.line('back.hip_width') - seam);
	const finishedThigh = (d: typeof relaxed) => d.line('front.thigh_width') + d.line('back.thigh_width') - seam;

	it('the regular fit is the method as taught: no hip or thigh ease, front and back alike (common practice)', () => {
		expect(example.line('front.hip_ease')).toBe(0);
		expect(example.line('front.thigh_ease')).toBe(0);
		expect(finishedHip(example)).toBeCloseTo(40, 9);
		expect(finishedThigh(example)).toBeCloseTo(25, 9);
		expect(example.line('back.hip_width')).toBeCloseTo(example.line('front.hip_width'), 9);
	});
	it('relaxed adds 4 in at the hip (McCunn’s relaxed design ease, the project’s ease table) and 2 in at each thigh (Liechty et al., Fitting & Pattern Alteration: thigh 1½–2 in; from memory)', () => {
		expect(relaxed.line('front.hip_ease')).toBeCloseTo(4, 9);
		expect(relaxed.line('front.thigh_ease')).toBeCloseTo(2, 9);
		expect(finishedHip(relaxed)).toBeCloseTo(40 + 4, 9);
		expect(finishedThigh(relaxed)).toBeCloseTo(25 + 2, 9);
	});
	it('beyond the method the back is 2 cm wider than the front at the hip and 4 cm at the thigh (Aldrich trouser block: ±1 cm on the quarter hip, ±2 cm on the half thigh; from memory)', () => {
		for (const fit of ['relaxed', 'fitted']) {
			const d = draftIn(wideLegTrousers, 'in', body, { length: 45.5, fit });
			expect((d.line('back.hip_width') - d.line('front.hip_width')) * 2.54).toBeCloseTo(2, 9);
			expect((d.line('back.thigh_width') - d.line('front.thigh_width')) * 2.54).toBeCloseTo(4, 9);
		}
	});
	it('every piece still fits the fold width the method asks for', () => {
		for (const d of [example, relaxed]) {
			for (const piece of d.pieces.slice(0, 2)) {
				expect(boundingBox(piece.outline).width / 25.4).toBeLessThanOrEqual(d.line('front.fold_width') + 1e-9);
			}
		}
	});
});

describe('wide-leg trousers — curved crotch seams', () => {
	const front = example.pieces[0];
	const back = example.pieces[1];

	it('draws the crotch seams as Bézier curves, not straight diagonals', () => {
		for (const piece of [front, back]) {
			expect(piece.path!.steps.filter((s) => s.control).length).toBeGreaterThanOrEqual(2);
			expect(pieceSvg(piece, 'in')).toMatch(/<path d="M[^"]* Q/);
		}
	});
	it('the flattened outline stays within 1 mm of the curve at its midpoint (de Casteljau: B(½) = (P0 + 2P1 + P2)/4)', () => {
		for (const piece of [front, back]) {
			let at = piece.path!.start;
			for (const step of piece.path!.steps) {
				if (step.control) {
					const mid = {
						x: (at.x + 2 * step.control.x + step.to.x) / 4,
						y: (at.y + 2 * step.control.y + step.to.y) / 4
					};
					expect(distanceToOutline(mid, piece.outline)).toBeLessThanOrEqual(1);
				}
				at = step.to;
			}
		}
	});
	it('the back centre seam runs into the crotch curve without a corner at the hip line (a tangent-continuous seat seam, common practice)', () => {
		const steps = back.path!.steps;
		const curve = steps.findIndex((s) => s.control);
		const hip = steps[curve - 1].to;
		const zipEnd = steps[curve - 2].to;
		const seam = Math.atan2(hip.y - zipEnd.y, hip.x - zipEnd.x);
		const leaving = Math.atan2(steps[curve].control!.y - hip.y, steps[curve].control!.x - hip.x);
		expect(Math.abs(seam - leaving)).toBeLessThan(1e-6);
		expect(steps[curve].control!.y).toBeCloseTo(example.line('back.crotch_depth') * 25.4, 6);
	});
});

function distanceToOutline(p: Point, outline: readonly Point[]): number {
	let best = Infinity;
	outline.forEach((a, i) => {
		const b = outline[(i + 1) % outline.length];
		const length = distance(a, b) ** 2;
		const t = length ? Math.max(0, Math.min(1, ((p.x - a.x) * (b.x - a.x) + (p.y - a.y) * (b.y - a.y)) / length)) : 0;
		best = Math.min(best, distance(p, { x: a.x + t * (b.x - a.x), y: a.y + t * (b.y - a.y) }));
	});
	return best;
}
