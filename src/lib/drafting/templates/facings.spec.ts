import { describe, expect, it } from 'vitest';
import { estimateFabric, defaultFabricSpec } from '../fabric';
import { boundingBox, distance } from '../geometry';
import { croppedTop } from './cropped-top';
import { templates } from './index';
import { draftIn, standardBodyCm } from './test-support';

describe('facings', () => {
	it('every garment whose notes call for facings has them in the cutting layout, or cut in one with a piece', () => {
		const withFacings = Object.values(templates).filter((t) =>
			/facing/i.test(draftIn(t, 'cm', standardBodyCm).notes.join(' '))
		);
		expect(withFacings.map((t) => t.id).sort()).toEqual(['cropped-top', 'shift-dress', 'shirt', 'tunic', 'waistcoat']);
		for (const template of withFacings) {
			const draft = draftIn(template, 'cm', standardBodyCm);
			const facings = draft.pieces.filter((p) => /facing/i.test(p.label));
			// A grown-on facing is part of its piece, marked by the fold it turns back on.
			const grownOn = draft.pieces.filter((p) =>
				p.marks.some((m) => m.kind === 'fold' && /facing/i.test(m.label ?? ''))
			);
			if (!facings.length) {
				expect(grownOn.length, template.id).toBeGreaterThan(0);
				continue;
			}
			expect(
				facings.reduce((sum, p) => sum + p.cut.quantity, 0),
				template.id
			).toBeGreaterThanOrEqual(2);
			const { estimate } = estimateFabric(draft.pieces, defaultFabricSpec('cm'), 'cm');
			for (const facing of facings) {
				expect(
					estimate!.placements.some((p) => p.pieceId === facing.id),
					`${template.id} ${facing.id}`
				).toBe(true);
			}
		}
	});

	it('a neck facing reaches 2½ in in from the neck edge all along it (2–3 in is usual; common practice)', () => {
		const body = { bust_girth: 36, shoulder_width: 15, shoulder_to_bust_point: 9.5, bust_point_span: 7 };
		const draft = draftIn(croppedTop, 'in', body, { length: 18, neckWidth: 5, neckDepth: 5 });
		const facing = draft.pieces.find((p) => p.id === 'front_facing')!;
		expect(facing.cut.onFold).toBe(true);
		expect(boundingBox(facing.outline).x).toBeCloseTo(0, 9);
		// The first points run along the neck edge; the inner edge sits 2.5 in from them.
		const neckDepth = 5 * 25.4;
		expect(facing.outline[0]).toEqual({ x: 0, y: neckDepth });
		const bottomAtFold = facing.outline[facing.outline.length - 1];
		expect(bottomAtFold.x).toBe(0);
		expect(distance(facing.outline[0], bottomAtFold) / 25.4).toBeCloseTo(2.5, 9);
	});
});
