import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { auditEvent, user } from '../../src/lib/server/db/schema';
import { createUser, createWorkroom } from '../factories';
import { testDb } from './db';
import { newClient, openLink, postSignUp, signIn, signUp, uniqueEmail } from './http';
import { linkIn, subjects, waitForMail } from './inbox';

const { db, pool } = testDb();
afterAll(() => pool.end());

describe('sign-up', () => {
	it('creates a customer who confirms the address through the mailed link and lands in their area', async () => {
		const client = newClient();
		const email = uniqueEmail('ada');
		const response = await postSignUp(client, { name: 'Ada Quill', email, role: 'customer' });
		expect(response.status).toBe(303);
		expect(response.headers.get('location')).toBe('/sign-up?sent=1');
		expect(await (await client.get('/sign-up?sent=1')).text()).toContain('Check your inbox');

		// Until the address is confirmed the password does not sign in, with the usual answer.
		const early = await signIn(newClient(), email, 'correct horse staple');
		expect(early.status).toBe(400);
		expect(await early.text()).toContain('Incorrect email or password');

		const mail = await waitForMail(email, { subject: subjects.confirm });
		expect(mail.text).toContain('expires in 15 minutes');
		const opened = await openLink(client, linkIn(mail));
		expect(opened.headers.get('location')).toMatch(/\/commissions\?welcome=1$/);
		const area = await client.get('/commissions');
		expect(area.status).toBe(200);
		expect(await area.text()).toContain('Ada Quill');

		const [row] = await db
			.select({ role: user.role, hash: user.passwordHash, verified: user.emailVerified })
			.from(user)
			.where(eq(user.email, email));
		expect(row.role).toBe('customer');
		expect(row.hash).toMatch(/^\$argon2id\$/);
		expect(row.verified).not.toBeNull();
		expect((await signIn(newClient(), email, 'correct horse staple')).status).toBe(303);
	});

	it('answers a taken address exactly as a free one, and tells the owner by mail', async () => {
		const taken = uniqueEmail('twice');
		expect((await signUp(newClient(), { email: taken, role: 'customer' })).status).toBe(303);
		const fields = { name: 'Second Try', role: 'tailor' as const, password: 'another good passphrase' };
		const again = await postSignUp(newClient(), { ...fields, email: taken.toUpperCase() });
		const fresh = await postSignUp(newClient(), { ...fields, email: uniqueEmail('fresh') });
		expect(again.status).toBe(fresh.status);
		expect(again.headers.get('location')).toBe(fresh.headers.get('location'));
		expect(again.headers.get('set-cookie')).toBe(fresh.headers.get('set-cookie'));
		expect(await again.text()).toBe(await fresh.text());

		await waitForMail(taken, { subject: subjects.accountExists });
		expect(await db.select().from(user).where(eq(user.email, taken))).toHaveLength(1);
		const [row] = await db.select({ name: user.name, role: user.role }).from(user).where(eq(user.email, taken));
		expect(row).toEqual({ name: 'Test Person', role: 'customer' });
	});

	it.each([
		['abc12345', 'at least 10 characters'],
		['password123!', 'Choose a harder password']
	])('rejects the password %s with a clear message', async (password, message) => {
		const response = await postSignUp(newClient(), { email: uniqueEmail('weak'), password, role: 'customer' });
		expect(response.status).toBe(400);
		expect(await response.text()).toContain(message);
	});

	it('never creates an admin from the sign-up form', async () => {
		const email = uniqueEmail('sneaky');
		const response = await postSignUp(newClient(), { email, role: 'admin' as 'customer' });
		expect(response.status).toBe(400);
		expect(await db.select().from(user).where(eq(user.email, email))).toHaveLength(0);
	});
});

describe('password sign-in', () => {
	it('rejects a wrong password with one generic message', async () => {
		const email = uniqueEmail('wrong');
		await signUp(newClient(), { email, role: 'customer' });
		const response = await signIn(newClient(), email, 'not the password');
		expect(response.status).toBe(400);
		expect(await response.text()).toContain('Incorrect email or password');
		const unknown = await signIn(newClient(), uniqueEmail('nobody'), 'whatever-password');
		expect(await unknown.text()).toContain('Incorrect email or password');
	});

	it('locks an account after five failures, even from other addresses and with the right password', async () => {
		const email = uniqueEmail('locked');
		await signUp(newClient(), { email, role: 'customer', password: 'the right password' });
		for (let i = 0; i < 5; i++) expect((await signIn(newClient(), email, `wrong ${i}`)).status).toBe(400);
		const blocked = await signIn(newClient(), email, 'the right password');
		expect(blocked.status).toBe(429);
		expect(await blocked.text()).toMatch(/Too many failed sign-in attempts\. Try again in \d+ minute/);
	});

	it('blocks an address after twenty failures across accounts', async () => {
		const attacker = newClient();
		for (let i = 0; i < 20; i++) await signIn(attacker, uniqueEmail(`spray${i}`), 'guessing-password');
		const email = uniqueEmail('bystander');
		await signUp(newClient(), { email, role: 'customer', password: 'bystander password' });
		expect((await signIn(attacker, email, 'bystander password')).status).toBe(429);
		expect((await signIn(newClient(), email, 'bystander password')).status).toBe(303);
	});
});

