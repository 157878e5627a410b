import { describe, expect, it } from 'vitest';
import { compileFilter, FilterError, haversineMetres } from './search-filter';

const filterable = ['garment', 'budgetMax', 'fabricSource', 'tags', 'dateNeeded', '_geo', 'note'];
const docs = [
	{
		id: 1,
		garment: 'shift-dress',
		budgetMax: 12000,
		fabricSource: 'tailor_sources',
		tags: ['linen'],
		dateNeeded: '2027-01-10',
		_geo: { lat: 46.85, lng: 3.21 }
	},
	{
		id: 2,
		garment: 'straight-skirt',
		budgetMax: 8000,
		fabricSource: 'customer_supplies',
		tags: [],
		dateNeeded: '2027-02-01',
		_geo: { lat: 46.87, lng: 3.23 },
		note: null
	},
	{
		id: 3,
		garment: 'tunic',
		budgetMax: 5000,
		fabricSource: 'tailor_sources',
		tags: ['wool', 'lined'],
		dateNeeded: '2026-12-20',
		_geo: { lat: 48.85, lng: 2.35 }
	}
];
const ids = (filter: Parameters<typeof compileFilter>[0]) =>
	docs.filter(compileFilter(filter, filterable)).map((d) => d.id);

describe('compileFilter', () => {
	it('compares numbers as numbers and strings without regard to case', () => {
		expect(ids('budgetMax >= 8000')).toEqual([1, 2]);
		expect(ids('budgetMax 5000 TO 8000')).toEqual([2, 3]);
		expect(ids("garment = 'TUNIC'")).toEqual([3]);
		expect(ids('garment != tunic')).toEqual([1, 2]);
	});

	it('compares ISO dates as strings', () => {
		expect(ids('dateNeeded < "2027-01-31"')).toEqual([1, 3]);
	});

	it('joins with AND, OR, NOT and parentheses, AND binding tighter than OR', () => {
		expect(ids('garment = tunic OR garment = shift-dress AND budgetMax > 20000')).toEqual([3]);
		expect(ids('(garment = tunic OR garment = shift-dress) AND NOT budgetMax > 10000')).toEqual([3]);
	});

	it('reads IN, NOT IN, EXISTS, IS NULL and IS EMPTY, and matches any element of an array', () => {
		expect(ids('garment IN [tunic, "straight-skirt"]')).toEqual([2, 3]);
		expect(ids('garment NOT IN [tunic]')).toEqual([1, 2]);
		expect(ids('tags = wool')).toEqual([3]);
		expect(ids('note EXISTS')).toEqual([2]);
		expect(ids('note IS NULL')).toEqual([2]);
		expect(ids('tags IS EMPTY')).toEqual([2]);
	});

	it('takes the array form as an AND of ORs', () => {
		expect(
			ids([['garment = tunic', 'garment = shift-dress'], 'fabricSource = tailor_sources', 'budgetMax < 6000'])
		).toEqual([3]);
	});

	it('finds points within a radius in metres', () => {
		expect(ids('_geoRadius(46.85, 3.21, 5000)')).toEqual([1, 2]);
		expect(ids('_geoRadius(46.85, 3.21, 100)')).toEqual([1]);
	});

	it('keeps a quoted keyword a value', () => {
		expect(() => compileFilter("garment = 'AND'", filterable)).not.toThrow();
	});

	it('refuses attributes that are not filterable, naming them', () => {
		expect(() => compileFilter('title = x', filterable)).toThrow(/Attribute `title` is not filterable/);
		expect(() => compileFilter('_geoRadius(1, 2, 3)', ['garment'])).toThrow(FilterError);
	});

	it.each([
		'garment =',
		'garment tunic',
		'(garment = tunic',
		'budgetMax 1 TO',
		'_geoRadius(1, 2)',
		'garment = tunic extra'
	])('refuses the malformed filter %j', (filter) => {
		expect(() => compileFilter(filter, filterable)).toThrow(FilterError);
	});
});

describe('haversineMetres', () => {
	it('gives one degree of the equator as 111.195 km on the WGS-84 mean radius', () => {
		// 2π × 6 371 008.8 m / 360 = 111 195.08 m (mean radius R1 of GRS 80, Moritz 2000).
		expect(haversineMetres({ lat: 0, lng: 0 }, { lat: 0, lng: 1 })).toBeCloseTo(111_195.08, 1);
	});
});
