import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { estimateFabric } from '../fabric';
import { boundingBox } from '../geometry';
import { croppedTop, ellipsePerimeter } from './cropped-top';
import { draftIn } from './test-support';

// The working dressmaker's cropped-top method, worked in inches (common practice): bust 36, shoulder width
// 15, shoulder to bust point 9.5, bust point span 7, finished length 18, fabric folded in four.
const body = { bust_girth: 36, shoulder_width: 15, shoulder_to_bust_point: 9.5, bust_point_span: 7 };
const example = draftIn(croppedTop, 'in', body, { length: 18 });

describe('cropped top — the dressmaker’s method (common practice)', () => {
	it('fold width = quarter bust + 7', () => {
		expect(example.line('front.fold_width')).toBeCloseTo(9 + 7, 9);
	});
	// The method gives the neckline as 4 wide and 4 deep. 4 deep is a front neck: a bodice block drops the back
	// neck only about 2 cm below the neck-point line (Aldrich, Metric Pattern Cutting for Women's Wear,
	// close-fitting bodice block; from memory), so the back keeps the width and takes the block's depth.
	it('neckline 4 wide front and back, 4 deep at the front, the block’s 2 cm at the back', () => {
		expect(example.line('front.neck_width')).toBeCloseTo(4, 9);
		expect(example.line('front.neck_depth')).toBeCloseTo(4, 9);
		expect(example.line('back.neck_width')).toBeCloseTo(4, 9);
		expect(example.line('back.neck_depth') * 2.54).toBeCloseTo(2, 9);
	});
	it('shoulder point at half the shoulder width from the fold', () => {
		expect(example.line('front.shoulder_point')).toBeCloseTo(7.5, 9);
	});
	it('sleeve = 6 + 1 seam allowance beyond the shoulder point (→ 7), end dropping 1', () => {
		expect(example.line('front.sleeve_length')).toBeCloseTo(7, 9);
		expect(example.line('front.sleeve_drop')).toBeCloseTo(1, 9);
	});
	it('sleeve opening 6 down from the sloped end; sleeve hem turned twice, 1', () => {
		expect(example.line('front.sleeve_opening')).toBeCloseTo(6, 9);
		expect(example.line('front.sleeve_hem')).toBeCloseTo(1, 9);
	});
	it('bust line at the shoulder-to-bust-point depth (9.5 → 9.5)', () => {
		expect(example.line('front.bust_line_depth')).toBeCloseTo(9.5, 9);
	});
	it('width at bust line = quarter bust + 1 ease + 1 seam allowance, the same at the hem', () => {
		expect(example.line('front.bust_width')).toBeCloseTo(11, 9);
		expect(example.line('front.hem_width')).toBeCloseTo(11, 9);
		expect(example.line('front.waist_shaping')).toBeCloseTo(1.5, 9);
	});
	it('piece length = length + hem', () => {
		expect(example.line('front.piece_length')).toBeCloseTo(19, 9);
	});
	it('bust dart centred half the span from the centre front (7 → 3.5), 5 long, 1 wide', () => {
		expect(example.line('front.dart_position')).toBeCloseTo(3.5, 9);
		expect(example.line('front.dart_length')).toBeCloseTo(5, 9);
		expect(example.line('front.dart_width')).toBeCloseTo(1, 9);
		const dart = example.pieces[0].marks.find((m) => m.kind === 'dart')!;
		expect((dart.points[2].x - dart.points[0].x) / 25.4).toBeCloseTo(1, 9);
	});
	it('only the front carries the dart', () => {
		expect(example.pieces[1].marks.some((m) => m.kind === 'dart')).toBe(false);
		expect(() => example.line('back.dart_position')).toThrow();
	});
});

describe('cropped top — geometry', () => {
	it('both body pieces are cut on the fold and fit inside the fold width', () => {
		for (const piece of example.pieces.slice(0, 2)) {
			expect(piece.cut.onFold).toBe(true);
			const box = boundingBox(piece.outline);
			expect(box.x).toBeCloseTo(0, 9);
			expect(box.width / 25.4).toBeLessThanOrEqual(16);
			expect(box.width / 25.4).toBeCloseTo(14.5, 6); // 7.5 shoulder point + 7 sleeve
		}
	});
	it('the default neckline passes over the head; a tiny one is flagged', () => {
		expect(example.warnings).toEqual([]);
		const tight = draftIn(croppedTop, 'in', body, { length: 18, neckWidth: 2.5, neckDepth: 2 });
		expect(tight.warnings.map((w) => w.fields)).toContainEqual(['neckWidth', 'neckDepth']);
	});
});

