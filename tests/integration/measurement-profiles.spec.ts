import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvent, measurementProfile } from '../../src/lib/server/db/schema';
import { createUser } from '../factories';
import { testDb } from './db';
import { newClient, signIn, type Client } from './http';

const { db, pool } = testDb();
afterAll(() => pool.end());

const api = '/api/v1/measurement-profiles';
let customer: Client;
let customerId: string;

beforeAll(async () => {
	const person = await createUser(db, { name: 'Morwenna Tregear' });
	customerId = person.id;
	customer = newClient();
	expect((await signIn(customer, person.email, person.password)).status).toBe(303);
});

type ApiProfile = {
	id: string;
	label: string;
	unit: string;
	values: Record<string, number>;
	checks: { errors: { code: string; fields: string[] }[]; warnings: { code: string }[] };
	takenBy: string;
	takenAt: string | null;
};

async function created(body: unknown) {
	const response = await customer.json('POST', api, body);
	expect(response.status, await response.clone().text()).toBe(201);
	return (await response.json()) as ApiProfile;
}

async function storedMm(id: string) {
	const [row] = await db.select().from(measurementProfile).where(eq(measurementProfile.id, id));
	return row.valuesMm;
}

describe('the measurement profile API', () => {
	it('creates a profile in inches, keeps millimetres, and answers in the profile’s unit', async () => {
		const profile = await created({
			label: 'Me',
			unit: 'in',
			values: { hip_girth: 40.125, waist_girth: 30.375 },
			takenBy: 'tailor',
			takenAt: '2026-11-20'
		});
		expect(profile).toMatchObject({
			label: 'Me',
			unit: 'in',
			values: { hip_girth: 40.125, waist_girth: 30.375 },
			takenBy: 'tailor',
			takenAt: '2026-11-20',
			checks: { errors: [], warnings: [] }
		});
		// 1 in = 25.4 mm exactly: 40.125 in = 1019.175 mm, kept to a hundredth of a millimetre.
		expect(await storedMm(profile.id)).toEqual({ hip_girth: 1019.18, waist_girth: 771.53 });
		const read = (await (await customer.json('GET', `${api}/${profile.id}`)).json()) as ApiProfile;
		expect(read.values).toEqual({ hip_girth: 40.125, waist_girth: 30.375 });
	});

	it('reports the range, mix-up and relation checks with the profile', async () => {
		const profile = await created({
			label: 'Checked',
			unit: 'cm',
			values: { hip_girth: 39, waist_girth: 70, inside_leg: 110, waist_to_floor: 100 }
		});
		const codes = profile.checks.errors.map((finding) => finding.code);
		// 39 cm is an adult hip only in inches (99 cm); inside leg cannot be longer than waist to floor.
		expect(codes).toEqual(expect.arrayContaining(['unit_mixup', 'impossible_relation']));
		expect(profile.values.hip_girth).toBe(39);
	});

	it('names unknown measurement codes and refuses the whole request', async () => {
		const response = await customer.json('POST', api, {
			label: 'Odd',
			unit: 'cm',
			values: { chest: 90, hip_girth: 96 }
		});
		expect(response.status).toBe(400);
		const body = (await response.json()) as { error: { code: string; issues: { path: string }[] } };
		expect(body.error.code).toBe('invalid_input');
		expect(body.error.issues.map((issue) => issue.path)).toEqual(['values.chest']);
		const list = (await (await customer.json('GET', api)).json()) as { items: ApiProfile[] };
		expect(list.items.map((item) => item.label)).not.toContain('Odd');
	});

	it('refuses a second profile with the same name, whatever its case', async () => {
		await created({ label: 'My son', unit: 'cm', values: {} });
		for (const label of ['My son', 'MY SON']) {
			const response = await customer.json('POST', api, { label, unit: 'cm', values: {} });
			expect(response.status).toBe(409);
			expect(((await response.json()) as { error: { code: string } }).error.code).toBe('duplicate_label');
		}
	});

	it('lists only the caller’s own profiles', async () => {
		const stranger = await createUser(db);
		await db
			.insert(measurementProfile)
			.values({ ownerId: stranger.id, label: 'Stranger', valuesMm: { hip_girth: 990 } });
		const list = (await (await customer.json('GET', api)).json()) as { items: ApiProfile[] };
		expect(list.items.length).toBeGreaterThan(0);
		expect(list.items.map((item) => item.label)).not.toContain('Stranger');
	});

	it('patches only what is sent: a new name keeps the values, null removes one, a new unit converts', async () => {
		const profile = await created({ label: 'Patch me', unit: 'cm', values: { hip_girth: 101.6, waist_girth: 76.2 } });
		const renamed = await customer.json('PATCH', `${api}/${profile.id}`, { label: 'Patched' });
		expect(((await renamed.json()) as ApiProfile).values).toEqual({ hip_girth: 101.6, waist_girth: 76.2 });

		const inches = await customer.json('PATCH', `${api}/${profile.id}`, {
			unit: 'in',
			values: { waist_girth: null, waist_to_hip: 8 }
		});
		// 101.6 cm = 40 in exactly; the new value is read in the new unit.
		expect(((await inches.json()) as ApiProfile).values).toEqual({ hip_girth: 40, waist_to_hip: 8 });
		expect(await storedMm(profile.id)).toEqual({ hip_girth: 1016, waist_to_hip: 203.2 });
	});

	it('deletes with 204, and the profile is gone', async () => {
		const profile = await created({ label: 'Short-lived', unit: 'cm', values: {} });
		expect((await customer.json('DELETE', `${api}/${profile.id}`)).status).toBe(204);
		expect((await customer.json('GET', `${api}/${profile.id}`)).status).toBe(404);
		expect((await customer.json('DELETE', `${api}/${profile.id}`)).status).toBe(404);
	});

	it('audits each change without a single measurement in the record', async () => {
		const profile = await created({ label: 'Audited', unit: 'cm', values: { hip_girth: 97.3 } });
		await customer.json('PATCH', `${api}/${profile.id}`, { values: { hip_girth: 98.1 } });
		const events = await db
			.select({ action: auditEvent.action, data: auditEvent.data, actorId: auditEvent.actorId })
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectType, 'measurement_profile'), eq(auditEvent.subjectId, profile.id)));
		expect(events.map((event) => event.action).sort()).toEqual([
			'measurement_profile.created',
			'measurement_profile.updated'
		]);
		expect(events.every((event) => event.actorId === customerId)).toBe(true);
		// Only the recorded data: ids are random hex and may hold any run of digits.
		expect(JSON.stringify(events.map((event) => event.data))).not.toMatch(/(?<![\w.])(97\.3|98\.1|973|981)(?![\w])/);
	});
});

