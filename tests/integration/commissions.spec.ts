import PgBoss from 'pg-boss';
import { and, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { auditEvent, commission, quote } from '../../src/lib/server/db/schema';
import { createCommission, createCustomerWithProfile, createUser, createWorkroom } from '../factories';
import { testDb } from './db';
import { callJson, newClient, signedIn, signIn } from './http';
import { settledMailTo, waitForMail } from './inbox';
import { eventually } from './mail';

const { db, pool } = testDb();
afterAll(() => pool.end());

function later(days: number) {
	return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

async function customerWithProfile() {
	const { person, profileId } = await createCustomerWithProfile(db, { name: 'Rosalind Pemberton-Hale' });
	return { person, profileId, client: await signedIn(person) };
}

function fullBody(profileId: string) {
	return {
		garment: 'straight-skirt',
		title: 'Grey flannel skirt for the office',
		styleNotes: 'Knee length, back vent, lined.',
		measurementProfileId: profileId,
		fabricSource: 'tailor_sources',
		fabricNotes: 'Mid-grey wool flannel.',
		budget: { minMinor: 9000, maxMinor: 14000, currency: 'EUR' },
		dateNeeded: later(60),
		location: { lat: 46.85123, lng: 3.20891, name: 'Merrowgate', country: 'FR' },
		handover: 'pickup'
	};
}

async function postedCommission() {
	const owner = await customerWithProfile();
	const created = await callJson(owner.client, 'POST', '/api/v1/commissions', fullBody(owner.profileId));
	expect(created.status).toBe(201);
	const published = await callJson(owner.client, 'POST', `/api/v1/commissions/${created.body.id}/publish`);
	expect(published.status).toBe(200);
	return { ...owner, id: created.body.id as string, published: published.body };
}

describe('posting a commission', () => {
	it('goes from a profile to a draft to an open commission tailors can see', async () => {
		const owner = await customerWithProfile();
		const created = await callJson(owner.client, 'POST', '/api/v1/commissions', fullBody(owner.profileId));
		expect(created.status).toBe(201);
		expect(created.body).toMatchObject({
			status: 'draft',
			title: 'Grey flannel skirt for the office',
			garment: 'straight-skirt'
		});

		const published = await callJson(owner.client, 'POST', `/api/v1/commissions/${created.body.id}/publish`);
		expect(published.status).toBe(200);
		// A skirt's band uses waist and hip, sized by 4 cm designations (EN 13402-3): a 74 cm waist is in the
		// band of designation 76 (74–78), a 100 cm hip in that of 100 (98–102).
		expect(published.body).toMatchObject({
			status: 'open',
			sizeBand: [
				{ dimension: 'waist_girth', lowerMm: 740, upperMm: 780 },
				{ dimension: 'hip_girth', lowerMm: 980, upperMm: 1020 }
			],
			sizeBandText: 'waist 74–78 cm, hip 98–102 cm'
		});
		const days = (Date.parse(published.body.expiresAt) - Date.parse(published.body.publishedAt)) / 86_400_000;
		expect(days).toBe(30);

		const again = await callJson(owner.client, 'POST', `/api/v1/commissions/${created.body.id}/publish`);
		expect(again.body.publishedAt).toBe(published.body.publishedAt);

		const tailor = await signedIn(await createWorkroom(db));
		// Newest first among the open commissions near the tailor's workroom (the demo city has closer ones);
		// the search index takes the new one in a moment after publishing.
		let listed = '';
		for (let attempt = 0; attempt < 40 && !listed.includes('Grey flannel skirt for the office'); attempt += 1) {
			if (attempt) await new Promise((resolve) => setTimeout(resolve, 250));
			listed = await (await tailor.get('/workroom/commissions?sort=newest')).text();
		}
		expect(listed).toContain('Grey flannel skirt for the office');
		const page = await tailor.get(`/commissions/${created.body.id}`);
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('Rosalind P.');
		expect(html).not.toContain('Pemberton');
		expect(html).toContain('waist 74–78 cm');
	});

	it('refuses to publish an incomplete draft and names what is missing', async () => {
		const owner = await customerWithProfile();
		const created = await callJson(owner.client, 'POST', '/api/v1/commissions', { garment: 'tunic', title: 'A tunic' });
		expect(created.status).toBe(201);
		const refused = await callJson(owner.client, 'POST', `/api/v1/commissions/${created.body.id}/publish`);
		expect(refused.status).toBe(422);
		const paths = (refused.body.error.issues as { path: string }[]).map((i) => i.path);
		expect(paths).toEqual(expect.arrayContaining(['measurementProfileId', 'budget', 'dateNeeded', 'location']));
	});

	it('refuses a budget upside down, a past date and someone else’s profile, each with its own message', async () => {
		const owner = await customerWithProfile();
		const stranger = await customerWithProfile();
		const upsideDown = await callJson(owner.client, 'POST', '/api/v1/commissions', {
			...fullBody(owner.profileId),
			budget: { minMinor: 500, maxMinor: 100, currency: 'EUR' }
		});
		expect(upsideDown.status).toBe(400);
		const past = await callJson(owner.client, 'POST', '/api/v1/commissions', {
			...fullBody(owner.profileId),
			dateNeeded: '2020-01-01'
		});
		expect(past.status).toBe(400);
		expect(past.body.error.issues).toEqual([{ path: 'dateNeeded', message: 'Choose a date after today.' }]);
		const theirs = await callJson(owner.client, 'POST', '/api/v1/commissions', fullBody(stranger.profileId));
		expect(theirs.body.error.issues[0].path).toBe('measurementProfileId');
	});

	it('keeps a draft saved through the form steps when the form is opened again', async () => {
		const owner = await customerWithProfile();
		const started = await owner.client.post('/commissions/new', {
			garment: 'a-line-skirt',
			title: 'Corduroy skirt with pockets',
			styleNotes: 'Midi length.',
			then: 'next'
		});
		expect(started.status).toBe(303);
		const id = /\/commissions\/([0-9a-f-]{36})\/edit\/photos/.exec(started.headers.get('location') ?? '')?.[1];
		expect(id).toBeDefined();
		const saved = await owner.client.post(`/commissions/${id}/edit/budget`, {
			currency: 'JPY',
			budgetMin: '12000',
			budgetMax: '19500',
			dateNeeded: later(40),
			then: 'later'
		});
		expect(saved.headers.get('location')).toBe('/commissions?saved=1');

		const reopened = await (await owner.client.get(`/commissions/${id}/edit/budget`)).text();
		expect(reopened).toContain('value="12000"');
		expect(reopened).toContain('value="19500"');
		const [row] = await db.select().from(commission).where(eq(commission.id, id!));
		// The yen has no minor unit (ISO 4217 exponent 0): typed amounts are stored as they are.
		expect(row).toMatchObject({ status: 'draft', currency: 'JPY', budgetMinMinor: 12000, budgetMaxMinor: 19500 });

		const list = await (await owner.client.get('/commissions')).text();
		expect(list).toContain('Corduroy skirt with pockets');
		expect(list).toContain(`/commissions/${id}/edit/measurements`);
	});

	it('keeps what was typed when a step is refused', async () => {
		const owner = await customerWithProfile();
		const created = await callJson(owner.client, 'POST', '/api/v1/commissions', { garment: 'tunic', title: 'A tunic' });
		const response = await owner.client.post(`/commissions/${created.body.id}/edit/budget`, {
			currency: 'EUR',
			budgetMin: '300',
			budgetMax: '120.505',
			dateNeeded: later(20),
			then: 'next'
		});
		expect(response.status).toBe(400);
		const html = await response.text();
		expect(html).toContain('value="120.505"');
		expect(html).toContain('up to 2 decimals');
	});
});

describe('changing and ending a commission', () => {
	it('mails each quoting tailor what changed, once', async () => {
		const posted = await postedCommission();
		const tailor = await createWorkroom(db);
		await db.insert(quote).values({
			commissionId: posted.id,
			tailorId: tailor.id,
			priceMinor: 12000,
			currency: 'EUR',
			deliveryDate: later(50),
			fabricIncluded: true,
			validUntil: new Date(Date.now() + 10 * 86_400_000)
		});
		const change = { budget: { minMinor: 10000, maxMinor: 16000, currency: 'EUR' }, title: 'Charcoal flannel skirt' };
		const edited = await callJson(posted.client, 'PATCH', `/api/v1/commissions/${posted.id}`, change);
		expect(edited.status).toBe(200);
		expect(edited.body).toMatchObject({ status: 'open', title: 'Charcoal flannel skirt' });
		await callJson(posted.client, 'PATCH', `/api/v1/commissions/${posted.id}`, change);

		const mail = await waitForMail(tailor.email, {
			subject: 'A commission you quoted on has changed: Charcoal flannel skirt'
		});
		expect(mail.text).toContain('Budget: was €90 – €140, now €100 – €160.');
		expect(mail.text).toContain('Title: “Grey flannel skirt for the office” is now “Charcoal flannel skirt”.');
		expect(mail.text).not.toContain('Needed by');
		expect((await settledMailTo(tailor.email)).length).toBe(1);

		const garmentChange = await callJson(posted.client, 'PATCH', `/api/v1/commissions/${posted.id}`, {
			garment: 'tunic'
		});
		expect(garmentChange.status).toBe(400);
	});

	it('cancels an open commission once, however often it is asked', async () => {
		const posted = await postedCommission();
		const first = await callJson(posted.client, 'POST', `/api/v1/commissions/${posted.id}/cancel`);
		const second = await callJson(posted.client, 'POST', `/api/v1/commissions/${posted.id}/cancel`);
		expect([first.status, first.body.status, second.status, second.body.status]).toEqual([
			200,
			'cancelled',
			200,
			'cancelled'
		]);
		const events = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, posted.id), eq(auditEvent.action, 'commission.cancelled')));
		expect(events).toHaveLength(1);
		const publishAgain = await callJson(posted.client, 'POST', `/api/v1/commissions/${posted.id}/publish`);
		expect(publishAgain.status).toBe(409);
	});

	it('expires an old open commission through the scheduled job and tells the customer', async () => {
		const customer = await createUser(db);
		const old = await createCommission(db, {
			customerId: customer.id,
			status: 'open',
			title: 'Linen tunic nobody quoted on',
			publishedAt: new Date(Date.now() - 31 * 86_400_000),
			expiresAt: new Date(Date.now() - 86_400_000)
		});
		const fresh = await createCommission(db, { status: 'open', expiresAt: new Date(Date.now() + 86_400_000) });
		const { rows } = await pool.query(`select cron from pgboss.schedule where name = 'commission-expiry'`);
		expect(rows).toHaveLength(1);

		// Run it now rather than wait for the schedule: the app's worker takes the job as it would a scheduled one.
		const boss = new PgBoss({ connectionString: process.env.DATABASE_URL });
		const run = () =>
			boss.send('commission-expiry', {}, { db: { executeSql: (text, values) => pool.query(text, values) } });
		await run();
		await eventually(async () => {
			const [row] = await db.select({ status: commission.status }).from(commission).where(eq(commission.id, old.id));
			return row.status === 'expired';
		});
		const mail = await waitForMail(customer.email, {
			subject: 'Your commission has closed without a tailor: Linen tunic nobody quoted on'
		});
		expect(mail.text).toContain('no quote was accepted');
		await run();
		expect((await settledMailTo(customer.email)).length).toBe(1);
		const [stillOpen] = await db
			.select({ status: commission.status })
			.from(commission)
			.where(eq(commission.id, fresh.id));
		expect(stillOpen.status).toBe('open');
	});
});

