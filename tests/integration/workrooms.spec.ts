import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { tailorProfile, user } from '../../src/lib/server/db/schema';
import * as workrooms from '../../src/lib/server/workrooms';
import { createPortfolioPhoto, createUser, type Person } from '../factories';
import { testDb } from './db';
import { baseUrl, newClient, signIn, type Client } from './http';

const { db, pool } = testDb();
afterAll(() => pool.end());

// Loomside is one of the demo city's districts, added to the place list by the seed.
const loomside = { placeId: 'local:merrowgate-loomside' };

function fullWorkroom(overrides: Record<string, unknown> = {}) {
	return {
		name: 'Gull Yard Tailoring',
		bio: 'Trousers and skirts cut to your own measurements, with two fittings as standard.',
		specialties: ['straight-skirt', 'wide-leg-trousers'],
		location: loomside,
		serviceRadiusKm: 12,
		capacity: 3,
		leadTimes: { 'straight-skirt': 10, 'wide-leg-trousers': 18 },
		rates: {
			hourlyRateMinor: 3450,
			currency: 'EUR',
			labourHours: { 'straight-skirt': 5, 'wide-leg-trousers': 8.5 },
			fabricMarkupPercent: 15
		},
		...overrides
	};
}

async function sendJson(client: Client | null, method: string, path: string, body?: unknown) {
	const cookie = client ? [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ') : '';
	return fetch(baseUrl + path, {
		method,
		headers: {
			origin: baseUrl,
			'x-forwarded-for': client?.address ?? '198.18.0.1',
			...(body === undefined ? {} : { 'content-type': 'application/json' }),
			...(cookie ? { cookie } : {})
		},
		body: body === undefined ? undefined : JSON.stringify(body)
	});
}

async function signedIn(role: Person['role'], options: { suspended?: boolean } = {}) {
	const person = await createUser(db, { role });
	const client = newClient();
	expect((await signIn(client, person.email, person.password)).status).toBe(303);
	if (options.suspended) await db.update(user).set({ suspendedAt: new Date() }).where(eq(user.id, person.id));
	return { person, client };
}

/** A portfolio photo row, as the portfolio area stores one (the image itself is not fetched here). */
function addPortfolioPhoto(tailorId: string) {
	return createPortfolioPhoto(db, { tailorId, altText: 'A charcoal straight skirt on a stand' });
}

async function onboardedAt(tailorId: string) {
	const [row] = await db
		.select({ onboardedAt: tailorProfile.onboardedAt })
		.from(tailorProfile)
		.where(eq(tailorProfile.userId, tailorId));
	return row?.onboardedAt ?? null;
}

describe('PUT /api/v1/workroom', () => {
	it('answers 401 to anonymous callers and 403 to customers and admins', async () => {
		const anonymous = await sendJson(null, 'PUT', '/api/v1/workroom', fullWorkroom());
		expect(anonymous.status).toBe(401);
		expect((await anonymous.json()) as unknown).toMatchObject({ error: { code: 'unauthenticated' } });
		for (const role of ['customer', 'admin'] as const) {
			const { client } = await signedIn(role);
			const response = await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom());
			expect(response.status, role).toBe(403);
			expect(((await response.json()) as { error: { code: string } }).error.code).toBe('forbidden');
		}
	});

	it('treats a suspended tailor as signed out', async () => {
		const { client } = await signedIn('tailor', { suspended: true });
		expect((await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom())).status).toBe(401);
	});

	it('refuses bad fields with 400 and the path of each', async () => {
		const { client } = await signedIn('tailor');
		const response = await sendJson(
			client,
			'PUT',
			'/api/v1/workroom',
			fullWorkroom({ specialties: ['ball-gown'], capacity: 0, rates: { hourlyRateMinor: 12.5, currency: 'EURO' } })
		);
		expect(response.status).toBe(400);
		const body = (await response.json()) as { error: { code: string; issues: { path: string }[] } };
		expect(body.error.code).toBe('invalid_input');
		const paths = body.error.issues.map((issue) => issue.path);
		expect(paths).toEqual(
			expect.arrayContaining(['specialties.0', 'capacity', 'rates.hourlyRateMinor', 'rates.currency'])
		);
	});

	it('refuses a place that is not in the place list', async () => {
		const { client } = await signedIn('tailor');
		const response = await sendJson(
			client,
			'PUT',
			'/api/v1/workroom',
			fullWorkroom({ location: { placeId: 'local:nowhere-at-all' } })
		);
		expect(response.status).toBe(400);
		const body = (await response.json()) as { error: { issues: { path: string }[] } };
		expect(body.error.issues.map((issue) => issue.path)).toEqual(['location.placeId']);
	});

	it('saves every field, lists what onboarding still needs, and completes once a photo is there', async () => {
		const { person, client } = await signedIn('tailor');
		const response = await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom());
		expect(response.status).toBe(200);
		const body = (await response.json()) as {
			workroom: Record<string, unknown>;
			onboarding: { complete: boolean; missing: string[] };
		};
		expect(body.onboarding).toEqual({ complete: false, missing: ['portfolio'] });
		expect(body.workroom).toMatchObject({
			id: person.id,
			slug: 'gull-yard-tailoring',
			name: 'Gull Yard Tailoring',
			specialties: ['straight-skirt', 'wide-leg-trousers'],
			location: { town: 'Merrowgate', district: 'Loomside', country: 'FR' },
			serviceRadiusKm: 12,
			capacity: 3,
			leadTimes: { 'straight-skirt': 10, 'wide-leg-trousers': 18 },
			rates: { hourlyRateMinor: 3450, currency: 'EUR', fabricMarkupPercent: 15 },
			onboardedAt: null,
			url: '/workrooms/gull-yard-tailoring'
		});
		expect(await onboardedAt(person.id)).toBeNull();

		await addPortfolioPhoto(person.id);
		expect(await workrooms.onboardingStatus(db, { tailorId: person.id })).toEqual({ complete: true, missing: [] });
		expect(await onboardedAt(person.id)).toBeInstanceOf(Date);
		expect(await workrooms.canQuote(db, { tailorId: person.id })).toBe(true);

		const own = await sendJson(client, 'GET', '/api/v1/workroom');
		expect(((await own.json()) as typeof body).onboarding).toEqual({ complete: true, missing: [] });
	});

	it('is a full replace: leaving the rates out clears them and takes the workroom off the list', async () => {
		const { person, client } = await signedIn('tailor');
		await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom({ name: 'Ropewalk Alterations' }));
		await addPortfolioPhoto(person.id);
		expect(await workrooms.canQuote(db, { tailorId: person.id })).toBe(true);
		expect((await sendJson(null, 'GET', `/api/v1/tailors/${person.id}`)).status).toBe(200);

		const { rates: _, ...withoutRates } = fullWorkroom({ name: 'Ropewalk Alterations' });
		const response = await sendJson(client, 'PUT', '/api/v1/workroom', withoutRates);
		const body = (await response.json()) as { workroom: { rates: unknown }; onboarding: unknown };
		expect(body.workroom.rates).toBeNull();
		expect(body.onboarding).toEqual({ complete: false, missing: ['rates'] });
		expect(await onboardedAt(person.id)).toBeNull();
		expect(await workrooms.canQuote(db, { tailorId: person.id })).toBe(false);
		expect((await sendJson(null, 'GET', `/api/v1/tailors/${person.id}`)).status).toBe(404);
	});

	it('keeps the slug when the workroom is renamed, and gives a second workroom of the same name its own', async () => {
		const first = await signedIn('tailor');
		const second = await signedIn('tailor');
		await sendJson(first.client, 'PUT', '/api/v1/workroom', fullWorkroom({ name: 'Tidewater Stitch' }));
		const other = await sendJson(second.client, 'PUT', '/api/v1/workroom', fullWorkroom({ name: 'Tidewater Stitch' }));
		expect(((await other.json()) as { workroom: { slug: string } }).workroom.slug).toBe('tidewater-stitch-2');

		const renamed = await sendJson(
			first.client,
			'PUT',
			'/api/v1/workroom',
			fullWorkroom({ name: 'Tidewater Bespoke' })
		);
		const { workroom } = (await renamed.json()) as { workroom: { slug: string; name: string } };
		expect(workroom).toMatchObject({ name: 'Tidewater Bespoke', slug: 'tidewater-stitch' });
	});
});

