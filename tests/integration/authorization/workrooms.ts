/**
 * Workrooms: only a tailor changes their own; anyone may read an onboarded one, and nobody reads its exact
 * point or its rates.
 */
import { randomUUID } from 'node:crypto';
import { createWorkroom } from '../../factories';
import { everyone, signInRedirect, suspendedRedirect, tailorApi, type Row, type World } from './matrix';

type Workroom = { id: string; slug: string; secrets: string[] };

/** An exact point and a rate no public answer may carry. */
const exact = { lat: 46.858731, lng: 3.220187 };
const hourlyRateMinor = 3917;

async function workroom({ db }: World, { onboarded = true } = {}): Promise<Workroom> {
	const tailor = await createWorkroom(db, {
		onboarded,
		profile: { lat: exact.lat, lng: exact.lng, hourlyRateMinor, rateCurrency: 'EUR' }
	});
	return { id: tailor.id, slug: tailor.slug, secrets: [String(exact.lat), String(exact.lng), String(hourlyRateMinor)] };
}

const replacement = () => ({
	name: `Gull Yard ${randomUUID().slice(0, 8)}`,
	bio: 'Trousers and skirts cut to your own measurements, with two fittings as standard.',
	specialties: ['straight-skirt'],
	location: { placeId: 'local:merrowgate-loomside' },
	serviceRadiusKm: 12,
	capacity: 3,
	leadTimes: { 'straight-skirt': 10 },
	rates: { hourlyRateMinor: 3450, currency: 'EUR', labourHours: { 'straight-skirt': 5 }, fabricMarkupPercent: 15 }
});

export const workroomRows: Row<Workroom>[] = [
	{
		name: 'PUT /api/v1/workroom',
		arrange: (world) => workroom(world),
		send: (client) => client.json('PUT', '/api/v1/workroom', replacement()),
		expect: tailorApi(200)
	},
	{
		name: 'POST /api/v1/workroom/portfolio',
		arrange: (world) => workroom(world),
		send: (client) => client.json('POST', '/api/v1/workroom/portfolio', { caption: 'Linen trousers' }),
		expect: tailorApi(201)
	},
	{
		name: 'GET /api/v1/tailors/{id} (onboarded)',
		arrange: (world) => workroom(world),
		send: (client, { id }) => client.json('GET', `/api/v1/tailors/${id}`),
		expect: everyone(200)
	},
	{
		name: 'GET /api/v1/tailors/{id} (still setting up)',
		arrange: (world) => workroom(world, { onboarded: false }),
		send: (client, { id }) => client.json('GET', `/api/v1/tailors/${id}`),
		expect: everyone(404)
	},
	{
		name: 'GET /workrooms/{slug}',
		arrange: (world) => workroom(world),
		send: (client, { slug }) => client.get(`/workrooms/${slug}`),
		expect: everyone(200)
	},
	{
		name: 'GET /workroom/setup/rates',
		arrange: (world) => workroom(world),
		send: (client) => client.get('/workroom/setup/rates'),
		expect: { ...tailorApi(200), anonymous: signInRedirect, suspended: suspendedRedirect }
	},
	{
		name: 'GET /workroom/portfolio',
		arrange: (world) => workroom(world),
		send: (client) => client.get('/workroom/portfolio'),
		expect: { ...tailorApi(200), anonymous: signInRedirect, suspended: suspendedRedirect }
	}
];
