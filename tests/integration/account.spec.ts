import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { user } from '../../src/lib/server/db/schema';
import { testDb } from './db';
import { createUser } from '../factories';
import { newClient, openLink, signIn } from './http';
import { linkIn, subjects, waitForMail } from './inbox';

const { db, pool } = testDb();
afterAll(() => pool.end());

async function newMember(password = 'first password') {
	const { email } = await createUser(db, { password });
	const client = newClient();
	expect((await signIn(client, email, password)).status).toBe(303);
	return { client, email };
}

describe('account settings', () => {
	it('are for signed-in people only', async () => {
		expect((await newClient().get('/account')).headers.get('location')).toBe('/sign-in?redirectTo=%2Faccount');
	});

	it('save name, units and time zone, and keep what was typed when one is wrong', async () => {
		const { client, email } = await newMember();
		const bad = await client.post('/account?/profile', { name: 'Renamed', units: 'in', timeZone: 'Mars/Olympus' });
		expect(bad.status).toBe(400);
		const page = await bad.text();
		expect(page).toContain('Choose a time zone from the list.');
		expect(page).toContain('Renamed');

		const ok = await client.post('/account?/profile', { name: 'Renamed', units: 'in', timeZone: 'Europe/Lisbon' });
		expect(ok.status).toBe(200);
		const [row] = await db
			.select({ name: user.name, units: user.units, timeZone: user.timeZone })
			.from(user)
			.where(eq(user.email, email));
		expect(row).toEqual({ name: 'Renamed', units: 'in', timeZone: 'Europe/Lisbon' });
	});

	it('change the password only with the current one, and say so by email', async () => {
		const { client, email } = await newMember('first password');
		const fields = { newPassword: 'second password', confirmPassword: 'second password' };
		const wrong = await client.post('/account?/password', { currentPassword: 'not it at all', ...fields });
		expect(wrong.status).toBe(400);
		expect(await wrong.text()).toContain('That is not your current password.');

		const mismatch = await client.post('/account?/password', {
			currentPassword: 'first password',
			newPassword: 'second password',
			confirmPassword: 'second passwort'
		});
		expect(await mismatch.text()).toContain('The two new passwords do not match.');

		expect((await client.post('/account?/password', { currentPassword: 'first password', ...fields })).status).toBe(
			200
		);
		expect((await signIn(newClient(), email, 'first password')).status).toBe(400);
		expect((await signIn(newClient(), email, 'second password')).status).toBe(303);
		await waitForMail(email, { subject: subjects.passwordChanged });
		const weak = await client.post('/account?/password', {
			currentPassword: 'second password',
			newPassword: email,
			confirmPassword: email
		});
		expect(weak.status).toBe(400);
		expect(await weak.text()).toContain('Don’t use your email address as your password.');
	});

	it('let someone who signed in through an emailed link replace a forgotten password', async () => {
		const { email } = await newMember('forgotten password');
		await newClient().post('/sign-in?/magicLink', { email });
		const link = linkIn(await waitForMail(email, { subject: subjects.signInLink }));

		const client = newClient();
		await openLink(client, link);
		const page = await (await client.get('/account')).text();
		expect(page).not.toContain('Current password');
		const changed = await client.post('/account?/password', {
			newPassword: 'remembered password',
			confirmPassword: 'remembered password'
		});
		expect(changed.status).toBe(200);
		expect((await signIn(newClient(), email, 'remembered password')).status).toBe(303);
	});
});
