// The stand-in's grid and top-k against a plain scan of every document: same hits, same order, same counts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SearchIndex, firstInOrder } from './search-engine';
import { haversineMetres, type Doc } from './search-filter';

const settings = {
	filterableAttributes: ['_geo', 'garment', 'budget'],
	sortableAttributes: ['_geo', 'budget', 'id'],
	searchableAttributes: ['title']
};

/** To a millionth of a degree, as a filter or sort written in decimals carries it. */
const micro = (degrees: number) => Math.round(degrees * 1e6) / 1e6;

/** Degrees to a millionth, drawn evenly (not only near 0 and the ends). */
const degrees = (limit: number) => fc.integer({ min: -limit * 1e6, max: limit * 1e6 }).map((n) => micro(n / 1e6));

const point = fc.record({ lat: degrees(89.99), lng: degrees(180) });

/** Points near a centre, so radius searches find some: within about ±3° of it, wrapped at ±180°. */
const near = (centre: { lat: number; lng: number }) =>
	fc.record({ dLat: degrees(3), dLng: degrees(3) }).map(({ dLat, dLng }) => ({
		lat: Math.max(-90, Math.min(90, centre.lat + dLat)),
		lng: ((((centre.lng + dLng + 180) % 360) + 360) % 360) - 180
	}));

function documents(centre: { lat: number; lng: number }) {
	return fc.array(
		fc.record({
			geo: fc.option(near(centre), { nil: undefined, freq: 8 }),
			garment: fc.constantFrom('tunic', 'shift-dress', 'straight-skirt'),
			budget: fc.integer({ min: 0, max: 5 })
		}),
		{ maxLength: 120 }
	);
}

/** What the engine must answer, worked out the slow way: every document tested, all of them sorted. */
function byScan(docs: Doc[], centre: { lat: number; lng: number }, metres: number, garment: string | null) {
	const inside = docs
		.map((doc, order) => ({ doc, order }))
		.filter(({ doc }) => {
			const geo = doc._geo as { lat: number; lng: number } | undefined;
			return geo && haversineMetres(centre, geo) <= metres && (!garment || doc.garment === garment);
		})
		.map(({ doc, order }) => ({
			doc,
			order,
			metres: haversineMetres(centre, doc._geo as { lat: number; lng: number })
		}));
	return inside.sort((a, b) => a.metres - b.metres || a.order - b.order);
}

describe('the search stand-in’s radius search', () => {
	it('finds exactly what a scan of every document finds, in the same order', () => {
		fc.assert(
			fc.property(
				point.chain((centre) =>
					fc.tuple(
						fc.constant(centre),
						documents(centre),
						fc.integer({ min: 0, max: 400_000 }),
						fc.option(fc.constantFrom('tunic', 'shift-dress'), { nil: null }),
						fc.integer({ min: 1, max: 30 }),
						fc.integer({ min: 0, max: 10 })
					)
				),
				([centre, specs, metres, garment, limit, offset]) => {
					const index = new SearchIndex('things', 'id');
					index.updateSettings(settings);
					const docs: Doc[] = specs.map((spec, i) => ({
						id: `d${i}`,
						title: `thing ${i}`,
						garment: spec.garment,
						budget: spec.budget,
						...(spec.geo ? { _geo: spec.geo } : {})
					}));
					index.addDocuments(docs, { merge: false });
					const filter = [`_geoRadius(${centre.lat}, ${centre.lng}, ${metres})`];
					if (garment) filter.push(`garment = ${garment}`);
					const result = index.search({
						filter,
						sort: [`_geoPoint(${centre.lat}, ${centre.lng}):asc`],
						limit,
						offset
					});
					const expected = byScan(docs, centre, metres, garment);
					expect(result.estimatedTotalHits).toBe(expected.length);
					expect(result.hits.map((hit) => hit.id)).toEqual(
						expected.slice(offset, offset + limit).map(({ doc }) => doc.id)
					);
					expect(result.hits.map((hit) => hit._geoDistance)).toEqual(
						expected.slice(offset, offset + limit).map(({ metres }) => Math.round(metres))
					);
				}
			),
			{ numRuns: 300 }
		);
	});

	it('keeps the grid right through replacements and deletions', () => {
		const index = new SearchIndex('things', 'id');
		index.updateSettings(settings);
		const centre = { lat: 46.85, lng: 3.21 };
		index.addDocuments(
			[
				{ id: 'a', _geo: { lat: 46.85, lng: 3.21 } },
				{ id: 'b', _geo: { lat: 46.86, lng: 3.22 } },
				{ id: 'c', _geo: { lat: 48.85, lng: 2.35 } }
			],
			{ merge: false }
		);
		const ids = () =>
			index
				.search({ filter: `_geoRadius(${centre.lat}, ${centre.lng}, 5000)`, sort: ['_geoPoint(46.85, 3.21):asc'] })
				.hits.map((hit) => hit.id);
		expect(ids()).toEqual(['a', 'b']);
		// Moved far away, moved close, merged without a point change, removed.
		index.addDocuments([{ id: 'a', _geo: { lat: 10, lng: 10 } }], { merge: false });
		index.addDocuments([{ id: 'c', _geo: { lat: 46.851, lng: 3.211 } }], { merge: false });
		index.addDocuments([{ id: 'b', garment: 'tunic' }], { merge: true });
		expect(ids()).toEqual(['c', 'b']);
		index.deleteDocuments(['c']);
		expect(ids()).toEqual(['b']);
		index.deleteWhere('garment = tunic');
		expect(ids()).toEqual([]);
		index.addDocuments([{ id: 'z', _geo: { lat: 46.85, lng: 3.21 } }], { merge: false });
		expect(ids()).toEqual(['z']);
		index.clear();
		expect(ids()).toEqual([]);
	});

	it('reaches across the antimeridian and over a pole', () => {
		const index = new SearchIndex('things', 'id');
		index.updateSettings(settings);
		index.addDocuments(
			[
				{ id: 'east', _geo: { lat: -17.7, lng: 179.95 } },
				{ id: 'west', _geo: { lat: -17.7, lng: -179.95 } },
				{ id: 'north', _geo: { lat: 89.95, lng: -120 } }
			],
			{ merge: false }
		);
		const ids = (filter: string) =>
			index
				.search({ filter })
				.hits.map((hit) => hit.id)
				.sort();
		expect(ids('_geoRadius(-17.7, 179.99, 20000)')).toEqual(['east', 'west']);
		expect(ids('_geoRadius(89.95, 60, 20000)')).toEqual(['north']);
	});
});

describe('firstInOrder', () => {
	it('answers the first items of the full sort, whatever the count', () => {
		fc.assert(
			fc.property(fc.array(fc.integer({ min: 0, max: 50 })), fc.integer({ min: 0, max: 40 }), (values, count) => {
				const items = values.map((value, order) => ({ value, order }));
				const compare = (a: (typeof items)[number], b: (typeof items)[number]) =>
					a.value - b.value || a.order - b.order;
				expect(firstInOrder([...items], count, compare)).toEqual([...items].sort(compare).slice(0, count));
			})
		);
	});
});
