import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultFabricSpec, estimateFabric, type FabricSpec } from '../fabric';
import { boundingBox, distance, mirrorX, polygonArea, pt, type Point } from '../geometry';
import { packStrip } from '../layout';
import type { DraftPiece } from '../pieces';
import { templates } from '../templates/index';
import { draftIn, standardBodyCm } from '../templates/test-support';
import { markerItems, nestFabricEstimate } from './fabric';
import { nestMarker, type MarkerItem, type MarkerResult } from './nest';
import { areaOutside, curvedRuns, overlapArea, reachOf } from './polygons';
import { markerItem } from './test-support';

const item = markerItem;

/** A right triangle with legs `a` across and `b` along the cloth. */
const triangle = (a: number, b: number) => [pt(0, 0), pt(a, 0), pt(0, b)];

function signedArea(points: readonly Point[]): number {
	let twice = 0;
	points.forEach((p, i) => {
		const q = points[(i + 1) % points.length];
		twice += p.x * q.y - q.x * p.y;
	});
	return twice / 2;
}

/** Lengths of the sides in order; a turn or a shift leaves them as they are. */
const sides = (points: readonly Point[]) => points.map((p, i) => distance(p, points[(i + 1) % points.length]));

function expectSound(result: MarkerResult, gapMm: number) {
	const outlines = result.placements.map((p) => p.outline);
	for (const outline of outlines) {
		// Inside the cloth: nothing past either selvedge (or the fold) or before the cut end.
		expect(areaOutside(outline, result.width, result.length)).toBeLessThan(0.01);
	}
	for (let i = 0; i < outlines.length; i++) {
		for (let j = i + 1; j < outlines.length; j++) {
			// No overlap; the tolerance is the hundredth-of-a-millimetre grid the polygons are held on.
			expect(overlapArea(outlines[i], outlines[j])).toBeLessThan(0.01);
		}
	}
	if (gapMm > 0) {
		// The cutting gap: whatever lies within just under the gap of a curve belongs to no other piece
		// (straight runs may share a cutting line, so only the curves carry the gap).
		for (let i = 0; i < outlines.length; i++) {
			const reach = reachOf(curvedRuns(outlines[i]), gapMm - 0.05);
			for (let j = 0; j < outlines.length; j++) {
				if (i !== j) for (const r of reach) expect(overlapArea(r, outlines[j])).toBeLessThan(0.01);
			}
		}
	}
	expect(result.length).toBeGreaterThanOrEqual(result.areaBound - 1e-6);
	expect(result.efficiency).toBeLessThanOrEqual(1 + 1e-9);
}

