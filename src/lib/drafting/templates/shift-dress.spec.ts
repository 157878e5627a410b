import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { boundingBox } from '../geometry';
import { shiftDress } from './shift-dress';
import { draftIn, standardBodyCm } from './test-support';

const inch = 25.4;
const seam = (5 / 8) * inch;
const { stature, neck_girth, thigh_girth, knee_girth, ankle_girth, wrist_girth, ...rest } = standardBodyCm;
const body = rest;

const finishedEase = (draft: ReturnType<typeof draftIn>, line: string, girthCm: number) =>
	(4 * (draft.line(line) * 10 - seam) - girthCm * 10) / inch;

describe('shift dress — wearing ease', () => {
	it('fitted and regular bust ease lie in the CWU bodice range 1½–2 in', () => {
		for (const fit of ['fitted', 'regular']) {
			const ease = finishedEase(draftIn(shiftDress, 'cm', body, { fit }), 'front.bust_width', body.bust_girth);
			expect(ease).toBeGreaterThanOrEqual(1.5 - 1e-9);
			expect(ease).toBeLessThanOrEqual(2 + 1e-9);
		}
	});
	it('relaxed bust ease is McCunn’s 4 in fitting ease (How to Make Sewing Patterns)', () => {
		expect(
			finishedEase(draftIn(shiftDress, 'cm', body, { fit: 'relaxed' }), 'front.bust_width', body.bust_girth)
		).toBeCloseTo(4, 9);
	});
	it('hip ease lies in the CWU range 2–2¾ in; the waist is looser than the CWU dress minimum ¾ in', () => {
		const draft = draftIn(shiftDress, 'cm', body);
		const hip = finishedEase(draft, 'front.hip_width', body.hip_girth);
		expect(hip).toBeGreaterThanOrEqual(2 - 1e-9);
		expect(hip).toBeLessThanOrEqual(2.75 + 1e-9);
		expect(finishedEase(draft, 'front.waist_width', body.waist_girth)).toBeGreaterThan(0.75);
	});
});

describe('shift dress — bust dart', () => {
	it('is 1 in for a B cup (bust − under bust 15 cm; EN 13402-3 B = (14, 16] cm) and grows with the cup (common practice)', () => {
		const b = draftIn(shiftDress, 'cm', body);
		expect(b.line('front.dart_intake')).toBeCloseTo(2.54, 9);
		const d = draftIn(shiftDress, 'cm', { ...body, under_bust_girth: 69 });
		expect(d.line('front.dart_intake')).toBeGreaterThan(b.line('front.dart_intake'));
	});
	it('makes the front longer than the back by the dart intake, taken up at the side seam', () => {
		const draft = draftIn(shiftDress, 'cm', body);
		const [front, back] = draft.pieces;
		// Both pieces start at the shoulder line, so the whole difference in height is the dart intake.
		const extra = boundingBox(front.outline).height - boundingBox(back.outline).height;
		expect(extra).toBeCloseTo(draft.line('front.dart_intake') * 10, 6);
	});
	it('points the dart at the bust point, one inch short of it', () => {
		const draft = draftIn(shiftDress, 'cm', body);
		const dart = draft.pieces[0].marks.find((m) => m.kind === 'dart')!;
		expect(dart.points[1].x).toBeCloseTo((body.bust_point_span / 2) * 10 + inch, 9);
		expect(dart.points[1].y).toBeCloseTo(body.shoulder_to_bust_point * 10, 9);
	});
});

describe('shift dress — properties', () => {
	it('widths grow with their girths; cm and in give the same outline', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 80, max: 130, noNaN: true }),
				fc.double({ min: 0.5, max: 8, noNaN: true }),
				(bust, grow) => {
					const base = {
						...body,
						bust_girth: bust,
						under_bust_girth: bust - 15,
						hip_girth: bust + 8,
						waist_girth: bust - 16
					};
					const bigger = {
						...base,
						bust_girth: bust + grow,
						under_bust_girth: bust + grow - 15,
						hip_girth: bust + 8 + grow,
						waist_girth: bust - 16 + grow
					};
					const a = draftIn(shiftDress, 'cm', base);
					const b = draftIn(shiftDress, 'cm', bigger);
					for (const id of ['front.bust_width', 'front.hip_width', 'back.bust_width', 'front.armhole_depth'])
						expect(b.line(id), id).toBeGreaterThan(a.line(id));
					const inches = draftIn(
						shiftDress,
						'in',
						Object.fromEntries(Object.entries(base).map(([k, v]) => [k, v / 2.54])),
						{ length: 95 / 2.54 }
					);
					a.pieces[0].outline.forEach((p, i) => expect(p.y).toBeCloseTo(inches.pieces[0].outline[i].y, 6));
				}
			),
			{ numRuns: 40 }
		);
	});
});

describe('shift dress — datums from the nape (Aldrich, Metric Pattern Cutting for Women’s Wear, close-fitting bodice block)', () => {
	// The block squares its scye depth, nape-to-waist and waist-to-hip lines down from the nape (centre back neck).
	const draft = draftIn(shiftDress, 'cm', body);
	const back = draft.pieces[1];
	const napeY = back.lines.find((l) => l.id === 'nape_to_waist')!.dimension!.from.y;
	const guide = (label: string) => back.marks.find((m) => m.label === label)!.points[0].y;
	it('puts the nape on the centre back neck line', () => {
		const centreBackNeck = back.outline.find((p) => p.x === 0)!;
		expect(centreBackNeck.y + seam).toBeCloseTo(napeY, 9);
	});
	it('measures the waist line by nape to waist and the hip line by waist to hip below it', () => {
		expect(guide('waist line') - napeY).toBeCloseTo(body.nape_to_waist * 10, 9);
		expect(guide('hip line') - guide('waist line')).toBeCloseTo(body.waist_to_hip * 10, 9);
	});
	it('measures the armhole depth (scye depth) from the nape', () => {
		const underarm = back.lines.find((l) => l.id === 'bust_width')!.dimension!.to;
		expect(underarm.y - napeY).toBeCloseTo(draft.line('back.armhole_depth') * 10, 9);
	});
});

describe('shift dress — ease over every girth (CWU "Ch. 16 Ease in Clothing": dress waist ¾–1 in, hip 2–2¾ in)', () => {
	it('gives at least the minimum ease at bust, waist and hip for any plausible body, waist larger than hip included (property)', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 80, max: 140, noNaN: true }),
				fc.double({ min: 55, max: 150, noNaN: true }),
				fc.double({ min: 80, max: 150, noNaN: true }),
				(bust, waist, hip) => {
					const d = draftIn(shiftDress, 'cm', {
						...body,
						bust_girth: bust,
						under_bust_girth: bust - 15,
						waist_girth: waist,
						hip_girth: hip
					});
					for (const [line, girth, min] of [
						['front.bust_width', bust, 1.5],
						['front.waist_width', waist, 0.75],
						['front.hip_width', hip, 2]
					] as const)
						expect(finishedEase(d, line, girth), line).toBeGreaterThanOrEqual(min - 1e-6);
				}
			),
			{ numRuns: 200 }
		);
	});
});