describe('who sees what', () => {
	it('gives the owner the measurements and nobody else', async () => {
		const posted = await postedCommission();
		const mine = await callJson(posted.client, 'GET', `/api/v1/commissions/${posted.id}`);
		expect(mine.body.measurements).toEqual({
			unit: 'cm',
			values: expect.objectContaining({ waist_girth: 74, hip_girth: 100 })
		});

		const tailor = await signedIn(await createWorkroom(db));
		const seen = await callJson(tailor, 'GET', `/api/v1/commissions/${posted.id}`);
		expect(seen.status).toBe(200);
		expect(seen.body).not.toHaveProperty('measurements');
		expect(JSON.stringify(seen.body)).not.toMatch(/waist_girth"?:\s*7/);
		expect(seen.body.customer).toEqual({ name: 'Rosalind P.' });
		// Stored about a kilometre from the point given, never the point itself.
		expect(seen.body.location.lat).not.toBe(46.85123);
		expect(Math.abs(seen.body.location.lat - 46.85123)).toBeLessThan(0.01);
		expect(Math.abs(seen.body.location.lng - 3.20891)).toBeLessThan(0.015);

		const admin = await signedIn(await createUser(db, { role: 'admin' }));
		expect(await callJson(admin, 'GET', `/api/v1/commissions/${posted.id}`)).not.toHaveProperty('body.measurements');
		const otherCustomer = await signedIn(await createUser(db));
		expect((await callJson(otherCustomer, 'GET', `/api/v1/commissions/${posted.id}`)).status).toBe(404);
		expect((await callJson(newClient(), 'GET', `/api/v1/commissions/${posted.id}`)).status).toBe(401);
	});

	it('keeps drafts to their owner and commissions to customers', async () => {
		const owner = await customerWithProfile();
		const draft = await callJson(owner.client, 'POST', '/api/v1/commissions', {
			garment: 'tunic',
			title: 'Secret draft'
		});
		const tailorPerson = await createWorkroom(db);
		const tailor = await signedIn(tailorPerson);
		expect((await callJson(tailor, 'GET', `/api/v1/commissions/${draft.body.id}`)).status).toBe(404);
		expect((await tailor.get(`/commissions/${draft.body.id}`)).status).toBe(404);
		expect((await callJson(tailor, 'POST', '/api/v1/commissions', { garment: 'tunic', title: 'Mine' })).status).toBe(
			403
		);
		expect((await callJson(tailor, 'PATCH', `/api/v1/commissions/${draft.body.id}`, { title: 'Taken' })).status).toBe(
			403
		);
		const other = await signedIn(await createUser(db));
		expect((await callJson(other, 'PATCH', `/api/v1/commissions/${draft.body.id}`, { title: 'Taken' })).status).toBe(
			404
		);
		expect((await callJson(other, 'POST', `/api/v1/commissions/${draft.body.id}/cancel`)).status).toBe(404);
		const suspended = await createUser(db, { suspended: true });
		const client = newClient();
		await signIn(client, suspended.email, suspended.password);
		expect((await callJson(client, 'POST', '/api/v1/commissions', { garment: 'tunic', title: 'Mine' })).status).toBe(
			401
		);
	});
});