describe('marker: hand-checked shapes', () => {
	it('interlocks two right triangles into their rectangle when they may turn end for end (hand check)', () => {
		// Two 300 × 800 right triangles turned 180° to each other make a 300 × 800 rectangle; their boxes need 1600.
		const tri = item(triangle(300, 800), { quantity: 2 });
		const result = nestMarker([tri], { width: 300, gapMm: 0 })!;
		expect(result.length).toBeCloseTo(800, 1);
		expect(result.efficiency).toBeCloseTo(1, 3);
		expect(packStrip([{ w: 300, h: 800, quantity: 2 }], 300).length).toBe(1600);
		expect(result.placements.map((p) => p.turn).sort()).toEqual([0, 180]);
		expectSound(result, 0);
	});

	it('keeps every piece one way up with a nap, so the triangles cannot interlock (hand check)', () => {
		const tri = item(triangle(300, 800), { quantity: 2, rotation: 'none' });
		const result = nestMarker([tri], { width: 300, gapMm: 0 })!;
		expect(result.placements.every((p) => p.turn === 0)).toBe(true);
		expect(result.length).toBeCloseTo(1600, 1);
		expectSound(result, 0);
	});

	it('leaves the cutting gap round curves (common practice: room for the blade)', () => {
		// Two half-discs of radius 200 turned end for end: curve against curve, so they stand 3 mm apart.
		const half = Array.from({ length: 33 }, (_, k) =>
			pt(200 * Math.sin((Math.PI * k) / 32), 200 - 200 * Math.cos((Math.PI * k) / 32))
		);
		const result = nestMarker([item(half, { quantity: 2 })], { width: 203, gapMm: 3 })!;
		expectSound(result, 3);
		const [a, b] = result.placements.map((p) => p.box);
		expect(Math.max(a.x + a.width, b.x + b.width)).toBeLessThanOrEqual(203 + 1e-6);
		// Side by side the flat sides would touch with no gap; the curves need 3 mm, so they cannot.
		expect(result.length).toBeGreaterThan(400);
	});

	it('lets straight edges share one cutting line, with no gap (common practice: common cut line)', () => {
		// Two right triangles turned end for end share their long edge: 300 × 800, even with a 3 mm gap.
		const tri = item(triangle(300, 800), { quantity: 2 });
		const result = nestMarker([tri], { width: 300, gapMm: 3 })!;
		expect(result.length).toBeCloseTo(800, 1);
		expectSound(result, 3);
	});

	it('stays sound when pieces take quarter turns in either order (no-fit polygons reused the other way round)', () => {
		// A band that may be cut across and an L-shaped piece free to turn: every relative quarter turn is met
		// both ways round, so each no-fit polygon is also derived from its mirror-image partner.
		const band = item([pt(0, 0), pt(95, 0), pt(95, 420), pt(0, 420)], { id: 'band', crosswise: true });
		const ell = item([pt(0, 0), pt(300, 0), pt(300, 80), pt(90, 80), pt(90, 260), pt(0, 260)], {
			id: 'ell',
			rotation: 'any',
			quantity: 2
		});
		for (const order of [
			[band, ell],
			[ell, band]
		]) {
			const result = nestMarker(order, { width: 480, gapMm: 2, orderings: 60 })!;
			expectSound(result, 2);
		}
	});

	it('needs no gap at the selvedges or the fold: the piece edge is the cut line there', () => {
		const result = nestMarker([item([pt(0, 0), pt(300, 0), pt(300, 100), pt(0, 100)])], { width: 300, gapMm: 2 })!;
		expect(result.length).toBeCloseTo(100, 6);
		expect(result.placements[0].box.x).toBeCloseTo(0, 6);
	});

	it('lays a pair on open cloth as a piece and its mirror image', () => {
		// An asymmetric quadrilateral: only a reflection, never a turn, makes its other half.
		const shape = [pt(0, 0), pt(200, 0), pt(260, 500), pt(0, 420)];
		const result = nestMarker([item(shape, { quantity: 2, mirrorPairs: true })], { width: 700 })!;
		// One of each hand, whichever was laid first.
		const [left, right] = [...result.placements].sort((a, b) => Number(a.mirrored) - Number(b.mirrored));
		expect([left.mirrored, right.mirrored]).toEqual([false, true]);
		// A reflection reverses the outline's sense of travel; a turn keeps it.
		expect(Math.sign(signedArea(left.outline))).toBe(-Math.sign(signedArea(right.outline)));
		expect(sides(mirrorX(right.outline)).map((s) => s.toFixed(6))).toEqual(
			sides(left.outline).map((s) => s.toFixed(6))
		);
		expect(polygonArea(left.outline)).toBeCloseTo(polygonArea(shape), 6);
		expectSound(result, 2);
	});

	it('puts a cut-on-fold piece with its fold edge on the fold', () => {
		const bodice = item([pt(0, 0), pt(180, 20), pt(220, 150), pt(240, 500), pt(0, 500)], { onFold: true, quantity: 1 });
		const sleeve = item(triangle(250, 400), { quantity: 2 });
		const result = nestMarker([bodice, sleeve], { width: 600 })!;
		const onFold = result.placements.find((p) => p.item === 0)!;
		expect(onFold.box.x).toBeCloseTo(0, 6);
		expectSound(result, 2);
	});

	it('starts every piece on the pattern repeat', () => {
		const result = nestMarker([item(triangle(300, 450), { quantity: 3 })], { width: 500, yStep: 320 })!;
		for (const p of result.placements) expect((p.box.y / 320) % 1).toBeCloseTo(0, 6);
		expectSound(result, 2);
	});

	it('gives up (so the boxes stand) when its budget runs out before any marker is finished', () => {
		let clock = 0;
		const tick = () => (clock += 1000);
		const items = [item(triangle(300, 800), { quantity: 4 })];
		expect(nestMarker(items, { width: 600, budgetMs: 10, now: tick })).toBeNull();
	});
});

