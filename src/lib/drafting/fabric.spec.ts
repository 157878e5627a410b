import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { estimateFabric, fabricWidthPresets, type FabricSpec } from './fabric';
import { pt } from './geometry';
import type { DraftPiece } from './pieces';
import { templates } from './templates/index';
import { draftIn, standardBodyCm } from './templates/test-support';
import { toMm } from './units';

function rect(id: string, w: number, h: number, cut: Partial<DraftPiece['cut']> = {}): DraftPiece {
	return {
		id,
		label: id,
		cut: { quantity: 1, onFold: false, pair: false, grain: 'lengthwise', ...cut },
		outline: [pt(0, 0), pt(w, 0), pt(w, h), pt(0, h)],
		marks: [],
		lines: [],
		grainline: [pt(w / 2, 0), pt(w / 2, h)]
	};
}

const spec = (widthMm: number, extra: Partial<FabricSpec> = {}): FabricSpec => ({
	widthMm,
	folded: true,
	directional: false,
	shrinkagePercent: 0,
	repeatMm: 0,
	...extra
});

describe('fabric estimate', () => {
	it('cuts a pair from one placement on folded cloth and fills it exactly', () => {
		const { estimate } = estimateFabric([rect('leg', 500, 1000, { quantity: 2, pair: true })], spec(1000), 'cm');
		expect(estimate!.placements).toHaveLength(1);
		expect(estimate!.packedMm).toBe(1000);
		expect(estimate!.efficiency).toBeCloseTo(1, 12);
		expect(estimate!.rounded).toMatchObject({ value: 1, buyUnit: 'm' });
	});

	it('keeps cut-on-fold pieces against the fold, and opens them out on open cloth', () => {
		const pieces = [rect('front', 300, 600, { onFold: true }), rect('back', 300, 600, { onFold: true })];
		const folded = estimateFabric(pieces, spec(1000), 'cm').estimate!;
		expect(folded.placements.every((p) => p.x === 0)).toBe(true);
		expect(folded.packedMm).toBe(1200);
		const open = estimateFabric(pieces, spec(1000, { folded: false }), 'cm').estimate!;
		expect(open.placements.every((p) => p.w === 600 && p.unfolded)).toBe(true);
		expect(open.packedMm).toBe(1200);
	});

	it('opens the cloth when a piece is too wide for it folded, and gives up when it is too wide open', () => {
		const wide = [rect('panel', 600, 500)];
		const opened = estimateFabric(wide, spec(1000), 'cm');
		expect(opened.estimate!.folded).toBe(false);
		expect(opened.warnings[0].code).toBe('fabric_too_narrow');
		const refused = estimateFabric([rect('panel', 1100, 500)], spec(1000), 'cm');
		expect(refused.estimate).toBeNull();
		expect(refused.warnings.some((w) => w.message.includes('panel (110 cm)'))).toBe(true);
	});

	it('adds shrinkage to the length and takes it off the width (common practice)', () => {
		const { estimate } = estimateFabric(
			[rect('leg', 475, 1000, { quantity: 2, pair: true })],
			spec(1000, { shrinkagePercent: 5 }),
			'cm'
		);
		expect(estimate!.layWidthMm).toBeCloseTo(475, 9);
		expect(estimate!.lengthMm).toBeCloseTo(1000 / 0.95, 9);
		expect(estimate!.rounded.value).toBe(1.1);
	});

	it('starts every piece on a pattern repeat', () => {
		const { estimate } = estimateFabric(
			[rect('a', 400, 250), rect('b', 400, 250), rect('c', 400, 250)],
			spec(800),
			'in'
		);
		const repeated = estimateFabric(
			[rect('a', 400, 250), rect('b', 400, 250), rect('c', 400, 250)],
			spec(800, { repeatMm: 320 }),
			'in'
		).estimate!;
		for (const p of repeated.placements) expect(p.y % 320).toBeCloseTo(0, 9);
		expect(repeated.packedMm).toBeGreaterThan(estimate!.packedMm);
	});

	it('rounds up to 1/8 yd when the person works in inches (the usual buying step, common practice)', () => {
		const { estimate } = estimateFabric([rect('leg', 500, 1000)], spec(1100), 'in');
		expect(estimate!.rounded).toMatchObject({ value: 1.125, buyUnit: 'yd', display: '1 1/8 yd' });
	});
});

describe('every garment on every preset width (property)', () => {
	it('keeps every placement inside the cloth and never below the longest piece', () => {
		const unitArb = fc.constantFrom('in' as const, 'cm' as const);
		fc.assert(
			fc.property(
				fc.constantFrom(...Object.values(templates)),
				fc.double({ min: 0.85, max: 1.35, noNaN: true }),
				unitArb,
				fc.boolean(),
				(template, scale, unit, folded) => {
					const body = Object.fromEntries(
						Object.entries(standardBodyCm).map(([k, v]) => [k, k.endsWith('girth') ? v * scale : v])
					);
					const draft = draftIn(template, 'cm', body);
					for (const width of fabricWidthPresets[unit]) {
						const { estimate } = estimateFabric(draft.pieces, spec(toMm(width, unit), { folded }), unit);
						if (!estimate) continue;
						for (const p of estimate.placements) {
							expect(p.x).toBeGreaterThanOrEqual(0);
							expect(p.x + p.w).toBeLessThanOrEqual(estimate.layWidthMm + 1e-6);
						}
						const longest = Math.max(...estimate.placements.map((p) => p.h));
						expect(estimate.packedMm).toBeGreaterThanOrEqual(longest);
						expect(estimate.efficiency).toBeGreaterThan(0);
						expect(estimate.efficiency).toBeLessThanOrEqual(1);
						expect(estimate.rounded.mm).toBeGreaterThanOrEqual(estimate.lengthMm - 1e-9);
					}
				}
			),
			{ numRuns: 40 }
		);
	});
});

