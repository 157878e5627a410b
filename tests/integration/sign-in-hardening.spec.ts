import { describe, expect, it } from 'vitest';
import { baseUrl, newClient, openLink, postSignUp, signIn, signUp, uniqueEmail } from './http';
import { linkIn, mailTo, settledMailTo, subjects, waitForMail } from './inbox';

const demoCustomer = 'customer@tackline.test';

describe('links we mail', () => {
	it('point at the configured origin, whatever Host and X-Forwarded-Host say', async () => {
		const email = uniqueEmail('forged');
		await signUp(newClient(), { email, role: 'customer' });
		const before = (await mailTo(email)).filter((m) => m.subject === subjects.signInLink).length;
		const response = await fetch(`${baseUrl}/sign-in?/magicLink`, {
			method: 'POST',
			headers: {
				origin: baseUrl,
				host: 'evil.example',
				'x-forwarded-host': 'evil.example',
				'x-forwarded-proto': 'https',
				'x-forwarded-for': newClient().address,
				'content-type': 'application/x-www-form-urlencoded'
			},
			body: new URLSearchParams({ email }),
			redirect: 'manual'
		});
		expect(response.status).toBe(200);
		const mail = await waitForMail(email, { subject: subjects.signInLink, count: before + 1 });
		const link = linkIn(mail);
		expect(link.origin).toBe(new URL(baseUrl).origin);
		expect(decodeURIComponent(link.search)).not.toContain('evil.example');
		expect(mail.text).not.toContain('evil.example');
	});
});

describe("Auth.js's own endpoints", () => {
	it('refuse 30 wrong passwords and then the right one: the account stays locked', async () => {
		const email = uniqueEmail('direct');
		const password = 'direct route passphrase';
		await signUp(newClient(), { email, role: 'customer', password });
		const direct = newClient();
		for (let i = 0; i < 30; i++) {
			const response = await direct.post('/auth/callback/credentials', { email, password: `wrong ${i}` });
			expect(response.status).toBe(404);
		}
		const right = await direct.post('/auth/callback/credentials', { email, password });
		expect(right.status).toBe(404);
		expect([...direct.jar.keys()].some((name) => name.includes('session-token'))).toBe(false);
		expect((await direct.get('/commissions')).status).toBe(303);

		for (let i = 0; i < 5; i++) await signIn(newClient(), email, `wrong ${i}`);
		expect((await signIn(newClient(), email, password)).status).toBe(429);
		expect((await direct.post('/auth/callback/credentials', { email, password })).status).toBe(404);
		expect((await signIn(newClient(), email, password)).status).toBe(429);
	});

	it('send no links when spammed, and answer alike for every address', async () => {
		const known = uniqueEmail('spammed');
		await signUp(newClient(), { email: known, role: 'customer' });
		const unknown = uniqueEmail('nobody');
		const spammer = newClient();
		const answers = [];
		for (let i = 0; i < 9; i++) {
			for (const email of [known, unknown]) {
				const response = await spammer.post('/auth/signin/nodemailer', { email, callbackUrl: '/' });
				answers.push([response.status, response.headers.get('location')]);
			}
		}
		expect(new Set(answers.map((a) => JSON.stringify(a))).size).toBe(1);
		expect(answers[0][0]).toBe(404);
		expect((await settledMailTo(known)).filter((m) => m.subject === subjects.signInLink)).toHaveLength(0);
		expect(await mailTo(unknown)).toHaveLength(0);
	});

	it('refuse a sign-out from outside and keep /auth/session for live sessions', async () => {
		const client = newClient();
		await signIn(client, demoCustomer, 'tackline-demo');
		expect((await client.post('/auth/signout')).status).toBe(404);
		expect((await (await client.get('/auth/session')).json()).user.email).toBe(demoCustomer);
		expect(await (await newClient().get('/auth/session')).json()).toBeNull();
	});
});

describe('rate limits', () => {
	it('let no more parallel guesses through than the limit', async () => {
		const email = uniqueEmail('parallel');
		await signUp(newClient(), { email, role: 'customer', password: 'parallel universe tea' });
		const answers = await Promise.all(
			Array.from({ length: 20 }, (_, i) => signIn(newClient(), email, `wrong guess ${i}`))
		);
		const statuses = answers.map((r) => r.status);
		expect(statuses.filter((s) => s === 400).length).toBeLessThanOrEqual(5);
		expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(15);
		expect((await signIn(newClient(), email, 'parallel universe tea')).status).toBe(429);
	});

	it('apply to link requests per address and per email, the same for unknown addresses', async () => {
		const known = uniqueEmail('links');
		await signUp(newClient(), { email: known, role: 'customer' });
		const unknown = uniqueEmail('ghost');
		for (const email of [known, unknown]) {
			const statuses = [];
			for (let i = 0; i < 6; i++) statuses.push((await newClient().post('/sign-in?/magicLink', { email })).status);
			expect(statuses, email).toEqual([200, 200, 200, 200, 200, 429]);
		}
		const sender = newClient();
		const statuses = [];
		for (let i = 0; i < 21; i++)
			statuses.push((await sender.post('/sign-in?/magicLink', { email: uniqueEmail('a') })).status);
		expect(statuses.at(-1)).toBe(429);
		expect(statuses.slice(0, 20).every((s) => s === 200)).toBe(true);
	});

	it('apply to sign-up and password change', async () => {
		const email = uniqueEmail('signup-limit');
		const statuses = [];
		for (let i = 0; i < 4; i++) {
			statuses.push(
				(await newClient().post('/sign-up', { name: 'Rep', email, password: 'repeat sign up words', role: 'customer' }))
					.status
			);
		}
		expect(statuses).toEqual([303, 303, 303, 429]);

		const client = newClient();
		const member = uniqueEmail('changer');
		await signUp(client, { email: member, role: 'customer', password: 'first change words' });
		const tries = [];
		for (let i = 0; i < 6; i++) {
			tries.push(
				(
					await client.post('/account?/password', {
						currentPassword: `not it ${i}`,
						newPassword: 'second change words',
						confirmPassword: 'second change words'
					})
				).status
			);
		}
		expect(tries).toEqual([400, 400, 400, 400, 400, 429]);
	});

	it('answer a flood on the public API with 429 JSON and Retry-After', async () => {
		const address = newClient().address;
		const hit = () =>
			fetch(`${baseUrl}/api/v1/no-such-endpoint`, {
				headers: { 'x-forwarded-for': address, accept: 'application/json' }
			});
		let last: Response | null = null;
		for (let batch = 0; batch < 13 && last?.status !== 429; batch++) {
			const responses = await Promise.all(Array.from({ length: 50 }, hit));
			last = responses.find((r) => r.status === 429) ?? responses[0];
		}
		expect(last?.status).toBe(429);
		expect(Number(last?.headers.get('retry-after'))).toBeGreaterThan(0);
		expect(last?.headers.get('content-type')).toContain('application/json');
		expect((await last!.json()).error.code).toBe('rate_limited');
		expect(
			(await fetch(`${baseUrl}/api/v1/health`, { headers: { 'x-forwarded-for': newClient().address } })).status
		).not.toBe(429);
	});
});

