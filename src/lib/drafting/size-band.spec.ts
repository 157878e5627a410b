import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bandFor, sizeBand } from './size-band';

describe('size band (EN 13402-3 control dimensions, half-open intervals)', () => {
	it('places the EN 13402-3 pictogram body 88-72-96 at the centre of its bands', () => {
		const body = { bust_girth: 880, waist_girth: 720, hip_girth: 960 };
		expect(sizeBand(body, 'dress')?.text).toBe('bust 86–90 cm, hip 94–98 cm');
		expect(sizeBand(body, 'trousers')?.text).toBe('waist 70–74 cm, hip 94–98 cm');
		expect(sizeBand(body, 'dress')?.dimensions[0].designationCm).toBe(88);
	});

	it('puts a body in the band that contains it, without rounding first (89.9 cm lies in 86–90, not 90–94)', () => {
		expect(bandFor('bust_girth', 899)).toMatchObject({ minCm: 86, maxCm: 90, designationCm: 88 });
		expect(bandFor('hip_girth', 1016)).toMatchObject({ minCm: 98, maxCm: 102, designationCm: 100 });
	});

	it('gives each boundary to one band only: the upper one (half-open [min, max))', () => {
		expect(bandFor('bust_girth', 900)).toMatchObject({ minCm: 90, maxCm: 94 });
		expect(bandFor('bust_girth', 899.999)).toMatchObject({ minCm: 86, maxCm: 90 });
	});

	it('steps the bust by 6 cm above 104 (EN 13402-3 women’s bust designations 104, 110, 116 …; from memory)', () => {
		expect(bandFor('bust_girth', 1040).designationCm).toBe(104);
		expect(bandFor('bust_girth', 1080)).toMatchObject({ designationCm: 110, minCm: 107, maxCm: 113 });
		expect(bandFor('bust_girth', 1069)).toMatchObject({ designationCm: 104, minCm: 102, maxCm: 107 });
		expect(bandFor('bust_girth', 1160).designationCm).toBe(116);
	});

	it('drops a missing secondary dimension and refuses a missing primary one', () => {
		expect(sizeBand({ bust_girth: 940 }, 'top')?.text).toBe('bust 94–98 cm');
		expect(sizeBand({ hip_girth: 1000 }, 'skirt')).toBeNull();
	});

	it('always contains the body: min ≤ girth < max, and the next band starts where this one ends (property)', () => {
		fc.assert(
			fc.property(
				fc.constantFrom('bust_girth', 'waist_girth', 'hip_girth' as const),
				fc.double({ min: 500, max: 2000, noNaN: true }),
				(code, mm) => {
					const band = bandFor(code, mm);
					expect(band.minCm * 10).toBeLessThanOrEqual(mm);
					expect(mm).toBeLessThan(band.maxCm * 10);
					expect(bandFor(code, band.maxCm * 10).minCm).toBe(band.maxCm);
				}
			)
		);
	});
});
