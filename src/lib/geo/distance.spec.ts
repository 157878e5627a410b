import fc from 'fast-check';
import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { boundingBox, distanceKm, sphericalDistanceKm } from './distance';

// Karney (2013), "Algorithms for geodesics", J. Geodesy 87:43–55: the WGS-84 ellipsoidal distance.
const wgs84 = geodesic.Geodesic.WGS84;
const ellipsoidKm = (a: { lat: number; lng: number }, b: { lat: number; lng: number }) =>
	wgs84.Inverse(a.lat, a.lng, b.lat, b.lng).s12! / 1000;
const travel = (from: { lat: number; lng: number }, azimuth: number, km: number) => {
	const there = wgs84.Direct(from.lat, from.lng, azimuth, km * 1000);
	return { lat: there.lat2!, lng: there.lon2! };
};

const point = fc.record({
	lat: fc.double({ min: -89, max: 89, noNaN: true }),
	lng: fc.double({ min: -180, max: 180, noNaN: true })
});
const azimuth = fc.double({ min: 0, max: 360, noNaN: true });

describe('distanceKm', () => {
	it('is within 0.5 % of the WGS-84 geodesic for random pairs more than 1 km apart', () => {
		fc.assert(
			fc.property(point, point, (a, b) => {
				const exact = ellipsoidKm(a, b);
				fc.pre(exact > 1 && exact < 19_000);
				expect(Math.abs(distanceKm(a, b) - exact) / exact).toBeLessThan(0.005);
			}),
			{ numRuns: 2000 }
		);
	});

	it('agrees at town distances, where the product uses it', () => {
		fc.assert(
			fc.property(point, fc.double({ min: 0.5, max: 100, noNaN: true }), azimuth, (a, km, bearing) => {
				expect(Math.abs(distanceKm(a, travel(a, bearing, km)) - km) / km).toBeLessThan(0.005);
			}),
			{ numRuns: 2000 }
		);
	});

	it('gives the distance between two cities', () => {
		// GeoNames points: Paris 48.85341 N 2.3488 E, Lyon 45.74846 N 4.84671 E.
		const paris = { lat: 48.85341, lng: 2.3488 };
		const lyon = { lat: 45.74846, lng: 4.84671 };
		const exact = ellipsoidKm(paris, lyon);
		expect(Math.abs(distanceKm(paris, lyon) - exact) / exact).toBeLessThan(0.005);
	});
});

describe('sphericalDistanceKm', () => {
	it('gives one degree of the equator as 111.195 km on the WGS-84 mean radius', () => {
		// 2π × 6371.0088 km / 360 = 111.19508 km (mean radius R1 of GRS 80, Moritz 2000).
		expect(sphericalDistanceKm({ lat: 0, lng: 0 }, { lat: 0, lng: 1 })).toBeCloseTo(111.19508, 4);
	});
});

describe('boundingBox', () => {
	it('holds every point within the radius', () => {
		const centre = fc.record({
			lat: fc.double({ min: -80, max: 80, noNaN: true }),
			lng: fc.double({ min: -179, max: 179, noNaN: true })
		});
		fc.assert(
			fc.property(
				centre,
				fc.double({ min: 0.5, max: 200, noNaN: true }),
				azimuth,
				fc.double({ min: 0, max: 1, noNaN: true }),
				(c, radiusKm, bearing, fraction) => {
					const p = travel(c, bearing, radiusKm * fraction);
					fc.pre(distanceKm(c, p) <= radiusKm);
					const box = boundingBox(c, radiusKm);
					expect(p.lat).toBeGreaterThanOrEqual(box.minLat);
					expect(p.lat).toBeLessThanOrEqual(box.maxLat);
					expect(p.lng).toBeGreaterThanOrEqual(box.minLng);
					expect(p.lng).toBeLessThanOrEqual(box.maxLng);
				}
			),
			{ numRuns: 2000 }
		);
	});
});