/** 115 cm cloth, folded, no nap, shrinkage or repeat, unless `extra` says otherwise. */
const clothSpec = (extra: Partial<FabricSpec> = {}): FabricSpec => ({ ...defaultFabricSpec('cm'), ...extra });

const draftOf = (id: string): DraftPiece[] =>
	draftIn(templates[id as keyof typeof templates], 'cm', standardBodyCm).pieces;

describe('marker: properties', () => {
	// Star-shaped polygons (every vertex seen from the middle): convex and concave, some with straight runs.
	const polygon = fc
		.array(fc.integer({ min: 40, max: 200 }), { minLength: 3, maxLength: 9 })
		.map((radii) =>
			radii.map((r, k) =>
				pt(200 + r * Math.cos((2 * Math.PI * k) / radii.length), 200 + r * Math.sin((2 * Math.PI * k) / radii.length))
			)
		);
	const pieceArb = fc.record({
		outline: polygon,
		quantity: fc.integer({ min: 1, max: 2 }),
		rotation: fc.constantFrom<MarkerItem['rotation']>('none', '180', 'any'),
		mirrorPairs: fc.boolean()
	});

	it('never overlaps, stays on the cloth, keeps the gap round curves and never beats the area bound', () => {
		fc.assert(
			fc.property(fc.array(pieceArb, { minLength: 1, maxLength: 3 }), fc.constantFrom(0, 2), (pieces, gap) => {
				const items = pieces.map((p) => item(p.outline, p));
				const result = nestMarker(items, { width: 900, gapMm: gap, orderings: 3 });
				if (!result) return;
				expectSound(result, gap);
				expect(result.placements).toHaveLength(items.reduce((n, i) => n + i.quantity, 0));
			}),
			{ numRuns: 25, seed: 20261202 }
		);
	}, 30_000);
});

/** Sound, every copy laid, fold pieces on the fold, and the grain as the cloth allows. */
function expectLaidAsAllowed(marker: MarkerResult, items: readonly MarkerItem[], directional: boolean) {
	expectSound(marker, 2);
	for (const [i, it] of items.entries()) {
		const placed = marker.placements.filter((p) => p.item === i);
		expect(placed).toHaveLength(it.quantity);
		if (it.onFold) expect(placed.every((p) => Math.abs(p.box.x) < 0.01)).toBe(true);
		// Grain stays along the cloth: a nap allows no turn, plain cloth end for end only; a band that may
		// be cut across may also take a quarter turn (one way only with a nap).
		const turns = directional ? [0] : [0, 180];
		if (it.crosswise) turns.push(...(directional ? [90] : [90, 270]));
		expect(placed.every((p) => turns.includes(p.turn))).toBe(true);
		const drafted = boundingBox(it.outline);
		for (const p of placed) {
			expect(p.grainline[0].x).toBeCloseTo(p.grainline[1].x, 6);
			if (p.turn === 0) expect(p.box.height).toBeCloseTo(drafted.height, 6);
		}
	}
}

