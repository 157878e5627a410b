import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { wearingEase } from '../ease';
import { draftIn, standardBodyCm } from './test-support';
import { tunic } from './tunic';

const inch = 25.4;
const body = {
	bust_girth: standardBodyCm.bust_girth,
	hip_girth: standardBodyCm.hip_girth,
	shoulder_width: standardBodyCm.shoulder_width
};

describe('tunic / kaftan', () => {
	const draft = draftIn(tunic, 'cm', body);
	it('carries at least 30 % more ease than a set-in sleeve, as dolman sleeves need (Gupta & Zakaria, Anthropometry, Apparel Sizing and Design, ch. 9: +20–30 %)', () => {
		for (const fit of ['fitted', 'regular', 'relaxed']) {
			const d = draftIn(tunic, 'cm', body, { fit });
			const ease = 4 * (d.line('front.body_width') * 10 - (5 / 8) * inch) - body.hip_girth * 10;
			expect(ease).toBeGreaterThanOrEqual(1.3 * wearingEase.regular.bust);
		}
	});
	it('always carries the neck-cord caution, naming EN 14682 and 16 CFR 1120', () => {
		expect(draft.cautions).toHaveLength(1);
		expect(draft.cautions[0].message).toContain('EN 14682');
		expect(draft.cautions[0].message).toContain('16 CFR 1120');
	});
	it('has a neck opening that passes over an adult head by default', () => {
		expect(draft.warnings).toEqual([]);
	});
	it('warns when the sleeve is tight on the upper arm', () => {
		const tight = draftIn(tunic, 'cm', { ...body, upper_arm_girth: 40 }, { sleeveOpening: 6 * 2.54 });
		expect(tight.warnings.map((w) => w.fields)).toContainEqual(['options.sleeveOpening', 'upper_arm_girth']);
	});
	it('marks the ties on the neck slit only when asked', () => {
		const withTies = draftIn(tunic, 'cm', body, { neckTies: true });
		expect(withTies.pieces[0].marks.some((m) => m.label === 'neck slit, ties')).toBe(true);
		expect(draft.pieces[0].marks.some((m) => m.label === 'neck slit, ties')).toBe(false);
	});
	it('body width follows the larger of bust and hip (property)', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 80, max: 140, noNaN: true }),
				fc.double({ min: 80, max: 150, noNaN: true }),
				fc.double({ min: 0.5, max: 10, noNaN: true }),
				(bust, hip, grow) => {
					const a = draftIn(tunic, 'cm', { ...body, bust_girth: bust, hip_girth: hip });
					const b = draftIn(tunic, 'cm', { ...body, bust_girth: bust + grow, hip_girth: hip + grow });
					expect(b.line('front.body_width')).toBeGreaterThan(a.line('front.body_width'));
					expect(b.line('front.body_width') - a.line('front.body_width')).toBeCloseTo(grow / 4, 9);
				}
			),
			{ numRuns: 50 }
		);
	});
	it('gives the overarm and underarm edges their seam allowance: finished opening = cut edge − 2 seams (common practice: every seamed edge carries its allowance)', () => {
		const d = draftIn(tunic, 'cm', body, { sleeveOpening: 9 * 2.54 });
		const sleeveEnd = d.line('front.sleeve_end') * 10;
		const edge = d.pieces[0].outline.filter((p) => Math.abs(p.x - sleeveEnd) < 1e-9).map((p) => p.y);
		const cut = Math.max(...edge) - Math.min(...edge);
		expect(cut - 2 * (5 / 8) * inch).toBeCloseTo(9 * inch, 9);
		expect(d.line('front.sleeve_opening')).toBeCloseTo(9 * 2.54, 9);
	});
});
