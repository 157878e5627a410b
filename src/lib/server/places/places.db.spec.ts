import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb } from '../db/client';
import { placeFields, resolveFormPlace } from './form';
import { addLocalPlaces, nearestPlace, placeById, searchPlaces } from '.';

// The integration setup gives this file its own copy of the seeded demo database (Merrowgate's districts).
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());
// The first gazetteer call reads the whole list; on a busy machine that takes several seconds.
beforeAll(() => searchPlaces(db, { q: 'a', limit: 1 }), 60_000);

const form = (fields: Record<string, string>) => placeFields.parse(fields);

describe('searchPlaces', () => {
	it('offers the demo districts first, then the gazetteer', async () => {
		const found = await searchPlaces(db, { q: 'old q', limit: 5 });
		expect(found[0]).toMatchObject({ id: 'local:merrowgate-old-quay', name: 'Old Quay', admin: 'Merrowgate' });
	});

	it('treats LIKE wildcards in a query as plain characters', async () => {
		await addLocalPlaces(db, [{ id: 'test-percent', name: 'Fifty%Acre', country: 'FR', lat: 46.8, lng: 3.2 }]);
		expect((await searchPlaces(db, { q: 'fifty%', limit: 5 })).map((p) => p.id)).toContain('local:test-percent');
		expect((await searchPlaces(db, { q: '%', limit: 5 })).map((p) => p.id)).not.toContain('local:merrowgate-old-quay');
		expect((await searchPlaces(db, { q: 'Fifty_', limit: 5 })).map((p) => p.id)).not.toContain('local:test-percent');
	});
});

describe('placeById and nearestPlace', () => {
	it('looks up either kind of id and refuses others', async () => {
		expect(await placeById(db, 'local:merrowgate-loomside')).toMatchObject({ name: 'Loomside' });
		expect(await placeById(db, 'geonames:2996944')).toMatchObject({ name: 'Lyon' });
		expect(await placeById(db, 'geonames:not-a-number')).toBeNull();
		expect(await placeById(db, 'elsewhere:1')).toBeNull();
	});

	it('names a point in the demo city after its district', async () => {
		expect(await nearestPlace(db, { lat: 46.8589, lng: 3.2199 })).toMatchObject({ name: 'Loomside' });
	});
});

describe('resolveFormPlace', () => {
	it('takes a chosen list entry and coarsens its point', async () => {
		const result = await resolveFormPlace(db, form({ place_id: 'local:merrowgate-saltmarket', place_query: 'Saltm' }));
		expect(result).toMatchObject({ ok: true, place: { name: 'Saltmarket', country: 'FR' } });
		if (result.ok) expect(Math.abs(result.place.lat - 46.8466)).toBeLessThan(0.0091);
	});

	it('without JavaScript, takes the best match for the typed name in the chosen country', async () => {
		const result = await resolveFormPlace(db, form({ place_query: 'Lyon', place_country: 'fr' }));
		expect(result).toMatchObject({ ok: true, place: { id: 'geonames:2996944', country: 'FR' } });
	});

	it('says plainly when nothing matches', async () => {
		const result = await resolveFormPlace(db, form({ place_query: 'Qqxzzy', place_country: 'FR' }));
		expect(result).toEqual({
			ok: false,
			message: expect.stringMatching(/could not find a town called “Qqxzzy” in that country/)
		});
	});

	it('keeps only about a kilometre of "use my location" and names the place', async () => {
		const result = await resolveFormPlace(
			db,
			form({ place_id: 'here', place_lat: '46.858712', place_lng: '3.220143', place_query: '' })
		);
		expect(result).toMatchObject({ ok: true, place: { id: 'here', name: 'Loomside' } });
		if (result.ok) expect(String(result.place.lat)).not.toBe('46.858712');
	});

	it('refuses a location without coordinates', async () => {
		expect(await resolveFormPlace(db, form({ place_id: 'here' }))).toMatchObject({ ok: false });
	});

	it('refuses an id of the wrong shape at parse time', () => {
		expect(placeFields.safeParse({ place_id: "local:x'; drop table" }).success).toBe(false);
	});
});