describe('marker: every garment', () => {
	const cases = Object.keys(templates).flatMap((garment) =>
		[true, false].flatMap((folded) => [true, false].map((directional) => ({ garment, folded, directional })))
	);

	it.each(cases)(
		'$garment, folded $folded, nap $directional: sound, and never worse than the boxes',
		(c) => {
			const pieces = draftOf(c.garment);
			const spec = clothSpec({ folded: c.folded, directional: c.directional });
			const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
			const items = markerItems(boxes, pieces, spec)!.map((g) => g.item);
			expectLaidAsAllowed(nestMarker(items, { width: boxes.layWidthMm, orderings: 1 })!, items, c.directional);
			const nested = nestFabricEstimate(boxes, pieces, spec, { budgetMs: Infinity, orderings: 1 });
			expect(nested.efficiency).toBeGreaterThanOrEqual(boxes.efficiency - 1e-12);
			expect(nested.packedMm).toBeLessThanOrEqual(boxes.packedMm);
			expect(nested.rounded.mm).toBeGreaterThanOrEqual(nested.lengthMm - 1e-6);
			if (nested.nested) expect(nested.packedMm).toBeGreaterThanOrEqual(nested.nested.areaBoundMm - 1e-6);
			// Every cut the boxes made, copies laid head to tail included, is cut from the marker too (a band the
			// marker cuts in two, as the boxes may, counts twice).
			const cuts = (e: typeof boxes) =>
				e.placements.reduce((sum, p) => sum + (p.pieceId === 'waistband' ? 0 : p.yields), 0);
			expect(cuts(nested)).toBe(cuts(boxes));
			const bands = (e: typeof boxes) => e.placements.filter((p) => p.pieceId === 'waistband');
			if (bands(boxes).length) expect(bands(nested).length).toBeGreaterThanOrEqual(bands(boxes).length);
			// Nesting on a busy machine: the first ordering computes every no-fit polygon.
		},
		30_000
	);

	it.each(cases)(
		'$garment, folded $folded, nap $directional: every fixed ordering from either end, sound with the grain as given',
		(c) => {
			const pieces = draftOf(c.garment);
			const spec = clothSpec({ folded: c.folded, directional: c.directional });
			const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
			const items = markerItems(boxes, pieces, spec)!.map((g) => g.item);
			// 6 starts (as given, turned, other hand first; each from the cut end and from the far end)
			// × 6 orders × 3 rules. Reflected back whole, a piece laid from the far end lies as its own variant.
			expectLaidAsAllowed(nestMarker(items, { width: boxes.layWidthMm, orderings: 108 })!, items, c.directional);
		},
		30_000
	);

	it('lays the shift dress on open cloth with a nap from the far end: each facing tucks into its own piece', () => {
		const pieces = draftOf('shift-dress');
		const spec = clothSpec({ folded: false, directional: true });
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		const items = markerItems(boxes, pieces, spec)!.map((g) => g.item);
		const marker = nestMarker(items, { width: boxes.layWidthMm, orderings: 108 })!;
		expect(marker.fromFarEnd).toBe(true);
		// The boxes put every facing below the bodies: 102.9 + 29.0 cm.
		expect(marker.length).toBeLessThan(boxes.packedMm - 20);
		expectSound(marker, 2);
	}, 30_000);

	it('nests a band in the shape the boxes cut it (in two, each half plus its join), not as drafted', () => {
		const pieces = draftOf('straight-skirt');
		const spec = clothSpec();
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		expect(boxes.notes.some((n) => n.startsWith('Waistband: cut in two pieces'))).toBe(true);
		const band = boxes.placements.find((p) => p.pieceId === 'waistband')!;
		const item = markerItems(boxes, pieces, spec)!.find((g) => g.item.id === 'waistband')!.item;
		const box = boundingBox(item.outline);
		expect(box.height).toBeCloseTo(band.h, 6);
		expect(box.width).toBeCloseTo(band.w, 6);
		// The drafted band is longer than the cut half: the marker never lays more than the boxes cut.
		expect(boundingBox(pieces.find((p) => p.id === 'waistband')!.outline).height).toBeGreaterThan(box.height + 100);
		// The grain arrow lies along the cloth.
		expect(item.grainline[0].x).toBeCloseTo(item.grainline[1].x, 6);
	});

	it('lays the straight skirt’s band halves across the folded cloth below the skirt, and says so', () => {
		const pieces = draftOf('straight-skirt');
		const spec = clothSpec();
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		const nested = nestFabricEstimate(boxes, pieces, spec, { budgetMs: Infinity, orderings: 6 });
		// Boxes: front and back side by side (66.7 cm), the band halves lengthwise below them (42 cm more).
		expect(boxes.packedMm).toBeGreaterThan(1000);
		// Marker: the halves turned across take 9.5 cm below the skirt instead (hand check: 667 + 95 + gap).
		expect(nested.packedMm).toBeLessThan(780);
		expect(nested.efficiency).toBeGreaterThan(boxes.efficiency);
		const band = nested.placements.filter((p) => p.pieceId === 'waistband');
		expect(band.every((p) => p.w > p.h)).toBe(true);
		// The arrow still runs along the cloth, and the note tells the cutter the band is cut across.
		for (const p of band) expect(p.grainline![0].x).toBeCloseTo(p.grainline![1].x, 6);
		expect(nested.notes.some((n) => n.startsWith('Waistband: cut across the cloth (crosswise grain)'))).toBe(true);
		expect(nested.notes.some((n) => n.startsWith('Waistband: cut in two pieces'))).toBe(true);
	});

	it('cuts the band in two when the halves make the marker shorter, as the boxes may (open straight skirt)', () => {
		const pieces = draftOf('straight-skirt');
		const spec = clothSpec({ folded: false });
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		// The boxes lay the band whole across the cloth below the skirt.
		expect(boxes.placements.filter((p) => p.pieceId === 'waistband')).toHaveLength(1);
		const nested = nestFabricEstimate(boxes, pieces, spec, { budgetMs: Infinity, orderings: 40 });
		expect(nested.packedMm).toBeLessThan(boxes.packedMm);
		const halves = nested.placements.filter((p) => p.pieceId === 'waistband');
		expect(halves).toHaveLength(2);
		// Half the band plus a 15.9 mm join each (5/8 in), by 95 mm.
		const drafted = boundingBox(pieces.find((p) => p.id === 'waistband')!.outline);
		for (const h of halves) expect(Math.max(h.w, h.h)).toBeCloseTo(drafted.height / 2 + 15.875, 3);
		expect(nested.notes.some((n) => n.startsWith('Waistband: cut in two pieces'))).toBe(true);
	});

	it('lifts the straight skirt’s band halves into the waist’s dips on open cloth with a nap, from the far end', () => {
		const pieces = draftOf('straight-skirt');
		const spec = clothSpec({ folded: false, directional: true });
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		// Boxes: front and backs side by side (66.7 cm, 5.9 mm to spare), the band whole below them (9.5 cm).
		expect(boxes.packedMm).toBeCloseTo(761.9, 1);
		const nested = nestFabricEstimate(boxes, pieces, spec, { budgetMs: Infinity, orderings: 108 });
		expect(nested.packedMm).toBeLessThan(boxes.packedMm);
		// Each half lies across the middle of a waist seam that dips below its ends (the front's centre, the
		// backs' centre back), so the skirt pieces sit less than a band's width down the cloth.
		const halves = nested.placements.filter((p) => p.pieceId === 'waistband');
		expect(halves).toHaveLength(2);
		for (const h of halves) expect(h.y).toBeLessThan(2);
		for (const p of nested.placements.filter((p) => p.pieceId !== 'waistband')) {
			expect(p.y).toBeGreaterThan(80);
			expect(p.y).toBeLessThan(95);
		}
		const outlines = nested.placements.map((p) => p.outline!);
		for (let i = 0; i < outlines.length; i++)
			for (let j = i + 1; j < outlines.length; j++) expect(overlapArea(outlines[i], outlines[j])).toBeLessThan(0.01);
		for (const outline of outlines) expect(areaOutside(outline, 1150, nested.packedMm)).toBeLessThan(0.01);
	}, 30_000);

	it('halves the cloth for four skirt gores that interlock end for end (hand check)', () => {
		// Gores 150 wide at the waist, 350 at the hem, 700 long. Boxes: three across 1150 cm cloth, one below: 1400.
		// Turned alternately the four make a band 4 × 250 + 100 = 1100 wide (plus three 2 mm gaps): one row, 700.
		const gore: DraftPiece = {
			id: 'gore',
			label: 'Gore',
			cut: { quantity: 4, onFold: false, pair: false, grain: 'lengthwise' },
			outline: [pt(100, 0), pt(250, 0), pt(350, 700), pt(0, 700)],
			marks: [],
			lines: [],
			grainline: [pt(175, 100), pt(175, 600)]
		};
		const spec = clothSpec({ folded: false });
		const boxes = estimateFabric([gore], spec, 'cm').estimate!;
		expect(boxes.packedMm).toBe(1400);
		const nested = nestFabricEstimate(boxes, [gore], spec, { budgetMs: Infinity });
		expect(nested.packedMm).toBeCloseTo(700, 6);
		expect(nested.efficiency).toBeCloseTo(2 * boxes.efficiency, 6);
		expect(nested.nested).toEqual({ boxLengthMm: 1400, areaBoundMm: (4 * 175_000) / 1150 });
		expect(nested.placements.every((p) => p.outline && p.grainline)).toBe(true);
	});
});
