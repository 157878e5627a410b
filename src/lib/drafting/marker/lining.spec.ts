import { describe, expect, it } from 'vitest';
import { draftGarment } from '../draft';
import { defaultFabricSpec, estimateFabric, liningSpecOf } from '../fabric';
import { polygonArea } from '../geometry';
import { templates } from '../templates/index';
import { draftIn, standardBodyCm } from '../templates/test-support';
import { roundUpFabric } from '../units';
import { markerItems, nestFabricEstimate } from './fabric';
import { nestMarker } from './nest';
import { areaOutside, overlapArea } from './polygons';

const spec = defaultFabricSpec('cm');
const waistcoatPieces = () => draftIn(templates.waistcoat, 'cm', standardBodyCm).pieces;

describe('lining: laid and nested apart from the cloth', () => {
	it('nests a lined waistcoat’s lining as its own marker on the lining width, and buys what that marker takes', () => {
		const pieces = waistcoatPieces();
		const liningIds = pieces.filter((p) => p.cut.cloth === 'lining').map((p) => p.id);
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		const liningBoxes = boxes.lining!.estimate!;
		// The lining's layout holds the lining pieces and nothing else; the cloth's holds none of them.
		expect(new Set(liningBoxes.placements.map((p) => p.pieceId))).toEqual(new Set(liningIds));
		expect(boxes.placements.some((p) => liningIds.includes(p.pieceId))).toBe(false);

		const nested = nestFabricEstimate(boxes, pieces, spec, { budgetMs: Infinity, orderings: 6 });
		const lining = nested.lining!.estimate!;
		// The same marker, run directly on the lining's items, gives the length the estimate buys.
		const liningPieces = pieces.filter((p) => p.cut.cloth === 'lining');
		const items = markerItems(liningBoxes, liningPieces, liningSpecOf(spec))!.map((g) => g.item);
		const marker = nestMarker(items, { width: liningBoxes.layWidthMm, orderings: 6 })!;
		expect(marker.length).toBeLessThan(liningBoxes.packedMm);
		expect(lining.packedMm).toBeCloseTo(marker.length, 6);
		expect(lining.nested).toEqual({ boxLengthMm: liningBoxes.packedMm, areaBoundMm: marker.areaBound });
		// 10 cm buying steps, as the shops sell by the metre (common practice).
		expect(lining.rounded.mm).toBe(roundUpFabric(marker.length, 'm').mm);
		// Never shorter than the lining's area over its width (the trivial strip-packing bound).
		expect(lining.packedMm).toBeGreaterThanOrEqual(marker.areaBound - 1e-6);
		// Every outline on the lining, none overlapping.
		for (const p of lining.placements)
			expect(areaOutside(p.outline!, lining.layWidthMm, lining.packedMm)).toBeLessThan(0.01);
		for (let i = 0; i < lining.placements.length; i++)
			for (let j = i + 1; j < lining.placements.length; j++)
				expect(overlapArea(lining.placements[i].outline!, lining.placements[j].outline!)).toBeLessThan(0.01);
		// Every lining cut is made: the pieces' cut counts, pairs counting two.
		const cuts = lining.placements.reduce((sum, p) => sum + p.yields, 0);
		expect(cuts).toBe(liningPieces.reduce((sum, p) => sum + p.cut.quantity, 0));
		// The note beside the layout gives the nested lining's length.
		expect(nested.notes.find((n) => n.startsWith('Lining ('))).toContain(
			`: ${lining.rounded.display} of 115 cm lining`
		);
	}, 30_000);

	it('keeps the lining pieces’ area on the lining marker (nothing lost or doubled)', () => {
		const pieces = waistcoatPieces();
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		const lining = nestFabricEstimate(boxes, pieces, spec, { budgetMs: Infinity, orderings: 6 }).lining!.estimate!;
		const laidArea = lining.placements.reduce((sum, p) => sum + polygonArea(p.outline!), 0);
		// On folded lining each laid outline is cut through both layers.
		const cutArea = pieces
			.filter((p) => p.cut.cloth === 'lining')
			.reduce((sum, p) => sum + polygonArea(p.outline) * p.cut.quantity, 0);
		expect(lining.folded).toBe(true);
		expect(2 * laidArea).toBeCloseTo(cutArea, -2);
	}, 30_000);

	it('gives the draft a lining layout for the waistcoat and none for unlined garments', () => {
		const request = (garment: keyof typeof templates) => ({
			garment,
			unit: 'cm' as const,
			measurements: standardBodyCm,
			fabric: { width: 115 }
		});
		const lined = draftGarment(request('waistcoat'), { nest: { budgetMs: Infinity, orderings: 6 } });
		expect(lined.fabric!.lining).toMatchObject({ fits: true, nested: true, buyUnit: 'm' });
		expect(lined.fabric!.lining!.svg).toContain('Lining layout on 115 cm lining');
		for (const garment of Object.keys(templates) as Array<keyof typeof templates>) {
			if (garment === 'waistcoat') continue;
			expect(draftGarment(request(garment)).fabric!.lining, garment).toBeNull();
		}
	}, 30_000);

	it('leaves an unlined garment’s estimate exactly as the boxes and the cloth marker give it', () => {
		const pieces = draftIn(templates['straight-skirt'], 'cm', standardBodyCm).pieces;
		const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
		expect(boxes.lining).toBeUndefined();
		expect(nestFabricEstimate(boxes, pieces, spec, { budgetMs: Infinity }).lining).toBeUndefined();
	});
});