describe('the measurement profile pages without JavaScript', () => {
	const form = (fields: Record<string, string>) => ({
		label: 'From the form',
		unit: 'in',
		takenBy: 'companion',
		takenAt: '2026-11-01',
		notes: 'Over a T-shirt',
		...fields
	});

	it('saves lengths typed as 10 3/8, 10⅜ or 10.375 alike', async () => {
		const response = await customer.post(
			'/measurements/new',
			form({ 'm.hip_girth': '40 3/8', 'm.waist_girth': '30⅜', 'm.waist_to_hip': '8.375' })
		);
		expect(response.status).toBe(303);
		const id = /^\/measurements\/([0-9a-f-]{36})\?saved=1$/.exec(response.headers.get('location') ?? '')![1];
		// 40.375 in = 1025.525 mm; 30.375 in = 771.525 mm; 8.375 in = 212.725 mm (1 in = 25.4 mm), kept to 0.01 mm.
		const stored = await storedMm(id);
		expect(Object.keys(stored).sort()).toEqual(['hip_girth', 'waist_girth', 'waist_to_hip']);
		expect(stored.hip_girth).toBeCloseTo(1025.525, 1);
		expect(stored.waist_girth).toBeCloseTo(771.525, 1);
		expect(stored.waist_to_hip).toBeCloseTo(212.725, 1);
		const page = await (await customer.get(`/measurements/${id}?saved=1`)).text();
		expect(page).toContain('Saved.');
		expect(page).toContain('value="40 3/8"');
	});

	it('sends a suspected unit mix-up back with the finding and what was typed, until it is confirmed', async () => {
		const typed = form({ label: 'Mixed up', 'm.hip_girth': '100', 'm.waist_girth': '2 1/2 ft' });
		const refused = await customer.post('/measurements/new', typed);
		expect(refused.status).toBe(400);
		const page = await refused.text();
		expect(page).toContain('value="2 1/2 ft"');
		expect(page).toContain('is not a length');

		const held = await customer.post('/measurements/new', { ...typed, 'm.waist_girth': '28' });
		expect(held.status).toBe(400);
		const heldPage = await held.text();
		expect(heldPage).toContain('looks like centimetres typed into an inch field');
		expect(heldPage).toContain('name="confirmed"');

		const saved = await customer.post('/measurements/new', { ...typed, 'm.waist_girth': '28', confirmed: 'yes' });
		expect(saved.status).toBe(303);
	});

	it('goes back to a same-site return address with the profile, and ignores any other', async () => {
		const back = await customer.post('/measurements/new', {
			...form({ label: 'Returning' }),
			return: '/commissions/new?step=measurements'
		});
		expect(back.headers.get('location')).toMatch(/^\/commissions\/new\?step=measurements&profile=[0-9a-f-]{36}$/);
		const away = await customer.post('/measurements/new', {
			...form({ label: 'Not away' }),
			return: '//evil.example/x'
		});
		expect(away.headers.get('location')).toMatch(/^\/measurements\/[0-9a-f-]{36}\?saved=1$/);
	});

	it('marks what a garment needs and shows the cautions', async () => {
		const page = await (await customer.get('/measurements/new?garment=straight-skirt&return=/commissions')).text();
		expect(page).toContain('Needed for your commission');
		expect(page).toContain('Waist, Hip, Waist to hip');
		expect(page).toContain('parent or guardian');
		expect(page).toContain('href="/commissions"');
	});

	it('renames from the list, refusing a name already used', async () => {
		const first = await created({ label: 'Rename A', unit: 'cm', values: {} });
		await created({ label: 'Rename B', unit: 'cm', values: {} });
		const taken = await customer.post('/measurements?/rename', { id: first.id, label: 'rename b' });
		expect(taken.status).toBe(409);
		expect(await taken.text()).toContain('You already have a profile called');
		expect((await customer.post('/measurements?/rename', { id: first.id, label: 'Rename C' })).status).toBe(200);
		const [row] = await db.select().from(measurementProfile).where(eq(measurementProfile.id, first.id));
		expect(row.label).toBe('Rename C');
	});

	it('deletes from the edit page and says so on the list', async () => {
		const profile = await created({ label: 'Delete me', unit: 'cm', values: {} });
		const response = await customer.post(`/measurements/${profile.id}?/delete`);
		expect(response.headers.get('location')).toBe('/measurements?deleted=1');
		expect(await (await customer.get('/measurements?deleted=1')).text()).toContain('Profile deleted.');
		expect(await db.select().from(measurementProfile).where(eq(measurementProfile.id, profile.id))).toEqual([]);
	});

	it('shows an empty list to someone with no profiles yet', async () => {
		const person = await createUser(db);
		const fresh = newClient();
		await signIn(fresh, person.email, person.password);
		expect(await (await fresh.get('/measurements')).text()).toContain('No measurements yet');
	});
});
