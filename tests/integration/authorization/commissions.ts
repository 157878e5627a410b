/**
 * Commissions and their photos: the owner changes them; tailors read an open one without the measurements
 * or the owner's surname; nobody else learns a draft exists.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { neededFor } from '../../../src/lib/server/profiles';
import { commission, commissionMeasurements } from '../../../src/lib/server/db/schema';
import { commissionPhotos } from '../../../src/lib/server/photos';
import { createCommission, createMeasurementProfile } from '../../factories';
import { solid } from '../../factories/images';
import {
	customerApi,
	customerPage,
	signInRedirect,
	suspendedRedirect,
	type Expectations,
	type Row,
	type World
} from './matrix';
import { spellings } from './measurement-profiles';

/** Odd values, so each spelling of them is found only where it leaks. */
function privateValues(garment: string) {
	return Object.fromEntries(neededFor(garment).map((code, i) => [code, 611.37 + 97.11 * i]));
}

type Owned = { id: string; photoId: string | null; secrets: string[]; before: typeof commission.$inferSelect };

/** The owner's surname: tailors see "Wenna P.", never the whole name. */
const surname = 'Polglase';

async function snapshotOf({ db }: World, id: string) {
	const [before] = await db.select().from(commission).where(eq(commission.id, id));
	return before;
}

async function openCommission(world: World, { withPhoto = false } = {}): Promise<Owned> {
	const { db, cast } = world;
	const valuesMm = privateValues('straight-skirt');
	const { id } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
	await db.update(commissionMeasurements).set({ valuesMm }).where(eq(commissionMeasurements.commissionId, id));
	const photo = withPhoto
		? await commissionPhotos.addWithoutChecks(db, { commissionId: id, file: await solid(64, 48).png().toBuffer() })
		: null;
	return {
		id,
		photoId: photo?.id ?? null,
		before: await snapshotOf(world, id),
		secrets: [surname, ...spellings(valuesMm)]
	};
}

/** A draft with everything publishing needs, its profile holding the private values. */
async function readyDraft(world: World): Promise<Owned> {
	const { db, cast } = world;
	const valuesMm = privateValues('straight-skirt');
	const profile = await createMeasurementProfile(db, { ownerId: cast.owner.id!, valuesMm });
	const { id } = await createCommission(db, {
		customerId: cast.owner.id!,
		status: 'draft',
		measurementProfileId: profile.id,
		dateNeeded: new Date(Date.now() + 90 * 86_400_000).toISOString().slice(0, 10)
	});
	return { id, photoId: null, before: await snapshotOf(world, id), secrets: [surname, ...spellings(valuesMm)] };
}

async function untouched(world: World, { id, before }: Owned) {
	expect(await snapshotOf(world, id)).toEqual(before);
}

const api = '/api/v1/commissions';

/** Anyone signed in may read an open commission; only its owner sees the measurements. */
const openToSignedIn: Expectations = {
	anonymous: 401,
	owner: 200,
	otherCustomer: 404,
	tailor: 200,
	tailorOnboarding: 200,
	admin: 200,
	suspended: 401
};

/** A photo of an open commission: signed-in tailors, the owner and admins; everyone else is told nothing. */
const photoOfOpen: Expectations = {
	anonymous: 404,
	owner: 200,
	otherCustomer: 404,
	tailor: 200,
	tailorOnboarding: 200,
	admin: 200,
	suspended: 404
};

export const commissionRows: Row<Owned>[] = [
	{
		name: `POST ${api}`,
		arrange: readyDraft,
		send: (client) => client.json('POST', api, { garment: 'straight-skirt', title: `Skirt ${randomUUID()}` }),
		expect: { ...customerApi(201, 201) }
	},
	{
		name: `GET ${api}/{id} (open)`,
		arrange: (world) => openCommission(world),
		send: (client, { id }) => client.json('GET', `${api}/${id}`),
		expect: openToSignedIn,
		revealsToOwner: true
	},
	{
		name: `GET ${api}/{id} (draft)`,
		arrange: readyDraft,
		send: (client, { id }) => client.json('GET', `${api}/${id}`),
		// A draft is the owner's alone until published, admins included.
		expect: { ...openToSignedIn, tailor: 404, tailorOnboarding: 404, admin: 404 }
	},
	{
		name: `PATCH ${api}/{id}`,
		arrange: readyDraft,
		send: (client, { id }) => client.json('PATCH', `${api}/${id}`, { title: `Renamed ${randomUUID()}` }),
		expect: customerApi(200, 404),
		unchanged: untouched
	},
	{
		name: `POST ${api}/{id}/publish`,
		arrange: readyDraft,
		send: (client, { id }) => client.json('POST', `${api}/${id}/publish`),
		expect: customerApi(200, 404),
		revealsToOwner: true,
		unchanged: untouched
	},
	{
		name: `POST ${api}/{id}/cancel`,
		arrange: (world) => openCommission(world),
		send: (client, { id }) => client.json('POST', `${api}/${id}/cancel`),
		expect: customerApi(200, 404),
		unchanged: untouched
	},
	{
		name: `POST ${api}/{id}/photos`,
		arrange: (world) => openCommission(world),
		send: async (client, { id }) => client.upload(`${api}/${id}/photos`, await solid(64, 48).png().toBuffer()),
		expect: customerApi(201, 404),
		unchanged: untouched
	},
	{
		name: `DELETE ${api}/{id}/photos/{photoId}`,
		arrange: (world) => openCommission(world, { withPhoto: true }),
		send: (client, { id, photoId }) => client.json('DELETE', `${api}/${id}/photos/${photoId}`),
		expect: customerApi(204, 404)
	},
	{
		name: 'GET /photos/{photoId}/full (open commission)',
		arrange: (world) => openCommission(world, { withPhoto: true }),
		send: (client, { photoId }) => client.get(`/photos/${photoId}/full`),
		expect: photoOfOpen
	},
	{
		name: 'GET /photos/{photoId}/thumb (draft)',
		arrange: async (world) => {
			const draft = await readyDraft(world);
			const photo = await commissionPhotos.addWithoutChecks(world.db, {
				commissionId: draft.id,
				file: await solid(64, 48).png().toBuffer()
			});
			return { ...draft, photoId: photo.id };
		},
		send: (client, { photoId }) => client.get(`/photos/${photoId}/thumb`),
		expect: { ...photoOfOpen, tailor: 404, tailorOnboarding: 404 }
	},
	{
		name: 'GET /commissions/{id} (open)',
		arrange: (world) => openCommission(world),
		send: (client, { id }) => client.get(`/commissions/${id}`),
		expect: { ...openToSignedIn, anonymous: signInRedirect, suspended: suspendedRedirect },
		revealsToOwner: true
	},
	{
		name: 'GET /commissions/{id}/edit/fabric',
		arrange: readyDraft,
		send: (client, { id }) => client.get(`/commissions/${id}/edit/fabric`),
		expect: customerPage(200, 404)
	},
	{
		name: 'POST /commissions/{id}/edit/fabric',
		arrange: readyDraft,
		send: (client, { id }) =>
			client.post(`/commissions/${id}/edit/fabric`, { fabricSource: 'customer_supplies', fabricNotes: 'Mine' }),
		expect: customerPage({ status: 303, location: /^\/commissions\// }, 404),
		unchanged: untouched
	}
];