describe('an address someone else signed up with first', () => {
	it('keeps no password of theirs once the owner signs in through a link', async () => {
		const email = uniqueEmail('squatted');
		const squatter = { email, role: 'customer' as const, password: 'squatter chose these words' };
		expect((await postSignUp(newClient(), squatter)).headers.get('location')).toBe('/sign-up?sent=1');
		const unsolicited = await waitForMail(email, { subject: subjects.confirm });
		expect(unsolicited.text).toContain('If you did not make a Tackline account, do not open the link');

		const owner = newClient();
		expect((await owner.post('/sign-in?/magicLink', { email })).status).toBe(200);
		const link = await waitForMail(email, { subject: subjects.signInLink });
		expect((await openLink(owner, linkIn(link))).status).toBe(302);
		expect((await owner.get('/account')).status).toBe(200);

		const retry = await signIn(newClient(), email, squatter.password);
		expect(retry.status).toBe(400);
		expect(await retry.text()).toContain('Incorrect email or password');
	});
});

describe('enumeration', () => {
	// Pages differ only in the address typed and the per-response CSP nonce.
	const sameShape = (text: string, email: string) =>
		text.replaceAll(email, '<email>').replace(/nonce="[^"]*"/g, 'nonce=""');

	it('link requests answer alike for an account and for nobody, and each gets its own mail', async () => {
		const known = uniqueEmail('known');
		await signUp(newClient(), { email: known, role: 'customer' });
		const unknown = uniqueEmail('unknown');
		const a = await newClient().post('/sign-in?/magicLink', { email: known });
		const b = await newClient().post('/sign-in?/magicLink', { email: unknown });
		expect(a.status).toBe(b.status);
		expect(a.headers.get('set-cookie')).toBe(b.headers.get('set-cookie'));
		expect(sameShape(await a.text(), known)).toBe(sameShape(await b.text(), unknown));
		expect(linkIn(await waitForMail(known, { subject: subjects.signInLink })).origin).toBe(new URL(baseUrl).origin);
		const notice = await waitForMail(unknown, { subject: subjects.noAccount });
		expect(notice.text).toContain('no account uses it');
		expect(notice.text).not.toContain('/auth/callback');
	});

	it('password sign-in answers alike for a wrong password and an unknown address', async () => {
		const known = uniqueEmail('pw-known');
		await signUp(newClient(), { email: known, role: 'customer' });
		const unknown = uniqueEmail('pw-unknown');
		const a = await signIn(newClient(), known, 'not the password at all');
		const b = await signIn(newClient(), unknown, 'not the password at all');
		expect(a.status).toBe(b.status);
		expect(sameShape(await a.text(), known)).toBe(sameShape(await b.text(), unknown));
	});
});

describe('after sign-in', () => {
	it.each([
		'%2F%09%2Fevil.example',
		'%2F%09%5Cevil.example',
		'%2F%2Fevil.example',
		'%2F%5C%5Cevil.example',
		'%2F%0D%0A%2Fevil.example',
		'%2F%E3%80%80%2Fevil.example',
		'javascript%3Aalert(1)'
	])('stays on this site for redirectTo=%s', async (target) => {
		const client = newClient();
		const response = await client.post(`/sign-in?/password`, {
			email: demoCustomer,
			password: 'tackline-demo',
			redirectTo: decodeURIComponent(target)
		});
		expect(response.status).toBe(303);
		expect(response.headers.get('location')).toBe('/commissions');
		const page = await client.get(`/sign-in?redirectTo=${target}`);
		expect(page.headers.get('location')).toBe('/commissions');
	});
});

describe('the development inbox', () => {
	it('is for administrators only', async () => {
		expect((await newClient().get('/dev/inbox')).headers.get('location')).toBe('/sign-in?redirectTo=%2Fdev%2Finbox');
		const customer = newClient();
		await signIn(customer, demoCustomer, 'tackline-demo');
		expect((await customer.get('/dev/inbox')).status).toBe(403);
		const admin = newClient();
		await signIn(admin, 'admin@tackline.test', 'tackline-demo');
		const inbox = await admin.get('/dev/inbox');
		expect(inbox.status).toBe(200);
		expect(await inbox.text()).toContain(subjects.signInLink);
	});
});
