/**
 * Search near me end to end: commissions published through the API reach the index through the outbox and
 * the sync job; tailors find them by distance and filters, page through them, and get the same lists from
 * PostgreSQL while search is away; the index catches up when it is back.
 */
import { Meilisearch } from 'meilisearch';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCustomerWithProfile, createWorkroom } from '../factories';
import { testDb } from './db';
import { baseUrl, signedIn, type Client } from './http';
import { searchStandin } from './search';

const { db, pool } = testDb();
afterAll(() => pool.end());

/** A spot far from the demo city, so only this file's commissions are near it. */
const centre = { lat: 47.9, lng: 7.85 };
/** About 3 km and about 60 km north of the centre (a degree of latitude is about 111 km). */
const near3km = { lat: centre.lat + 0.027, lng: centre.lng };
const far60km = { lat: centre.lat + 0.54, lng: centre.lng };

function later(days: number) {
	return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

type Body = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

async function api(
	client: Client | null,
	method: string,
	path: string,
	body?: unknown,
	extra: Record<string, string> = {}
) {
	const response = client
		? await client.json(method, path, body, extra)
		: await fetch(baseUrl + path, { headers: { 'x-forwarded-for': '198.18.0.9', ...extra } });
	const text = await response.text();
	return {
		status: response.status,
		source: response.headers.get('x-search-source'),
		body: (text ? JSON.parse(text) : null) as Body
	};
}

let customer: Client;
let profileId: string;
let nearTailor: Client;
let farTailor: Client;

beforeAll(async () => {
	const { person, profileId: id } = await createCustomerWithProfile(db, { name: 'Morwenna Tregear' });
	profileId = id;
	customer = await signedIn(person);
	const [nearby, distant] = await Promise.all([
		createWorkroom(db, { profile: { lat: near3km.lat, lng: near3km.lng, serviceRadiusKm: 25 } }),
		createWorkroom(db, { profile: { lat: far60km.lat, lng: far60km.lng, serviceRadiusKm: 25 } })
	]);
	[nearTailor, farTailor] = await Promise.all([signedIn(nearby), signedIn(distant)]);
});

type Posting = {
	title?: string;
	garment?: string;
	at?: { lat: number; lng: number };
	budget?: { minMinor: number; maxMinor: number };
	fabricSource?: string;
	dateNeeded?: string;
	styleNotes?: string;
};

/** A commission drafted and published through the API, as a customer would. */
async function publish(posting: Posting = {}) {
	const at = posting.at ?? centre;
	const created = await api(customer, 'POST', '/api/v1/commissions', {
		garment: posting.garment ?? 'straight-skirt',
		title: posting.title ?? 'Grey flannel skirt',
		styleNotes: posting.styleNotes ?? 'Knee length, back vent, lined.',
		measurementProfileId: profileId,
		fabricSource: posting.fabricSource ?? 'tailor_sources',
		fabricNotes: '',
		budget: { ...(posting.budget ?? { minMinor: 9000, maxMinor: 14000 }), currency: 'EUR' },
		dateNeeded: posting.dateNeeded ?? later(60),
		location: { lat: at.lat, lng: at.lng, name: 'Testbury', country: 'FR' },
		handover: 'pickup'
	});
	expect(created.status, JSON.stringify(created.body)).toBe(201);
	const published = await api(customer, 'POST', `/api/v1/commissions/${created.body.id}/publish`);
	expect(published.status, JSON.stringify(published.body)).toBe(200);
	return created.body.id as string;
}

const ids = (body: Body) => (body.items as { id: string }[]).map((item) => item.id);

/** Polls until `check` passes (the sync job runs in the background). */
async function eventually<T>(read: () => Promise<T>, check: (value: T) => boolean, timeoutMs = 20_000) {
	const until = Date.now() + timeoutMs;
	let value = await read();
	while (!check(value) && Date.now() < until) {
		await new Promise((resolve) => setTimeout(resolve, 250));
		value = await read();
	}
	return value;
}

function engine() {
	const { MEILI_HOST, MEILI_MASTER_KEY } = searchStandin().env;
	return new Meilisearch({ host: MEILI_HOST, apiKey: MEILI_MASTER_KEY });
}

async function indexed(id: string) {
	try {
		await engine().index('commissions').getDocument(id);
		return true;
	} catch {
		return false;
	}
}

const near = `near=${centre.lat},${centre.lng}`;
let skirt: string;

describe('finding open commissions near a workroom', () => {
	it('finds a published commission for a tailor 3 km away, and not for one 60 km away', async () => {
		skirt = await publish({ title: 'Grey flannel skirt' });
		const found = await eventually(
			() => api(nearTailor, 'GET', '/api/v1/commissions'),
			(answer) => ids(answer.body).includes(skirt)
		);
		expect(found.status).toBe(200);
		expect(found.source).toBe('index');
		const item = found.body.items.find((entry: Body) => entry.id === skirt);
		expect(item).toMatchObject({
			title: 'Grey flannel skirt',
			garment: 'straight-skirt',
			budget: { minMinor: 9000, maxMinor: 14000, currency: 'EUR' },
			dateNeeded: later(60)
		});
		expect(item.sizeBand.length).toBeGreaterThan(0);
		expect(item.sizeBand[0]).toEqual({
			dimension: expect.any(String),
			lowerMm: expect.any(Number),
			upperMm: expect.any(Number)
		});
		// Both points are coarsened to about a kilometre, so "about 3 km" is all that can be said.
		expect(item.distanceKm).toBeGreaterThan(1.5);
		expect(item.distanceKm).toBeLessThan(4.5);
		expect(item).not.toHaveProperty('measurements');

		const distant = await api(farTailor, 'GET', '/api/v1/commissions');
		expect(distant.status).toBe(200);
		expect(ids(distant.body)).not.toContain(skirt);
		const wider = await api(farTailor, 'GET', '/api/v1/commissions?radiusKm=80');
		expect(ids(wider.body)).toContain(skirt);
	});

	it('narrows by garment, budget, date needed, fabric and words', async () => {
		const query = (extra: string) => api(nearTailor, 'GET', `/api/v1/commissions?${near}&radiusKm=10&${extra}`);
		const cases: [string, boolean][] = [
			['garment=straight-skirt', true],
			['garment=tunic', false],
			['budgetMin=12000', true],
			['budgetMin=15000', false],
			['budgetMax=8000', false],
			[`dateNeededBefore=${later(61)}`, true],
			[`dateNeededBefore=${later(30)}`, false],
			['fabricSource=tailor_sources', true],
			['fabricSource=customer_supplies', false],
			['q=flannel', true],
			['q=velvet', false]
		];
		for (const [extra, expected] of cases) {
			const answer = await query(extra);
			expect(answer.status, extra).toBe(200);
			expect(ids(answer.body).includes(skirt), extra).toBe(expected);
		}
	});

	it('refuses parameters it cannot read, naming each', async () => {
		for (const [extra, path] of [
			['near=north', 'near'],
			['radiusKm=0', 'radiusKm'],
			['radiusKm=5000', 'radiusKm'],
			['sort=cheapest', 'sort'],
			['cursor=not-a-cursor', 'cursor'],
			['limit=500', 'limit'],
			['garment=cape', 'garment'],
			['dateNeededBefore=tomorrow', 'dateNeededBefore'],
			['budgetMin=9000&budgetMax=100', 'budgetMax']
		]) {
			const answer = await api(nearTailor, 'GET', `/api/v1/commissions?${extra}`);
			expect(answer.status, extra).toBe(400);
			expect(answer.body.error.code).toBe('invalid_input');
			expect(
				answer.body.error.issues.map((issue: { path: string }) => issue.path),
				extra
			).toContain(path);
		}
	});

	it('answers only tailors', async () => {
		expect((await api(null, 'GET', '/api/v1/commissions')).status).toBe(401);
		expect((await api(customer, 'GET', '/api/v1/commissions')).status).toBe(403);
	});
});

/** A second spot with a handful of commissions, for paging and the fallback. */
const cluster = { lat: 48.3, lng: 8.4 };
const clusterQuery = `near=${cluster.lat},${cluster.lng}&radiusKm=30`;
const clusterIds: string[] = [];

/**
 * Every page of a list. `fresh` asks the app itself (`Cache-Control: no-cache`): an answer kept from before
 * would still be right while nothing changed, but would not show which path the app takes now.
 */
async function readAll(client: Client, query: string, limit: number, { fresh = false } = {}) {
	const pages: { ids: string[]; cursor: string | null; source: string | null }[] = [];
	let cursor: string | null = null;
	do {
		const answer = await api(
			client,
			'GET',
			`/api/v1/commissions?${query}&limit=${limit}${cursor ? `&cursor=${cursor}` : ''}`,
			undefined,
			fresh ? { 'cache-control': 'no-cache' } : {}
		);
		expect(answer.status, JSON.stringify(answer.body)).toBe(200);
		cursor = answer.body.nextCursor;
		pages.push({ ids: ids(answer.body), cursor, source: answer.source });
	} while (cursor && pages.length < 20);
	return pages;
}

describe('paging', () => {
	beforeAll(async () => {
		// Two at the same point (a tie broken by id), the rest a couple of kilometres apart.
		const offsets = [0, 0, 0.02, 0.04, 0.06, 0.08, 0.1];
		for (const [i, offset] of offsets.entries())
			clusterIds.push(
				await publish({ title: `Cluster skirt ${i}`, at: { lat: cluster.lat + offset, lng: cluster.lng } })
			);
		await eventually(
			() => Promise.all(clusterIds.map(indexed)),
			(found) => found.every(Boolean)
		);
	});

	it('walks the whole list by distance with keyset cursors, nearest first, no repeats', async () => {
		const pages = await readAll(nearTailor, `${clusterQuery}&sort=distance`, 3);
		expect(pages.map((page) => page.ids.length)).toEqual([3, 3, 1]);
		expect(pages.at(-1)!.cursor).toBeNull();
		const all = pages.flatMap((page) => page.ids);
		expect(new Set(all).size).toBe(7);
		expect(new Set(all)).toEqual(new Set(clusterIds));
		// The two at the centre come first, the farthest last.
		expect(new Set(all.slice(0, 2))).toEqual(new Set(clusterIds.slice(0, 2)));
		expect(all.at(-1)).toBe(clusterIds.at(-1));
	});

	it('walks the list newest first', async () => {
		const pages = await readAll(nearTailor, `${clusterQuery}&sort=newest`, 4);
		expect(pages.flatMap((page) => page.ids)).toEqual([...clusterIds].reverse());
	});

	it('gives the same lists, pages and cursors from PostgreSQL while search is away, and catches up after', async () => {
		const fromIndex = {
			distance: await readAll(nearTailor, `${clusterQuery}&sort=distance`, 3),
			newest: await readAll(nearTailor, `${clusterQuery}&sort=newest`, 2),
			filtered: await readAll(nearTailor, `${clusterQuery}&q=cluster&budgetMin=10000`, 5)
		};
		expect(fromIndex.distance.every((page) => page.source === 'index')).toBe(true);

		await searchStandin().stop();
		try {
			const fromDatabase = {
				distance: await readAll(nearTailor, `${clusterQuery}&sort=distance`, 3, { fresh: true }),
				newest: await readAll(nearTailor, `${clusterQuery}&sort=newest`, 2, { fresh: true }),
				filtered: await readAll(nearTailor, `${clusterQuery}&q=cluster&budgetMin=10000`, 5, { fresh: true })
			};
			expect(fromDatabase.distance.every((page) => page.source === 'database')).toBe(true);
			const strip = (pages: typeof fromIndex.distance) => pages.map(({ ids, cursor }) => ({ ids, cursor }));
			expect(strip(fromDatabase.distance)).toEqual(strip(fromIndex.distance));
			expect(strip(fromDatabase.newest)).toEqual(strip(fromIndex.newest));
			expect(strip(fromDatabase.filtered)).toEqual(strip(fromIndex.filtered));

			// Health remembers its last check for a few seconds.
			const health = await eventually(
				async () => {
					const response = await fetch(`${baseUrl}/api/v1/health`);
					return { status: response.status, body: (await response.json()) as Body };
				},
				(answer) => answer.body.checks?.search === 'degraded',
				10_000
			);
			expect(health.status).toBe(200);
			expect(health.body.checks.search).toBe('degraded');

			// Published while search is away: listed at once from PostgreSQL, indexed once search is back.
			const during = await publish({ title: 'Cluster skirt posted in the outage', at: cluster });
			const listed = await api(nearTailor, 'GET', `/api/v1/commissions?${clusterQuery}&sort=newest&limit=1`);
			expect(ids(listed.body)).toEqual([during]);
			clusterIds.push(during);
		} finally {
			await searchStandin().start();
		}

		// The engine came back empty; the sync job rebuilds the index and applies what waited.
		const caughtUp = await eventually(
			() => Promise.all([skirt, ...clusterIds].map(indexed)),
			(found) => found.every(Boolean),
			120_000
		);
		expect(caughtUp.every(Boolean)).toBe(true);
		// The app leaves PostgreSQL within its one-second pause after the outage, not on the very next request.
		const after = await eventually(
			() => readAll(nearTailor, `${clusterQuery}&sort=newest`, 10, { fresh: true }),
			(pages) => pages[0].source === 'index',
			10_000
		);
		expect(after[0].source).toBe('index');
		expect(after[0].ids[0]).toBe(clusterIds.at(-1));
	}, 180_000);

	it('drops a cancelled commission from the list', async () => {
		const gone = clusterIds.at(-1)!;
		expect((await api(customer, 'POST', `/api/v1/commissions/${gone}/cancel`)).status).toBe(200);
		const listed = await api(nearTailor, 'GET', `/api/v1/commissions?${clusterQuery}`);
		expect(ids(listed.body)).not.toContain(gone);
		await eventually(
			() => indexed(gone),
			(present) => !present
		);
		expect(await indexed(gone)).toBe(false);
	});
});

describe('finding workrooms near a place', () => {
	it('lists workrooms taking work nearest first, to anyone, with the distance and no exact point', async () => {
		const query = `/api/v1/tailors?near=${centre.lat},${centre.lng}&radiusKm=20`;
		const answer = await eventually(
			() => api(null, 'GET', query),
			(found) => found.status === 200 && found.body.items.length > 0
		);
		expect(answer.status).toBe(200);
		expect(answer.body.items).toHaveLength(1);
		const [workroom] = answer.body.items;
		expect(workroom).toMatchObject({ specialties: ['straight-skirt', 'wide-leg-trousers'], servesYou: true });
		expect(workroom.distanceKm).toBeGreaterThan(1.5);
		expect(workroom.distanceKm).toBeLessThan(4.5);
		expect(JSON.stringify(workroom)).not.toContain(String(near3km.lat));

		const bySpecialty = await api(null, 'GET', `${query}&garment=tunic`);
		expect(bySpecialty.body.items).toEqual([]);
		const wide = await api(null, 'GET', `/api/v1/tailors?near=${centre.lat},${centre.lng}&radiusKm=100`);
		expect(wide.body.items).toHaveLength(2);
		expect(wide.body.items[0].distanceKm).toBeLessThan(wide.body.items[1].distanceKm);
	});

	it('needs a point, and refuses one it cannot read', async () => {
		for (const query of ['', '?near=91,0', '?near=51.5,-0.1&radiusKm=abc']) {
			const answer = await api(null, 'GET', `/api/v1/tailors${query}`);
			expect(answer.status, query).toBe(400);
			expect(answer.body.error.issues.length).toBeGreaterThan(0);
		}
	});
});