describe('GET /api/v1/tailors/{id}', () => {
	it('shows an onboarded workroom by its town, with no coordinates anywhere', async () => {
		const { person, client } = await signedIn('tailor');
		await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom({ name: 'Saltpan Sewing Room' }));
		await addPortfolioPhoto(person.id);
		await workrooms.onboardingStatus(db, { tailorId: person.id });

		const response = await sendJson(null, 'GET', `/api/v1/tailors/${person.id}`);
		expect(response.status).toBe(200);
		const text = await response.text();
		const body = JSON.parse(text) as Record<string, unknown>;
		expect(body).toMatchObject({
			id: person.id,
			slug: 'saltpan-sewing-room',
			name: 'Saltpan Sewing Room',
			area: { town: 'Merrowgate', district: 'Loomside', country: 'FR' },
			specialties: [
				{ id: 'straight-skirt', name: 'Straight skirt', leadTimeDays: 10 },
				{ id: 'wide-leg-trousers', leadTimeDays: 18 }
			],
			reviews: { count: 0, averageHundredths: null },
			url: '/workrooms/saltpan-sewing-room'
		});
		expect(typeof body.memberSince).toBe('string');
		const portfolio = body.portfolio as { photos: { thumbUrl: string }[] }[];
		expect(portfolio[0].photos[0].thumbUrl).toMatch(/^\/photos\/[0-9a-f-]{36}\/thumb$/);
		// Neither the keys nor the stored coordinates (or rates) reach the public.
		const [row] = await db
			.select({ lat: tailorProfile.lat, lng: tailorProfile.lng })
			.from(tailorProfile)
			.where(eq(tailorProfile.userId, person.id));
		expect(text).not.toMatch(/"(lat|lng|latitude|longitude|rates|hourlyRateMinor)"/);
		expect(text).not.toContain(String(row.lat));
		expect(text).not.toContain(String(row.lng));
	});

	it('answers 404 before onboarding is complete, for a suspended tailor and for anyone unknown', async () => {
		const { person, client } = await signedIn('tailor');
		await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom({ name: 'Half Done Workroom' }));
		const notYet = await sendJson(null, 'GET', `/api/v1/tailors/${person.id}`);
		expect(notYet.status).toBe(404);
		expect(((await notYet.json()) as { error: { code: string } }).error.code).toBe('not_found');

		await addPortfolioPhoto(person.id);
		await workrooms.onboardingStatus(db, { tailorId: person.id });
		expect((await sendJson(null, 'GET', `/api/v1/tailors/${person.id}`)).status).toBe(200);
		await db.update(user).set({ suspendedAt: new Date() }).where(eq(user.id, person.id));
		expect((await sendJson(null, 'GET', `/api/v1/tailors/${person.id}`)).status).toBe(404);

		const customer = await createUser(db);
		expect((await sendJson(null, 'GET', `/api/v1/tailors/${customer.id}`)).status).toBe(404);
		expect((await sendJson(null, 'GET', `/api/v1/tailors/${crypto.randomUUID()}`)).status).toBe(404);
	});
});

