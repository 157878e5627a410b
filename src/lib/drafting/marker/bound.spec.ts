import { describe, expect, it } from 'vitest';
import { defaultFabricSpec, estimateFabric, type FabricSpec } from '../fabric';
import { pt, type Point } from '../geometry';
import { templates } from '../templates/index';
import { draftIn, standardBodyCm } from '../templates/test-support';
import { pairBound } from './bound';
import { markerItems } from './fabric';
import { nestMarker, type MarkerItem } from './nest';
import { markerItem } from './test-support';

/** A piece that may not turn unless `extra` says so. */
const item = (outline: Point[], extra: Partial<MarkerItem> = {}) => markerItem(outline, { rotation: 'none', ...extra });

const rectangle = (w: number, h: number) => [pt(0, 0), pt(w, 0), pt(w, h), pt(0, h)];
/** An L: the full width along the top half, the left half below it. */
const ell = [pt(0, 0), pt(100, 0), pt(100, 50), pt(50, 50), pt(50, 100), pt(0, 100)];

describe('pair bound (hand checks)', () => {
	it('two boxes side by side when the width holds both, else one after the other', () => {
		const items = [item(rectangle(100, 60), { label: 'A' }), item(rectangle(100, 40), { label: 'B' })];
		expect(pairBound(items, 200)!.length).toBeCloseTo(60, 1);
		expect(pairBound(items, 199)).toEqual({ length: expect.closeTo(100, 1), pieces: ['A', 'B'] });
	});

	it('two Ls fill a 150 × 100 rectangle when one may lie end for end, and need 150 when neither may turn', () => {
		// Turned end for end, the second L's arm fills the first's notch: 2 × 7 500 mm² = 150 × 100, nothing to spare.
		expect(pairBound([item(ell, { quantity: 2, rotation: '180' })], 150)!.length).toBeCloseTo(100, 1);
		// The same way up, the best is the second L's top arm beside the first's foot: 50 + 100 = 150.
		expect(pairBound([item(ell, { quantity: 2 })], 150)!.length).toBeCloseTo(150, 1);
		// One L alone sets no pair.
		expect(pairBound([item(ell)], 150)).toBeNull();
	});

	it('leaves out a band that may also be cut across or in two', () => {
		const items = [item(rectangle(100, 60)), item(rectangle(120, 10), { crosswise: true })];
		expect(pairBound(items, 150)).toBeNull();
	});
});

const clothSpec = (extra: Partial<FabricSpec> = {}): FabricSpec => ({ ...defaultFabricSpec('cm'), ...extra });
const draftOf = (id: string) => draftIn(templates[id as keyof typeof templates], 'cm', standardBodyCm).pieces;

describe('pair bound on the garments', () => {
	it('proves the boxes cannot be beaten for the cropped top on open cloth with a nap: front and back', () => {
		const pieces = draftOf('cropped-top');
		const spec = clothSpec({ widthMm: 1150, folded: false, directional: true });
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		const bound = pairBound(
			markerItems(boxes, pieces, spec)!.map((g) => g.item),
			boxes.layWidthMm
		)!;
		// Neither body fits beside the other on 115 cm, and the back's shoulders cannot tuck under the front's hem.
		expect(bound.pieces).toEqual(['Front', 'Back']);
		expect(bound.length).toBeGreaterThan(boxes.packedMm - 0.02);
		expect(bound.length).toBeLessThanOrEqual(boxes.packedMm + 1e-6);
	}, 30_000);

	it.each(Object.keys(templates))(
		'%s, folded with a nap: no marker is shorter than the bound',
		(garment) => {
			const pieces = draftOf(garment);
			const spec = clothSpec({ folded: true, directional: true });
			const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
			const items = markerItems(boxes, pieces, spec)!.map((g) => g.item);
			const bound = pairBound(items, boxes.layWidthMm)!;
			const marker = nestMarker(items, { width: boxes.layWidthMm, orderings: 60, gapMm: 0 })!;
			expect(marker.length).toBeGreaterThanOrEqual(bound.length - 0.01);
			expect(boxes.packedMm).toBeGreaterThanOrEqual(bound.length - 0.01);
			// Every pair's no-fit polygons, and a marker, on a busy machine.
		},
		30_000
	);
});
