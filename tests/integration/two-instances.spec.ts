/**
 * Two app processes on one database, as behind a proxy: PostgreSQL is the only shared state, so a session
 * made on one is honoured (and ended) on the other, and limits count across both.
 */
import type { ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, startServer, stopProcess, uploadBodySizeLimit, waitForHealth } from '../../scripts/lib/local';
import { baseUrl, newClient, signIn, signUp, uniqueEmail } from './http';
import { searchStandin } from './search';

let second: ChildProcess;
let secondUrl = '';

beforeAll(async () => {
	const port = await freePort();
	secondUrl = `http://localhost:${port}`;
	second = startServer({
		DATABASE_URL: process.env.DATABASE_URL!,
		PORT: String(port),
		// Both answer for the same site, as replicas behind one proxy do.
		ORIGIN: baseUrl,
		BODY_SIZE_LIMIT: uploadBodySizeLimit,
		...searchStandin().env
	});
	await waitForHealth(secondUrl, 30_000);
}, 60_000);

afterAll(() => stopProcess(second));

/** The same person (cookie jar and address) talking to the second process. */
function onSecond(client: ReturnType<typeof newClient>) {
	const other = newClient(client.address, secondUrl);
	for (const [name, value] of client.jar) other.jar.set(name, value);
	return other;
}

describe('two app processes on one database', () => {
	it('honour a sign-in made on the other', async () => {
		const first = newClient();
		expect((await signIn(first, 'customer@tackline.test', 'tackline-demo')).status).toBe(303);
		const there = onSecond(first);
		const page = await there.get('/account');
		expect(page.status).toBe(200);
		expect(await page.text()).toContain('customer@tackline.test');
	});

	it('show a change made through one on a page the other kept', async () => {
		const email = uniqueEmail('replica-kept');
		const first = newClient();
		expect((await signUp(first, { email, role: 'customer' })).status).toBe(303);
		const there = onSecond(first);
		expect((await there.get('/commissions')).status).toBe(200);
		const kept = await there.get('/commissions');
		expect(kept.headers.has('age')).toBe(true);

		const saved = await first.post('/account?/profile', { name: 'Ottoline Vessey', units: 'cm', timeZone: 'UTC' });
		expect(saved.status).toBe(200);
		const after = await there.get('/commissions');
		expect(after.headers.has('age')).toBe(false);
		expect(await after.text()).toContain('Ottoline Vessey');
	});

	it('end a session everywhere when it is signed out on one', async () => {
		const email = uniqueEmail('replica');
		const first = newClient();
		expect((await signUp(first, { email, role: 'customer' })).status).toBe(303);
		const there = onSecond(first);
		expect((await there.get('/account')).status).toBe(200);

		expect((await there.post('/sign-out')).status).toBe(303);
		const after = await first.get('/account');
		expect(after.status).toBe(303);
		expect(after.headers.get('location')).toMatch(/^\/sign-in/);
	});

	it('count failed sign-ins for one account across both', async () => {
		const email = uniqueEmail('counted');
		expect((await signUp(newClient(), { email, role: 'customer' })).status).toBe(303);
		const statuses: number[] = [];
		// The per-account limit is five failures in fifteen minutes; each attempt comes from a fresh address.
		for (let attempt = 0; attempt < 6; attempt++) {
			const client = attempt % 2 === 0 ? newClient() : newClient(undefined, secondUrl);
			const response = await signIn(client, email, 'not the password');
			statuses.push(response.status);
			if (attempt === 5) expect(await response.text()).toContain('Too many failed sign-in attempts');
		}
		expect(statuses.slice(0, 5).every((s) => s === 400)).toBe(true);
	});

	it('share the public API flood limit', async () => {
		const address = newClient().address;
		const hit = (url: string) =>
			fetch(`${url}/api/v1/no-such-endpoint`, { headers: { 'x-forwarded-for': address, accept: 'application/json' } });
		// 600 a minute per address, spent half on each process; the next request is refused by either.
		for (let batch = 0; batch < 12; batch++) {
			const responses = await Promise.all(Array.from({ length: 50 }, (_, i) => hit(i % 2 ? secondUrl : baseUrl)));
			expect(responses.every((r) => r.status === 404)).toBe(true);
		}
		const refused = await Promise.all([hit(baseUrl), hit(secondUrl)]);
		expect(refused.map((r) => r.status)).toEqual([429, 429]);
	});
});
