/** Measurement profiles: only their owner reads or changes them, through pages, form actions or the API. */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { formatLength, toUnitValue, type Measurements } from '../../../src/lib/drafting';
import { measurementProfile } from '../../../src/lib/server/db/schema';
import { createMeasurementProfile } from '../../factories';
import { customerApi, customerPage, type Row, type World } from './matrix';

/** Odd values, so each of their spellings (mm, API cm and in, form cm and in) is found only where it leaks. */
const privateValuesMm: Measurements = { hip_girth: 1013.73, waist_girth: 781.33, waist_to_hip: 213.37 };

export function spellings(valuesMm: Measurements) {
	return Object.values(valuesMm).flatMap((mm) => [
		String(mm),
		String(toUnitValue(mm, 'cm')),
		String(toUnitValue(mm, 'in')),
		formatLength(mm, 'cm'),
		formatLength(mm, 'in')
	]);
}

type OwnedProfile = { id: string; secrets: string[]; before: typeof measurementProfile.$inferSelect };

async function ownersProfile({ db, cast }: World): Promise<OwnedProfile> {
	const note = `private-note-${randomUUID()}`;
	const { id } = await createMeasurementProfile(db, {
		ownerId: cast.owner.id!,
		valuesMm: privateValuesMm,
		notes: note
	});
	const [before] = await db.select().from(measurementProfile).where(eq(measurementProfile.id, id));
	return { id, before, secrets: [note, ...spellings(privateValuesMm)] };
}

async function untouched({ db }: World, { id, before }: OwnedProfile) {
	const [after] = await db.select().from(measurementProfile).where(eq(measurementProfile.id, id));
	expect(after).toEqual(before);
}

const profileForm = (label: string) => ({
	label,
	unit: 'cm',
	takenBy: 'self',
	takenAt: '',
	notes: '',
	'm.hip_girth': '96',
	'm.waist_girth': '72'
});

const api = '/api/v1/measurement-profiles';

export const measurementProfileRows: Row<OwnedProfile>[] = [
	{
		name: `GET ${api}`,
		arrange: ownersProfile,
		send: (client) => client.json('GET', api),
		expect: customerApi(200, 200),
		revealsToOwner: true
	},
	{
		name: `POST ${api}`,
		arrange: ownersProfile,
		send: (client) => client.json('POST', api, { label: `New ${randomUUID()}`, unit: 'cm', values: { hip_girth: 96 } }),
		expect: customerApi(201, 201)
	},
	{
		name: `GET ${api}/{id}`,
		arrange: ownersProfile,
		send: (client, { id }) => client.json('GET', `${api}/${id}`),
		expect: customerApi(200, 404),
		revealsToOwner: true
	},
	{
		name: `PATCH ${api}/{id}`,
		arrange: ownersProfile,
		send: (client, { id }) => client.json('PATCH', `${api}/${id}`, { label: `Renamed ${randomUUID()}` }),
		expect: customerApi(200, 404),
		revealsToOwner: true,
		unchanged: untouched
	},
	{
		name: `DELETE ${api}/{id}`,
		arrange: ownersProfile,
		send: (client, { id }) => client.json('DELETE', `${api}/${id}`),
		expect: customerApi(204, 404),
		unchanged: untouched
	},
	{
		name: 'GET /measurements',
		arrange: ownersProfile,
		send: (client) => client.get('/measurements'),
		expect: customerPage(200, 200)
	},
	{
		name: 'GET /measurements/new',
		arrange: ownersProfile,
		send: (client) => client.get('/measurements/new'),
		expect: customerPage(200, 200)
	},
	{
		name: 'GET /measurements/{id}',
		arrange: ownersProfile,
		send: (client, { id }) => client.get(`/measurements/${id}`),
		expect: customerPage(200, 404),
		revealsToOwner: true
	},
	{
		name: 'POST /measurements/new',
		arrange: ownersProfile,
		send: (client) => client.post('/measurements/new', profileForm(`Form ${randomUUID()}`)),
		expect: customerPage(303, 303)
	},
	{
		name: 'POST /measurements/{id}?/save',
		arrange: ownersProfile,
		send: (client, { id }) => client.post(`/measurements/${id}?/save`, profileForm(`Saved ${randomUUID()}`)),
		expect: customerPage(303, 404),
		unchanged: untouched
	},
	{
		name: 'POST /measurements/{id}?/delete',
		arrange: ownersProfile,
		send: (client, { id }) => client.post(`/measurements/${id}?/delete`),
		expect: customerPage(303, 404),
		unchanged: untouched
	},
	{
		name: 'POST /measurements?/rename',
		arrange: ownersProfile,
		send: (client, { id }) => client.post('/measurements?/rename', { id, label: `Renamed ${randomUUID()}` }),
		expect: customerPage(200, 404),
		unchanged: untouched
	},
	{
		name: 'POST /measurements?/delete',
		arrange: ownersProfile,
		send: (client, { id }) => client.post('/measurements?/delete', { id }),
		expect: customerPage(200, 404),
		unchanged: untouched
	}
];