describe('fabric estimate — what the layout alone does not say', () => {
	it('tells the cutter to cut a “cut 1” piece single on folded cloth (common practice: cutting layouts mark single-layer pieces)', () => {
		const pieces = [rect('front', 300, 600, { onFold: true }), rect('band', 100, 800)];
		const folded = estimateFabric(pieces, spec(1400), 'cm').estimate!;
		expect(folded.notes).toHaveLength(1);
		expect(folded.notes[0]).toMatch(/^band: cut 1 .*cut single/);
		expect(estimateFabric(pieces, spec(1400, { folded: false }), 'cm').estimate!.notes).toEqual([]);
	});

	it('reports the shrinkage it allowed for, and the length before it', () => {
		// 10 % shrinkage on a 1 m layout needs 1 m ÷ 0.9 of cloth (the length shrinks with the width).
		const estimate = estimateFabric([rect('leg', 400, 1000)], spec(1000, { shrinkagePercent: 10 }), 'cm').estimate!;
		expect(estimate.shrinkagePercent).toBeCloseTo(10, 12);
		expect(estimate.lengthMm).toBeCloseTo(estimate.packedMm / 0.9, 9);
	});
});

describe('fabric estimate — nap', () => {
	// A gored panel 200 wide at the top, 400 at the hem: two laid head to tail take 600, side by side 800.
	const gore: DraftPiece = {
		...rect('gore', 400, 1000, { quantity: 2 }),
		outline: [pt(0, 0), pt(200, 0), pt(400, 1000), pt(0, 1000)]
	};

	it('without nap lays copies head to tail where that saves cloth; with nap all lie one way, so it takes more (common practice: “with nap” layouts lay every piece the same way up)', () => {
		const without = estimateFabric([gore], spec(700, { folded: false }), 'cm').estimate!;
		const withNap = estimateFabric([gore], spec(700, { folded: false, directional: true }), 'cm').estimate!;
		expect(without.packedMm).toBe(1000);
		expect(without.placements).toHaveLength(1);
		expect(without.placements[0]).toMatchObject({ w: 600, yields: 2 });
		expect(withNap.packedMm).toBe(2000);
		expect(withNap.rounded.mm).toBeGreaterThan(without.rounded.mm);
	});

	it('turns the second copy end for end, its outline touching the first along the slant', () => {
		const [placed] = estimateFabric([gore], spec(700, { folded: false }), 'cm').estimate!.placements;
		expect(placed.shapes).toHaveLength(2);
		expect(placed.shapes[1]).toEqual([pt(600, 1000), pt(400, 1000), pt(200, 0), pt(600, 0)]);
	});

	it('is never shorter with nap, for every garment, width and fold (property)', () => {
		fc.assert(
			fc.property(
				fc.constantFrom(...Object.values(templates)),
				fc.constantFrom(...fabricWidthPresets.cm, ...fabricWidthPresets.in.map((w) => w * 2.54)),
				fc.boolean(),
				(template, widthCm, folded) => {
					const pieces = draftIn(template, 'cm', standardBodyCm).pieces;
					const without = estimateFabric(pieces, spec(widthCm * 10, { folded }), 'cm').estimate;
					const withNap = estimateFabric(pieces, spec(widthCm * 10, { folded, directional: true }), 'cm').estimate;
					if (!without || !withNap) return;
					expect(withNap.rounded.mm).toBeGreaterThanOrEqual(without.rounded.mm);
				}
			),
			{ numRuns: 40 }
		);
	});
});

describe('fabric estimate — a long band cut another way', () => {
	const band = (): DraftPiece => ({
		...rect('band', 100, 1000),
		label: 'Waistband',
		mayCut: { crosswise: true, inTwo: { joinMm: 15 } }
	});

	it('on folded cloth cuts the band in two with a join allowance when that buys less (common practice)', () => {
		const pieces = [rect('front', 400, 600, { onFold: true }), band()];
		const estimate = estimateFabric(pieces, spec(1400), 'cm').estimate!;
		// Two halves of 500 + 15 mm lie beside the front, through both layers at once.
		expect(estimate.packedMm).toBe(600);
		const halves = estimate.placements.find((p) => p.pieceId === 'band')!;
		expect(halves).toMatchObject({ h: 515, yields: 2 });
		expect(estimate.notes[0]).toMatch(/^Waistband: cut in two pieces, each half the length plus 1\.5 cm to join/);
		expect(estimate.notes.join(' ')).not.toMatch(/cut single/);
	});

	it('on open cloth cuts it across the grain when that buys as little, without a join', () => {
		const pieces = [rect('front', 300, 600), band()];
		const estimate = estimateFabric(pieces, spec(1400, { folded: false }), 'cm').estimate!;
		expect(estimate.packedMm).toBe(600);
		expect(estimate.placements.find((p) => p.pieceId === 'band')).toMatchObject({ w: 1000, h: 100 });
		expect(estimate.notes[0]).toMatch(/^Waistband: cut across the cloth \(crosswise grain\)/);
	});

	it('keeps the band whole when another way buys no less', () => {
		const pieces = [rect('front', 300, 1000, { onFold: true }), band()];
		const estimate = estimateFabric(pieces, spec(1400), 'cm').estimate!;
		expect(estimate.placements.find((p) => p.pieceId === 'band')).toMatchObject({ w: 100, h: 1000 });
		expect(estimate.notes).toEqual([expect.stringMatching(/^Waistband: cut 1 .*cut single/)]);
	});
});
