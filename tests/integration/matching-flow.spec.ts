/**
 * The marketplace's whole matching path through the built server, the search stand-in and PostgreSQL: a
 * customer publishes; a tailor 3 km away finds it and one 60 km away does not; the near one quotes; the
 * customer compares and accepts; the awarded tailor gains the measurements; a message reaches the other side
 * over the live stream.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCustomerWithProfile, createWorkroom } from '../factories';
import { completeOnboarding } from '../factories/quotes';
import { testDb } from './db';
import { openEvents } from './events';
import { callJson, signedIn, type Client } from './http';

const { db, pool } = testDb();
afterAll(() => pool.end());

/** Away from the demo city, so only this file's commission is near. A degree of latitude is about 111 km. */
const home = { lat: 50.72, lng: 4.61 };
const tailorPlaces = { near: { lat: home.lat + 0.027, lng: home.lng }, far: { lat: home.lat + 0.54, lng: home.lng } };

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

let customer: Client;
let near: Client;
let far: Client;
let nearTailorId: string;
let commissionId: string;

async function quotingTailor(at: { lat: number; lng: number }, shopName: string) {
	const workroom = await createWorkroom(db, { profile: { ...at, shopName, serviceRadiusKm: 25 } });
	await completeOnboarding(db, workroom.id);
	return workroom;
}

/** The index follows the database through the sync job, about a second behind: ask until it has. */
async function eventuallyListed(client: Client, path: string, id: string, timeoutMs = 15_000) {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const answer = await callJson(client, 'GET', path);
		expect(answer.status).toBe(200);
		const found = answer.body.items.find((item: { id: string }) => item.id === id);
		if (found || Date.now() > deadline) return { found, answer };
		await new Promise((resolve) => setTimeout(resolve, 300));
	}
}

beforeAll(async () => {
	const { person, profileId } = await createCustomerWithProfile(db, {
		name: 'Ysolde Carvath',
		valuesMm: { waist_girth: 720, hip_girth: 980, waist_to_hip: 200, waist_to_knee: 580, waist_to_floor: 1020 }
	});
	const nearRoom = await quotingTailor(tailorPlaces.near, 'Lantern Row Workroom');
	const farRoom = await quotingTailor(tailorPlaces.far, 'Far Fold Workroom');
	nearTailorId = nearRoom.id;
	[customer, near, far] = await Promise.all([signedIn(person), signedIn(nearRoom), signedIn(farRoom)]);

	const created = await callJson(customer, 'POST', '/api/v1/commissions', {
		garment: 'straight-skirt',
		title: 'Navy wool skirt for winter',
		styleNotes: 'Knee length, a kick pleat at the back.',
		measurementProfileId: profileId,
		fabricSource: 'tailor_sources',
		budget: { minMinor: 9000, maxMinor: 16000, currency: 'EUR' },
		dateNeeded: inDays(75),
		location: { ...home, name: 'Merrowgate', country: 'BE' },
		handover: 'pickup'
	});
	expect(created.status).toBe(201);
	commissionId = created.body.id;
	expect((await callJson(customer, 'POST', `/api/v1/commissions/${commissionId}/publish`)).status).toBe(200);
});

describe('from publishing to a conversation', () => {
	it('reaches the tailor 3 km away and not the one 60 km away', async () => {
		const { found } = await eventuallyListed(near, '/api/v1/commissions?radiusKm=10&sort=distance', commissionId);
		expect(found).toMatchObject({ id: commissionId, garment: 'straight-skirt', title: 'Navy wool skirt for winter' });
		expect(found.distanceKm).toBeGreaterThan(2.5);
		expect(found.distanceKm).toBeLessThan(3.5);

		const fromFar = await callJson(far, 'GET', '/api/v1/commissions?radiusKm=25');
		expect(fromFar.status).toBe(200);
		expect(fromFar.body.items.map((item: { id: string }) => item.id)).not.toContain(commissionId);
		// Widened past the distance, the far tailor sees it about 60 km off.
		const widened = await eventuallyListed(far, '/api/v1/commissions?radiusKm=100', commissionId);
		expect(widened.found.distanceKm).toBeGreaterThan(58);
		expect(widened.found.distanceKm).toBeLessThan(62);
	});

	it('carries a quote to the customer, who accepts it into an order', async () => {
		const sent = await callJson(near, 'POST', `/api/v1/commissions/${commissionId}/quotes`, {
			priceMinor: 12_500,
			currency: 'EUR',
			deliveryDate: inDays(50),
			fittings: 1,
			fabricIncluded: true,
			message: 'Navy worsted from our stock; one fitting at the workroom.',
			validUntil: new Date(Date.now() + 10 * 86_400_000).toISOString()
		});
		expect(sent.status).toBe(201);
		expect(sent.body).toMatchObject({ status: 'sent', priceMinor: 12_500 });

		const compared = await callJson(customer, 'GET', `/api/v1/commissions/${commissionId}/quotes`);
		expect(compared.status).toBe(200);
		expect(compared.body.items.map((q: { id: string }) => q.id)).toEqual([sent.body.id]);

		// Before the award the tailor sees the size band, never the measurements.
		expect((await callJson(near, 'GET', `/api/v1/commissions/${commissionId}`)).body).not.toHaveProperty(
			'measurements'
		);

		const accepted = await callJson(customer, 'POST', `/api/v1/quotes/${sent.body.id}/accept`);
		expect(accepted.status).toBe(201);
		expect(accepted.body).toMatchObject({ status: 'awaiting_payment', priceMinor: 12_500, platformFeeMinor: 1250 });
		expect(accepted.body.platformFeeMinor + accepted.body.tailorPayoutMinor).toBe(12_500);

		const awarded = await callJson(near, 'GET', `/api/v1/commissions/${commissionId}`);
		expect(awarded.body.status).toBe('awarded');
		expect(awarded.body.measurements.values).toMatchObject({ waist_girth: 72, hip_girth: 98 });
		expect((await callJson(far, 'GET', `/api/v1/commissions/${commissionId}`)).body).not.toHaveProperty('measurements');
	});

	it('drops the awarded commission from the near-me list', async () => {
		const deadline = Date.now() + 15_000;
		let ids: string[] = [commissionId];
		while (ids.includes(commissionId) && Date.now() < deadline) {
			await new Promise((resolve) => setTimeout(resolve, 300));
			ids = (await callJson(near, 'GET', '/api/v1/commissions?radiusKm=10')).body.items.map(
				(i: { id: string }) => i.id
			);
		}
		expect(ids).not.toContain(commissionId);
	});

	it('delivers a message to the other side as it is sent', async () => {
		const threads = await callJson(customer, 'GET', '/api/v1/threads');
		const thread = threads.body.items.find((t: { commission: { id: string } }) => t.commission.id === commissionId);
		expect(thread).toBeTruthy();
		expect(thread.otherParty).toMatchObject({ id: nearTailorId, role: 'tailor', name: 'Lantern Row Workroom' });

		const stream = await openEvents(customer, thread.id);
		try {
			expect(stream.response.status).toBe(200);
			const posted = await callJson(near, 'POST', `/api/v1/threads/${thread.id}/messages`, {
				body: 'Could you come for the fitting on a Saturday morning?'
			});
			expect(posted.status).toBe(201);
			let event = await stream.next();
			// The stream may first replay what the thread already holds; wait for the new one.
			while (event.id !== posted.body.id) event = await stream.next();
			expect(JSON.parse(event.data)).toMatchObject({ body: 'Could you come for the fitting on a Saturday morning?' });
		} finally {
			stream.close();
		}
	});
});