describe('onboarding through the setup pages', () => {
	it('starts with the name and place, keeps what was typed on error and moves on to the next section', async () => {
		const { person, client } = await signedIn('tailor');
		const home = await (await client.get('/workroom')).text();
		expect(home).toContain('0 of 8 steps done');
		expect(home).toContain('href="/workroom/setup/workroom"');

		const early = await client.post('/workroom/setup/about', { bio: 'Skirts and trousers, cut to measure.' });
		expect(early.status).toBe(409);
		expect(await early.text()).toContain('Start with your workroom’s name and place');

		const wrong = await client.post('/workroom/setup/workroom', {
			name: 'Brinewater Cutting Room',
			place_id: 'local:merrowgate-saltmarket',
			place_query: 'Saltmarket',
			serviceRadiusKm: '900',
			capacity: '2'
		});
		expect(wrong.status).toBe(400);
		const wrongPage = await wrong.text();
		expect(wrongPage).toContain('Brinewater Cutting Room');
		expect(wrongPage).toContain('Choose a distance from 1 to 200 km.');

		const basics = await client.post('/workroom/setup/workroom', {
			name: 'Brinewater Cutting Room',
			place_id: 'local:merrowgate-saltmarket',
			place_query: 'Saltmarket',
			serviceRadiusKm: '9',
			capacity: '2'
		});
		expect(basics.status).toBe(303);
		expect(basics.headers.get('location')).toBe('/workroom/setup/about');

		expect(
			(
				await client.post('/workroom/setup/about', { bio: 'Skirts and trousers, cut to measure in Saltmarket.' })
			).headers.get('location')
		).toBe('/workroom/setup/garments');

		const noLeadTime = await client.post('/workroom/setup/garments', { 'make_a-line-skirt': 'on' });
		expect(noLeadTime.status).toBe(400);
		expect(await noLeadTime.text()).toContain('Give a typical lead time in days.');
		const garments = await client.post('/workroom/setup/garments', {
			'make_a-line-skirt': 'on',
			'lead_a-line-skirt': '12',
			lead_tunic: '30'
		});
		expect(garments.headers.get('location')).toBe('/workroom/setup/rates');

		const badRate = await client.post('/workroom/setup/rates', {
			hourlyRate: '28.505',
			currency: 'EUR',
			fabricMarkupPercent: '10',
			'hours_a-line-skirt': '4'
		});
		expect(badRate.status).toBe(400);
		expect(await badRate.text()).toContain('Use at most 2 decimals for EUR.');
		const rates = await client.post('/workroom/setup/rates', {
			hourlyRate: '28.50',
			currency: 'EUR',
			fabricMarkupPercent: '10',
			'hours_a-line-skirt': '4.5'
		});
		expect(rates.headers.get('location')).toBe('/workroom/portfolio');

		const own = await workrooms.getOwn(db, { tailorId: person.id });
		expect(own).toMatchObject({
			name: 'Brinewater Cutting Room',
			location: { town: 'Merrowgate', district: 'Saltmarket', country: 'FR' },
			specialties: ['a-line-skirt'],
			leadTimes: { 'a-line-skirt': 12 },
			rates: { hourlyRateMinor: 2850, currency: 'EUR', labourHours: { 'a-line-skirt': 4.5 }, fabricMarkupPercent: 10 }
		});
		const after = await (await client.get('/workroom')).text();
		expect(after).toContain('7 of 8 steps done');
		expect(after).toContain('href="/workroom/portfolio"');
	});
});

