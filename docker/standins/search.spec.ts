// The stand-in driven through the real `meilisearch` client, as the app drives it.
import { Meilisearch } from 'meilisearch';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startSearchStandin } from './search';

let standin: Awaited<ReturnType<typeof startSearchStandin>>;
let client: Meilisearch;

beforeAll(async () => {
	standin = await startSearchStandin({ port: 0 });
	client = new Meilisearch({ host: standin.env.MEILI_HOST, apiKey: standin.env.MEILI_MASTER_KEY });
	const index = client.index('commissions');
	await client.createIndex('commissions', { primaryKey: 'id' }).waitTask();
	await index
		.updateSettings({
			filterableAttributes: ['garment', 'budgetMax', '_geo'],
			sortableAttributes: ['publishedAt', '_geo'],
			searchableAttributes: ['title', 'styleNotes']
		})
		.waitTask();
	await index
		.addDocuments([
			{
				id: 'a',
				title: 'Linen shift dress',
				styleNotes: 'boat neck',
				garment: 'shift-dress',
				budgetMax: 12000,
				publishedAt: 3,
				_geo: { lat: 46.851, lng: 3.209 }
			},
			{
				id: 'b',
				title: 'Wool straight skirt',
				styleNotes: 'lined, kick pleat',
				garment: 'straight-skirt',
				budgetMax: 8000,
				publishedAt: 2,
				_geo: { lat: 46.88, lng: 3.24 }
			},
			{
				id: 'c',
				title: 'Dress for a wedding',
				styleNotes: 'silk',
				garment: 'shift-dress',
				budgetMax: 30000,
				publishedAt: 1,
				_geo: { lat: 47.4, lng: 3.9 }
			}
		])
		.waitTask();
});
afterAll(() => standin.stop());

describe('search stand-in', () => {
	it('finds by text, with prefixes and a typo', async () => {
		expect((await client.index('commissions').search('dres')).hits.map((h) => h.id).sort()).toEqual(['a', 'c']);
		expect((await client.index('commissions').search('skort')).hits.map((h) => h.id)).toEqual(['b']);
	});

	it('filters by radius and sorts by distance, giving the distance in metres', async () => {
		const result = await client.index('commissions').search('', {
			filter: ['_geoRadius(46.851, 3.209, 10000)'],
			sort: ['_geoPoint(46.851, 3.209):asc']
		});
		expect(result.hits.map((h) => h.id)).toEqual(['a', 'b']);
		expect(result.hits[0]._geoDistance).toBe(0);
		expect(result.hits[1]._geoDistance).toBeGreaterThan(3000);
		expect(result.estimatedTotalHits).toBe(2);
	});

	it('sorts by a field, pages with limit and offset, and counts facets', async () => {
		const result = await client.index('commissions').search('', {
			sort: ['publishedAt:desc'],
			limit: 1,
			offset: 1,
			facets: ['garment']
		});
		expect(result.hits.map((h) => h.id)).toEqual(['b']);
		expect(result.facetDistribution).toEqual({ garment: { 'shift-dress': 2, 'straight-skirt': 1 } });
	});

	it('replaces and deletes documents', async () => {
		const index = client.index('commissions');
		await index.addDocuments([{ id: 'd', title: 'Tunic', garment: 'tunic', budgetMax: 1, publishedAt: 0 }]).waitTask();
		expect((await index.search('tunic')).hits).toHaveLength(1);
		await index.deleteDocument('d').waitTask();
		expect((await index.search('tunic')).hits).toHaveLength(0);
	});

	it("answers errors in the service's own shape", async () => {
		await expect(client.index('commissions').search('', { filter: 'title = x' })).rejects.toMatchObject({
			cause: { code: 'invalid_search_filter' }
		});
		const failed = await client
			.index('commissions')
			.addDocuments([{ title: 'no id' }])
			.waitTask();
		expect(failed.status).toBe('failed');
		const wrongKey = new Meilisearch({ host: standin.env.MEILI_HOST, apiKey: 'wrong' });
		await expect(wrongKey.index('commissions').search('')).rejects.toMatchObject({
			cause: { code: 'invalid_api_key' }
		});
	});

	it('stops answering when stopped and starts again empty', async () => {
		await standin.stop();
		expect((await client.health().catch(() => null))?.status).toBeUndefined();
		await standin.start();
		expect((await client.health()).status).toBe('available');
		await expect(client.index('commissions').search('')).rejects.toMatchObject({ cause: { code: 'index_not_found' } });
	});
});
