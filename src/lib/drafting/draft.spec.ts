import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { draftGarment } from './draft';
import { garmentIds } from './measurements';
import { standardBodyCm } from './templates/test-support';

const trouserRequest = {
	garment: 'wide-leg-trousers' as const,
	unit: 'in' as const,
	measurements: { hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
	options: { length: 45.5 }
};
const topRequest = {
	garment: 'cropped-top' as const,
	unit: 'in' as const,
	measurements: { bust_girth: 36, shoulder_width: 15, shoulder_to_bust_point: 9.5, bust_point_span: 7 },
	options: { length: 18 }
};

const lineValues = (response: ReturnType<typeof draftGarment>) =>
	Object.fromEntries(response.pieces.flatMap((p) => p.lines.map((l) => [`${p.id}.${l.id}`, l.value])));

describe('draftGarment — response shape and the dressmaker’s method (common practice)', () => {
	it('answers the trousers with every required line id, values in inches', () => {
		const response = draftGarment(trouserRequest);
		expect(response.errors).toEqual([]);
		expect(lineValues(response)).toMatchObject({
			'front.hip_line_depth': 10,
			'front.crotch_depth': 11.5,
			'front.thigh_line_depth': 14,
			'front.hip_width': 11,
			'front.crotch_extension': 2.5,
			'front.waist_width': 9,
			'front.thigh_width': 13,
			'front.leg_length': 46,
			'front.fold_width': 16,
			'back.crotch_extension': 4.5,
			'waistband.cut_width': 4
		});
		expect(response.pieces.map((p) => p.id)).toEqual(['front', 'back', 'waistband']);
		expect(response.pieces[0].cut).toMatchObject({ quantity: 2, onFold: false, grain: 'lengthwise' });
		expect(response.pieces[0].svg).toMatch(/^<svg/);
		expect(response.pieces[0].bbox).toEqual({ width: 13.5, height: 46 });
	});

	it('answers the cropped top with every required line id', () => {
		const values = lineValues(draftGarment(topRequest));
		expect(values).toMatchObject({
			'front.fold_width': 16,
			'front.neck_width': 4,
			'front.neck_depth': 4,
			'front.shoulder_point': 7.5,
			'front.sleeve_length': 7,
			'front.sleeve_opening': 6,
			'front.bust_line_depth': 9.5,
			'front.bust_width': 11,
			'front.dart_position': 3.5,
			'front.dart_length': 5,
			'front.dart_width': 1
		});
	});

	it('gives values in centimetres when asked in centimetres', () => {
		const response = draftGarment({
			...trouserRequest,
			unit: 'cm',
			measurements: { hip_girth: 101.6, waist_girth: 71.12, thigh_girth: 63.5 },
			options: { length: 115.57 }
		});
		expect(lineValues(response)['front.hip_width']).toBeCloseTo(27.94, 2);
		expect(response.pieces[0].lines.find((l) => l.id === 'hip_width')!.display).toBe('27.9 cm');
		expect(response.fabric!.buyUnit).toBe('m');
	});

	it('estimates fabric, a size band and its allowances', () => {
		const response = draftGarment({ ...trouserRequest, fabric: { width: 45 } });
		expect(response.fabric).toMatchObject({ width: 45, folded: true, buyUnit: 'yd' });
		expect(response.fabric!.lengthRounded * 36).toBeGreaterThanOrEqual(response.fabric!.length);
		expect(response.fabric!.efficiency).toBeGreaterThan(0);
		expect(response.fabric!.efficiency).toBeLessThanOrEqual(1);
		// EN 13402-3 4 cm intervals, half-open: waist 28 in = 71.1 cm lies in 70–74, hip 40 in = 101.6 cm in 98–102.
		expect(response.sizeBand?.text).toBe('waist 70–74 cm, hip 98–102 cm');
		expect(response.allowances.map((a) => a.id)).toContain('hem');
	});
});

describe('draftGarment — checks', () => {
	it('blocks on missing measurements, listing them, and still reports warnings', () => {
		const response = draftGarment({ ...trouserRequest, measurements: { hip_girth: 40 } });
		expect(response.pieces).toEqual([]);
		expect(response.fabric).toBeNull();
		expect(response.errors[0]).toMatchObject({ code: 'missing_measurements', fields: ['waist_girth', 'thigh_girth'] });
	});

	it('asks for a length or waist to floor when neither is given', () => {
		const response = draftGarment({ ...trouserRequest, options: {} });
		expect(response.errors.map((e) => e.fields)).toContainEqual(['options.length', 'waist_to_floor']);
	});

	it('warns without blocking on an out-of-range value', () => {
		const response = draftGarment({
			...trouserRequest,
			measurements: { ...trouserRequest.measurements, hip_girth: 62 }
		});
		expect(response.errors).toEqual([]);
		expect(response.warnings.map((w) => w.code)).toContain('out_of_range');
		expect(response.pieces).toHaveLength(3);
	});

	it('blocks an impossible relation', () => {
		const response = draftGarment({
			...trouserRequest,
			measurements: { ...trouserRequest.measurements, inside_leg: 40, waist_to_floor: 39 }
		});
		expect(response.errors[0].code).toBe('impossible_relation');
	});

	it('carries the neck-cord caution on the tunic and a child caution for child measurements', () => {
		const tunic = draftGarment({
			garment: 'tunic',
			unit: 'cm',
			measurements: { bust_girth: 88, hip_girth: 96, shoulder_width: 38 }
		});
		expect(tunic.cautions.map((c) => c.code)).toEqual(['neck_cords']);
		const child = draftGarment({
			garment: 'a-line-skirt',
			unit: 'cm',
			measurements: { stature: 128, waist_girth: 56, hip_girth: 66, waist_to_hip: 14 },
			options: { length: 35 }
		});
		expect(child.cautions.map((c) => c.code)).toContain('child_garment');
	});

	it('refuses an option the garment does not have', () => {
		expect(() => draftGarment({ ...topRequest, options: { crotchEase: 1 } })).toThrow(/Not an option/);
	});
});

describe('draftGarment — properties', () => {
	it('cm and in requests give the same geometry for every garment', () => {
		fc.assert(
			fc.property(fc.constantFrom(...garmentIds), fc.double({ min: 0.9, max: 1.2, noNaN: true }), (garment, scale) => {
				const cm = Object.fromEntries(Object.entries(standardBodyCm).map(([k, v]) => [k, v * scale]));
				const inches = Object.fromEntries(Object.entries(cm).map(([k, v]) => [k, v / 2.54]));
				const a = draftGarment({ garment, unit: 'cm', measurements: cm, fabric: { width: 140 } });
				const b = draftGarment({ garment, unit: 'in', measurements: inches, fabric: { width: 140 / 2.54 } });
				expect(a.errors).toEqual([]);
				a.pieces.forEach((piece, i) => {
					piece.outlineMm.forEach(([x, y], j) => {
						expect(x).toBeCloseTo(b.pieces[i].outlineMm[j][0], 1);
						expect(y).toBeCloseTo(b.pieces[i].outlineMm[j][1], 1);
					});
				});
				expect(a.fabric!.length).toBeCloseTo(b.fabric!.length * 2.54, 1);
			}),
			{ numRuns: 30 }
		);
	});
});
