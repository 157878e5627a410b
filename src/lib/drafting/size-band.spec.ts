import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bandFor, sizeBand } from './size-band';

describe('size band (EN 13402-3 style, 4 cm intervals, whole cm)', () => {
	it('places the EN 13402-3 pictogram body 88-72-96 at the centre of its bands', () => {
		const body = { bust_girth: 880, waist_girth: 720, hip_girth: 960 };
		expect(sizeBand(body, 'dress')?.text).toBe('bust 86–90 cm, hip 94–98 cm');
		expect(sizeBand(body, 'trousers')?.text).toBe('waist 70–74 cm, hip 94–98 cm');
	});

	it('rounds to the nearest whole cm before banding (EN 13402-3: nearest whole number for designation)', () => {
		expect(bandFor(894)).toEqual({ minCm: 86, maxCm: 90 }); // 89.4 → 89 cm
		expect(bandFor(899)).toEqual({ minCm: 90, maxCm: 94 }); // 89.9 → 90 cm, a boundary: the upper band
		expect(bandFor(905)).toEqual({ minCm: 90, maxCm: 94 });
	});

	it('drops a missing secondary dimension and refuses a missing primary one', () => {
		expect(sizeBand({ bust_girth: 940 }, 'top')?.text).toBe('bust 94–98 cm');
		expect(sizeBand({ hip_girth: 1000 }, 'skirt')).toBeNull();
	});

	it('always gives a 4 cm band of whole cm containing the rounded measurement (property)', () => {
		fc.assert(
			fc.property(fc.double({ min: 500, max: 2000, noNaN: true }), (mm) => {
				const { minCm, maxCm } = bandFor(mm);
				expect(maxCm - minCm).toBe(4);
				expect(Number.isInteger(minCm)).toBe(true);
				const cm = Math.round(mm / 10);
				expect(cm).toBeGreaterThanOrEqual(minCm);
				expect(cm).toBeLessThanOrEqual(maxCm);
			})
		);
	});
});
