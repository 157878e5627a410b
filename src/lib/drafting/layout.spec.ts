import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { packFfdh, packNfdh, packSkyline, packStrip, type PackResult, type RectItem } from './layout';
import { hopperTurtonC1P1 } from './strip-packing-instances';

// Hopper & Turton (2001) class C, instance C1-P1: OPT = A/W = 20, h_max = 12.
const c1p1: RectItem[] = hopperTurtonC1P1.items;

function overlaps(a: { x: number; y: number; w: number; h: number }, b: typeof a): boolean {
	const eps = 1e-9;
	return a.x < b.x + b.w - eps && b.x < a.x + a.w - eps && a.y < b.y + b.h - eps && b.y < a.y + a.h - eps;
}

function expectValid(result: PackResult, items: RectItem[]) {
	const expected = items.reduce((n, it) => n + (it.quantity ?? 1), 0);
	expect(result.placements).toHaveLength(expected);
	for (const p of result.placements) {
		expect(p.x).toBeGreaterThanOrEqual(-1e-9);
		expect(p.y).toBeGreaterThanOrEqual(-1e-9);
		expect(p.x + p.w).toBeLessThanOrEqual(result.width + 1e-9);
		expect(p.y + p.h).toBeLessThanOrEqual(result.length + 1e-9);
		const it = items[p.item];
		const dims = p.rotated ? [it.h, it.w] : [it.w, it.h];
		expect([p.w, p.h]).toEqual(dims);
		if (it.anchorLeft) expect(p.x).toBe(0);
	}
	for (let i = 0; i < result.placements.length; i++) {
		for (let j = i + 1; j < result.placements.length; j++) {
			expect(overlaps(result.placements[i], result.placements[j])).toBe(false);
		}
	}
}

describe('Hopper–Turton C1-P1 (W = 20, OPT = 20)', () => {
	it('NFDH and FFDH give 25 with items sorted by height, no rotation (reproduced from the 2DPackLib instance)', () => {
		expect(packNfdh(c1p1, 20).length).toBe(25);
		expect(packFfdh(c1p1, 20).length).toBe(25);
	});

	it('stays within the proven bounds: 20 ≤ NFDH ≤ 2·20 + 12, 20 ≤ FFDH ≤ 1.7·20 + 12', () => {
		// Coffman, Garey, Johnson & Tarjan (1980): NFDH ≤ 2·OPT + h_max, FFDH ≤ 1.7·OPT + h_max.
		const nfdh = packNfdh(c1p1, 20);
		const ffdh = packFfdh(c1p1, 20);
		expect(nfdh.lowerBound).toBe(20);
		expect(nfdh.length).toBeGreaterThanOrEqual(20);
		expect(nfdh.length).toBeLessThanOrEqual(52);
		expect(ffdh.length).toBeGreaterThanOrEqual(20);
		expect(ffdh.length).toBeLessThanOrEqual(46);
		expectValid(nfdh, c1p1);
		expectValid(ffdh, c1p1);
	});

	it('packStrip is never worse than FFDH and never below OPT', () => {
		const best = packStrip(c1p1, 20);
		expectValid(best, c1p1);
		expect(best.length).toBeLessThanOrEqual(25);
		expect(best.length).toBeGreaterThanOrEqual(20);
		expect(best.efficiency).toBeCloseTo(400 / (20 * best.length), 12);
	});
});

describe('four 5×5 squares in a strip 10 wide (hand check: OPT = A/W = 10)', () => {
	const squares: RectItem[] = [{ w: 5, h: 5, quantity: 4 }];
	it('NFDH = FFDH = packStrip = 10 with full efficiency', () => {
		expect(packNfdh(squares, 10).length).toBe(10);
		expect(packFfdh(squares, 10).length).toBe(10);
		const best = packStrip(squares, 10);
		expect(best.length).toBe(10);
		expect(best.efficiency).toBe(1);
		expectValid(best, squares);
	});
});

