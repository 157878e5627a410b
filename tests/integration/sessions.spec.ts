import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { auditEvent, user } from '../../src/lib/server/db/schema';
import { testDb } from './db';
import { newClient, signIn, signUp, uniqueEmail, type Client } from './http';

const { db, pool } = testDb();
afterAll(() => pool.end());

/** Another browser holding a copy of the client's cookies. */
function copyOf(client: Client) {
	const copy = newClient();
	for (const [name, value] of client.jar) copy.jar.set(name, value);
	return copy;
}

async function member(password = 'session keeper words') {
	const client = newClient();
	const email = uniqueEmail('sessions');
	await signUp(client, { email, role: 'customer', password });
	const [row] = await db.select({ id: user.id }).from(user).where(eq(user.email, email));
	return { client, email, id: row.id, password };
}

async function isSignedIn(client: Client) {
	return (await client.get('/commissions')).status === 200;
}

describe('sessions end for real', () => {
	it('on sign-out: the old cookie, replayed, no longer signs anyone in', async () => {
		const { client } = await member();
		const stolen = copyOf(client);
		expect(await isSignedIn(stolen)).toBe(true);
		expect((await client.post('/sign-out')).status).toBe(303);
		expect(await isSignedIn(client)).toBe(false);
		expect(await isSignedIn(stolen)).toBe(false);
		expect(await (await stolen.get('/auth/session')).json()).toBeNull();
	});

	it('on a password change: every other session ends, the current one carries on, and the page says so', async () => {
		const { client, email, password } = await member();
		const elsewhere = newClient();
		expect((await signIn(elsewhere, email, password)).status).toBe(303);
		const changed = await client.post('/account?/password', {
			currentPassword: password,
			newPassword: 'brand new passphrase here',
			confirmPassword: 'brand new passphrase here'
		});
		expect(changed.status).toBe(200);
		expect(await changed.text()).toContain('every other device signed in to your account is now signed out');
		expect(await isSignedIn(client)).toBe(true);
		expect(await isSignedIn(elsewhere)).toBe(false);
	});

	it('on suspension, and reinstatement does not bring old cookies back', async () => {
		const { client, id } = await member();
		const admin = newClient();
		await signIn(admin, 'admin@tackline.test', 'tackline-demo');
		await admin.post('/desk/users?/suspend', { userId: id, reason: 'Checking session ends' });
		expect(await (await client.get('/auth/session')).json()).toBeNull();
		expect((await client.get('/commissions')).headers.get('location')).toBe('/sign-in?suspended=1');
		await admin.post('/desk/users?/reinstate', { userId: id });
		expect(await isSignedIn(client)).toBe(false);
		expect(await (await client.get('/auth/session')).json()).toBeNull();
	});

	it('when an admin signs the user out everywhere, with an audit event', async () => {
		const { client, email, password, id } = await member();
		const second = newClient();
		await signIn(second, email, password);
		const session = await (await client.get('/auth/session')).json();
		expect(session.user.email).toBe(email);

		const admin = newClient();
		await signIn(admin, 'admin@tackline.test', 'tackline-demo');
		const page = await admin.get(`/desk/users?q=${encodeURIComponent(email)}`);
		expect(await page.text()).toContain('Sign out everywhere');
		expect((await admin.post('/desk/users?/endSessions', { userId: id })).status).toBe(200);
		expect(await isSignedIn(client)).toBe(false);
		expect(await isSignedIn(second)).toBe(false);
		const events = await db
			.select({ action: auditEvent.action, data: auditEvent.data })
			.from(auditEvent)
			.where(eq(auditEvent.subjectId, id));
		// Three browsers: this one, the second, and the one that opened the confirmation link.
		expect(events).toContainEqual({ action: 'account.sessions_ended', data: { ended: 3 } });
		expect((await signIn(newClient(), email, password)).status).toBe(303);
	});

	it('the sign-out-everywhere action is for admins only', async () => {
		const { client } = await member();
		const other = await member();
		expect((await client.post('/desk/users?/endSessions', { userId: other.id })).status).toBe(403);
		expect(await isSignedIn(other.client)).toBe(true);
	});
});