describe('cropped top — properties', () => {
	it('bust width and fold width grow with bust; dart position with span', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 30, max: 52, noNaN: true }),
				fc.double({ min: 0.1, max: 5, noNaN: true }),
				(bust, grow) => {
					const a = draftIn(croppedTop, 'in', { ...body, bust_girth: bust });
					const b = draftIn(croppedTop, 'in', { ...body, bust_girth: bust + grow, bust_point_span: 7 + grow / 4 });
					expect(b.line('front.bust_width')).toBeGreaterThan(a.line('front.bust_width'));
					expect(b.line('front.fold_width')).toBeGreaterThan(a.line('front.fold_width'));
					expect(b.line('front.dart_position')).toBeGreaterThan(a.line('front.dart_position'));
				}
			),
			{ numRuns: 60 }
		);
	});
	it('the same body in cm and in gives the same geometry', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 30, max: 52, noNaN: true }),
				fc.double({ min: 13, max: 18, noNaN: true }),
				(bust, shoulder) => {
					const inches = draftIn(croppedTop, 'in', { ...body, bust_girth: bust, shoulder_width: shoulder });
					const cm = draftIn(croppedTop, 'cm', {
						bust_girth: bust * 2.54,
						shoulder_width: shoulder * 2.54,
						shoulder_to_bust_point: 9.5 * 2.54,
						bust_point_span: 7 * 2.54
					});
					inches.pieces[0].outline.forEach((p, j) => {
						expect(p.x).toBeCloseTo(cm.pieces[0].outline[j].x, 6);
						expect(p.y).toBeCloseTo(cm.pieces[0].outline[j].y, 6);
					});
				}
			),
			{ numRuns: 40 }
		);
	});
});

describe('cropped top — the card says how the layout folds the cloth', () => {
	it('describes one lengthwise fold, as the layout lays both pieces against it (common practice)', () => {
		const draft = draftIn(croppedTop, 'in', body, { length: 18 });
		const text = [croppedTop.summary, ...draft.notes].join(' ');
		expect(text).not.toMatch(/four/);
		expect(text).toMatch(/lengthwise fold/);
		const { estimate } = estimateFabric(
			draft.pieces,
			{ widthMm: 45 * 25.4, folded: true, directional: false, shrinkagePercent: 0, repeatMm: 0 },
			'in'
		);
		expect(estimate!.folded).toBe(true);
		for (const p of estimate!.placements) expect(p.x).toBe(0);
	});
});

describe('cropped top — a neck that passes over the head', () => {
	it('measures the neck with Ramanujan’s ellipse perimeter (a circle of radius 1 gives 2π; a = 5, b = 3 gives 25.527)', () => {
		// Ramanujan (1914) first approximation; an ellipse 5 × 3 has perimeter 25.5270 to 4 places.
		expect(ellipsePerimeter(1, 1)).toBeCloseTo(2 * Math.PI, 12);
		expect(ellipsePerimeter(5, 3)).toBeCloseTo(25.527, 3);
	});
	it('opens the centre back when the shallower back neck leaves the opening under an adult head girth (54–58 cm, from memory)', () => {
		// 4 × 4 in front, 4 in × 2 cm back: 53.2 cm round the neck, short of 56 cm.
		const back = example.pieces[1];
		const slit = back.marks.find((m) => m.kind === 'slit')!;
		expect(slit.points[0].x).toBe(0);
		expect(example.line('back.back_opening')).toBeCloseTo(4, 9);
		expect(example.notes.join(' ')).toMatch(/slit the centre back/);
		expect(example.pieces[0].marks.some((m) => m.kind === 'slit')).toBe(false);
	});
	it('leaves the back whole when the neck is wide enough on its own', () => {
		const wide = draftIn(croppedTop, 'in', body, { length: 18, neckWidth: 5, neckDepth: 5 });
		expect(wide.pieces[1].marks.some((m) => m.kind === 'slit')).toBe(false);
		expect(wide.warnings).toEqual([]);
	});
});
