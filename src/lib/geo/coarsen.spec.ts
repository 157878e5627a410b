import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { coarsen } from './coarsen';

/** Haversine on the WGS-84 mean radius 6371.0088 km (IUGG; Moritz, Geodetic Reference System 1980). */
function kmBetween(a: { lat: number; lng: number }, b: { lat: number; lng: number }) {
	const rad = Math.PI / 180;
	const dLat = (b.lat - a.lat) * rad;
	const dLng = (b.lng - a.lng) * rad;
	const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(dLng / 2) ** 2;
	return 2 * 6371.0088 * Math.asin(Math.sqrt(h));
}

describe('coarsen', () => {
	it('moves a point by at most the half-diagonal of a 1 km cell, at any latitude below 85°', () => {
		fc.assert(
			fc.property(
				fc.double({ min: -85, max: 85, noNaN: true }),
				fc.double({ min: -179.9, max: 179.9, noNaN: true }),
				(lat, lng) => {
					const moved = kmBetween({ lat, lng }, coarsen({ lat, lng }));
					expect(moved).toBeLessThanOrEqual(0.72);
				}
			)
		);
	});

	it('puts every point of a neighbourhood in the same cell, so the exact point cannot be recovered', () => {
		const centre = coarsen({ lat: 46.8512, lng: 3.2089 });
		for (const [dLat, dLng] of [
			[0.002, -0.002],
			[-0.003, 0.004],
			[0.004, 0.005]
		]) {
			expect(coarsen({ lat: centre.lat + dLat, lng: centre.lng + dLng })).toEqual(centre);
		}
	});

	it('keeps cells about a kilometre wide east–west at 70° north, where two decimals of a degree would be 0.4 km', () => {
		const a = coarsen({ lat: 70, lng: 20 });
		const b = coarsen({ lat: 70, lng: 20.03 });
		const width = kmBetween(a, b);
		expect(width === 0 || Math.abs(width - 1) < 0.05).toBe(true);
	});

	it('is idempotent', () => {
		const once = coarsen({ lat: -33.8688, lng: 151.2093 });
		expect(coarsen(once)).toEqual(once);
	});
});
