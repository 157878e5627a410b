// Facts checked here are from the GeoNames gazetteer (geonames.org, CC BY 4.0), which the package ships.
import { beforeAll, describe, expect, it } from 'vitest';
import { nearestGazetteerPlace, normaliseName, searchGazetteer } from './gazetteer';

// The first call reads the whole list; on a busy machine that takes several seconds.
beforeAll(() => void searchGazetteer('a', { limit: 1 }), 60_000);

describe('searchGazetteer', () => {
	it('finds a town whatever the accents typed', () => {
		// GeoNames 2657896: Zürich, CH.
		const [first] = searchGazetteer('zurich', { country: 'CH', limit: 5 });
		expect(first).toMatchObject({ id: 'geonames:2657896', name: 'Zürich', country: 'CH' });
	});

	it('puts an exact name first and the most populous of the same name next', () => {
		// GeoNames 2988507: Paris, FR (population about 2.1 million) ahead of Paris, Texas and Parish, NY.
		const results = searchGazetteer('Paris', { limit: 5 });
		expect(results[0]).toMatchObject({ id: 'geonames:2988507', country: 'FR' });
		expect(results.slice(0, 3).every((p) => normaliseName(p.name) === 'paris')).toBe(true);
	});

	it('keeps to the chosen country', () => {
		const results = searchGazetteer('Paris', { country: 'US', limit: 8 });
		expect(results.length).toBeGreaterThan(1);
		expect(results.every((p) => p.country === 'US')).toBe(true);
	});

	it('matches by the start of the name and gives coordinates as latitude and longitude', () => {
		// GeoNames 2996944: Lyon, 45.74846 N 4.84671 E.
		const lyon = searchGazetteer('lyo', { country: 'FR', limit: 3 }).find((p) => p.name === 'Lyon');
		expect(lyon).toMatchObject({ lat: 45.74846, lng: 4.84671 });
	});

	it('finds nothing for an empty query', () => {
		expect(searchGazetteer('  ', { limit: 5 })).toEqual([]);
	});
});

describe('nearestGazetteerPlace', () => {
	it('names the town a point is in', () => {
		// A point in Lyon's Presqu'île, about 1 km from GeoNames' Lyon point.
		const found = nearestGazetteerPlace(45.7578, 4.832);
		expect(found?.place.name).toBe('Lyon');
		expect(found!.km).toBeLessThan(3);
	});
});