describe('suspension', () => {
	it('ends a live session at once and refuses sign-in', async () => {
		const { email } = await createUser(db, { password: 'suspend me please' });
		const client = newClient();
		await signIn(client, email, 'suspend me please');
		expect((await client.get('/commissions')).status).toBe(200);

		await db.update(user).set({ suspendedAt: new Date(), suspendedReason: 'test' }).where(eq(user.email, email));

		const after = await client.get('/commissions');
		expect(after.status).toBe(303);
		expect(after.headers.get('location')).toBe('/sign-in?suspended=1');
		const again = await signIn(newClient(), email, 'suspend me please');
		expect(again.status).toBe(403);
		expect(await again.text()).toContain('This account is suspended');
	});
});

describe('a suspended account', () => {
	it('cannot sign in with the right password', async () => {
		const person = await createUser(db, { role: 'tailor', suspended: 'Left the city' });
		const response = await signIn(newClient(), person.email, person.password);
		expect(response.status).toBe(403);
		expect(await response.text()).toContain('This account is suspended');
	});
});

describe('suspension from the desk', () => {
	it('lets an admin suspend and reinstate an account, with a reason and an audit trail', async () => {
		const email = uniqueEmail('rulebreaker');
		const member = newClient();
		await signUp(member, { email, role: 'tailor', password: 'rule breaker pw' });
		const [target] = await db.select({ id: user.id }).from(user).where(eq(user.email, email));

		const admin = newClient();
		await signIn(admin, 'admin@tackline.test', 'tackline-demo');
		const missingReason = await admin.post('/desk/users?/suspend', { userId: target.id, reason: '' });
		expect(missingReason.status).toBe(400);
		expect(await missingReason.text()).toContain('Say briefly why');

		expect(
			(
				await admin.post('/desk/users?/suspend', {
					userId: target.id,
					reason: 'Asked customers to pay outside Tackline'
				})
			).status
		).toBe(200);
		expect((await member.get('/workroom')).headers.get('location')).toBe('/sign-in?suspended=1');
		expect((await signIn(newClient(), email, 'rule breaker pw')).status).toBe(403);
		const events = await db
			.select({ action: auditEvent.action, actorId: auditEvent.actorId })
			.from(auditEvent)
			.where(eq(auditEvent.subjectId, target.id));
		expect(events.map((e) => e.action)).toEqual(expect.arrayContaining(['account.registered', 'account.suspended']));

		expect((await admin.post('/desk/users?/reinstate', { userId: target.id })).status).toBe(200);
		expect((await signIn(newClient(), email, 'rule breaker pw')).status).toBe(303);
	});

	it('is closed to everyone but admins', async () => {
		const customer = newClient();
		await signIn(customer, 'customer@tackline.test', 'tackline-demo');
		const [someone] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'tailor@tackline.test'));
		const response = await customer.post('/desk/users?/suspend', { userId: someone.id, reason: 'not allowed' });
		expect(response.status).toBe(403);
		const [still] = await db.select({ suspendedAt: user.suspendedAt }).from(user).where(eq(user.id, someone.id));
		expect(still.suspendedAt).toBeNull();
	});
});

describe('areas by role', () => {
	const areas = { customer: '/commissions', tailor: '/workroom', admin: '/desk' } as const;

	it('sends signed-out visitors to sign in, remembering where they were going', async () => {
		for (const path of Object.values(areas)) {
			const response = await newClient().get(path);
			expect(response.status).toBe(303);
			expect(response.headers.get('location')).toBe(`/sign-in?redirectTo=${encodeURIComponent(path)}`);
		}
	});

	it.each([
		['customer', 'customer@tackline.test'],
		['tailor', 'tailor@tackline.test'],
		['admin', 'admin@tackline.test']
	] as const)('lets the demo %s into their own area only', async (role, email) => {
		const client = newClient();
		const response = await signIn(client, email, 'tackline-demo');
		expect(response.status).toBe(303);
		expect(response.headers.get('location')).toBe(areas[role]);
		for (const [otherRole, path] of Object.entries(areas)) {
			expect((await client.get(path)).status, `${role} → ${path}`).toBe(otherRole === role ? 200 : 403);
		}
	});
});

describe('sign-out', () => {
	it('happens only on POST', async () => {
		const client = newClient();
		const tailor = await createWorkroom(db);
		await signIn(client, tailor.email, tailor.password);
		expect((await client.get('/sign-out')).status).toBe(303);
		expect((await client.get('/workroom')).status).toBe(200);
		const out = await client.post('/sign-out');
		expect(out.status).toBe(303);
		expect((await client.get('/workroom')).status).toBe(303);
	});
});