describe('public workroom pages', () => {
	it('show the town, the garments and a safety note, and never the coordinates', async () => {
		const { person, client } = await signedIn('tailor');
		await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom({ name: 'Lantern Steps Atelier' }));
		await addPortfolioPhoto(person.id);
		await workrooms.onboardingStatus(db, { tailorId: person.id });

		const page = await newClient().get('/workrooms/lantern-steps-atelier');
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('Lantern Steps Atelier');
		expect(html).toContain('Loomside, Merrowgate');
		expect(html).toContain('No reviews yet');
		expect(html).toContain('Meet at the workroom or in a public place');
		const [row] = await db
			.select({ lat: tailorProfile.lat, lng: tailorProfile.lng })
			.from(tailorProfile)
			.where(eq(tailorProfile.userId, person.id));
		expect(html).not.toContain(String(row.lat));
		expect(html).not.toContain(String(row.lng));

		const byId = await newClient().get(`/workrooms/${person.id}`);
		expect(byId.status).toBe(301);
		expect(byId.headers.get('location')).toBe('/workrooms/lantern-steps-atelier');

		const directory = await (await newClient().get('/workrooms?garment=wide-leg-trousers')).text();
		expect(directory).toContain('Lantern Steps Atelier');
		const filteredOut = await (await newClient().get('/workrooms?garment=tunic&town=Merrowgate')).text();
		expect(filteredOut).not.toContain('Lantern Steps Atelier');
	});

	it('answer 404 for a workroom still being set up', async () => {
		const { client } = await signedIn('tailor');
		await sendJson(client, 'PUT', '/api/v1/workroom', fullWorkroom({ name: 'Not Ready Yet Room' }));
		expect((await newClient().get('/workrooms/not-ready-yet-room')).status).toBe(404);
	});

	it('page through the directory by name', async () => {
		const first = await workrooms.listDirectory(db, { limit: 3 });
		expect(first.items).toHaveLength(3);
		expect(first.next).toBe(first.items[2].slug);
		const second = await workrooms.listDirectory(db, { limit: 3, after: first.next! });
		const both = await workrooms.listDirectory(db, { limit: 6 });
		expect([...first.items, ...second.items].map((w) => w.slug)).toEqual(both.items.map((w) => w.slug));
	});
});