describe('rotation, anchoring and repeats', () => {
	it('turns a long piece across the strip only when rotation is "any"', () => {
		const strip = [
			{ w: 2, h: 10 },
			{ w: 8, h: 2 }
		];
		expect(
			packStrip(
				strip.map((r) => ({ ...r, rotate: 'none' as const })),
				10
			).length
		).toBe(10);
		const turned = packStrip(
			strip.map((r) => ({ ...r, rotate: 'any' as const })),
			10
		);
		expect(turned.length).toBe(4);
		expect(turned.placements.some((p) => p.rotated)).toBe(true);
	});

	it('a 180° turn never changes a rectangle’s footprint', () => {
		const items: RectItem[] = [
			{ w: 3, h: 7, rotate: '180' },
			{ w: 6, h: 4, rotate: '180' }
		];
		expect(packStrip(items, 10).length).toBe(
			packStrip(
				items.map((i) => ({ ...i, rotate: 'none' })),
				10
			).length
		);
		expect(packStrip(items, 10).placements.every((p) => !p.rotated)).toBe(true);
	});

	it('keeps anchored (cut-on-fold) pieces against the left edge', () => {
		const items: RectItem[] = [
			{ w: 4, h: 6 },
			{ w: 3, h: 5, anchorLeft: true, quantity: 2 },
			{ w: 5, h: 3 }
		];
		for (const result of [packFfdh(items, 10), packSkyline(items, 10), packStrip(items, 10)])
			expectValid(result, items);
	});

	it('starts every piece on a pattern repeat', () => {
		const items: RectItem[] = [
			{ w: 6, h: 7 },
			{ w: 6, h: 7 },
			{ w: 3, h: 2, quantity: 3 }
		];
		const result = packStrip(items, 10, { yStep: 8 });
		expectValid(result, items);
		for (const p of result.placements) expect(p.y % 8).toBe(0);
	});

	it('refuses an item wider than the strip', () => {
		expect(() => packStrip([{ w: 11, h: 1 }], 10)).toThrow(RangeError);
		expect(packStrip([{ w: 11, h: 1, rotate: 'any' }], 10).length).toBe(11);
	});
});

describe('properties over random instances', () => {
	const instance = fc.record({
		width: fc.integer({ min: 10, max: 60 }),
		items: fc.array(
			fc.record({
				w: fc.integer({ min: 1, max: 10 }),
				h: fc.integer({ min: 1, max: 30 }),
				quantity: fc.integer({ min: 1, max: 3 })
			}),
			{ minLength: 1, maxLength: 25 }
		)
	});

	it('never below max(A/W, h_max); FFDH and NFDH within 2·A/W + h_max; packStrip ≤ FFDH; all inside the width', () => {
		fc.assert(
			fc.property(instance, ({ width, items }) => {
				const area = items.reduce((s, it) => s + it.w * it.h * it.quantity, 0);
				const tallest = Math.max(...items.map((it) => it.h));
				const bound = Math.max(area / width, tallest);
				const ffdh = packFfdh(items, width);
				const nfdh = packNfdh(items, width);
				const best = packStrip(items, width);
				for (const result of [ffdh, nfdh, best]) {
					expect(result.lowerBound).toBeCloseTo(bound, 9);
					expect(result.length).toBeGreaterThanOrEqual(bound - 1e-9);
					expect(result.efficiency).toBeLessThanOrEqual(1 + 1e-9);
				}
				// The level-algorithm argument of Coffman et al. (1980) bounds both by 2·A/W + h_max.
				expect(ffdh.length).toBeLessThanOrEqual(2 * (area / width) + tallest + 1e-9);
				expect(nfdh.length).toBeLessThanOrEqual(2 * (area / width) + tallest + 1e-9);
				expect(best.length).toBeLessThanOrEqual(ffdh.length + 1e-9);
				expectValid(best, items);
			}),
			{ numRuns: 150 }
		);
	});
});
