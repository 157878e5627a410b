import { randomUUID } from 'node:crypto';
import { get } from 'node:http';
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { commission, session, user } from '../../src/lib/server/db/schema';
import { testDb } from './db';
import { baseUrl, newClient, signIn, type Client } from './http';

// Signed-in pages may be sent again from memory by server/private-answers.js, checked against the database on
// every use. A kept answer carries an `Age` header; one the app rendered does not.
const { db, pool } = testDb();
afterAll(() => pool.end());

async function customer() {
	const client = newClient();
	expect((await signIn(client, 'customer@tackline.test', 'tackline-demo')).status).toBe(303);
	return client;
}

async function ownCommissionId() {
	const [row] = await db
		.select({ id: commission.id })
		.from(commission)
		.innerJoin(user, eq(user.id, commission.customerId))
		.where(eq(user.email, 'customer@tackline.test'))
		.limit(1);
	return row.id;
}

function statusOf(path: string, headers: Record<string, string>) {
	return new Promise<number>((resolve, reject) => {
		get(new URL(path, baseUrl), { headers }, (response) => {
			response.resume();
			resolve(response.statusCode ?? 0);
		}).on('error', reject);
	});
}

async function page(client: Client, path = '/commissions') {
	const response = await client.get(path);
	return { response, html: await response.text(), kept: response.headers.has('age') };
}

describe('signed-in pages sent again while nothing has changed', () => {
	it('are sent again, and never with the mark the app leaves for the layer in front', async () => {
		const client = await customer();
		const first = await page(client);
		const second = await page(client);
		expect(first.response.status).toBe(200);
		expect(first.kept).toBe(false);
		expect(second.kept).toBe(true);
		expect(second.html).toBe(first.html);
		for (const { response } of [first, second]) expect(response.headers.has('x-tackline-keep')).toBe(false);
	});

	it('are rendered again after any committed change, and show it', async () => {
		const client = await customer();
		await page(client);
		expect((await page(client)).kept).toBe(true);
		const title = `Linen waistcoat, kept-answer check ${randomUUID().slice(0, 8)}`;
		await db
			.update(commission)
			.set({ title })
			.where(eq(commission.id, await ownCommissionId()));
		const after = await page(client);
		expect(after.kept).toBe(false);
		expect(after.html).toContain(title);
	});

	it('are not sent once the session has ended, even though nothing else changed', async () => {
		const client = await customer();
		await page(client);
		expect((await page(client)).kept).toBe(true);
		const [me] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'customer@tackline.test'));
		// The session table moves no data version: the kept answer's own check must catch this.
		await db.delete(session).where(eq(session.userId, me.id));
		const after = await client.get('/commissions');
		expect(after.status).not.toBe(200);
		expect(after.headers.has('age')).toBe(false);
	});

	it('reach only the session they were rendered for', async () => {
		const first = await customer();
		const mine = await page(first);
		expect((await page(first)).kept).toBe(true);
		const other = newClient();
		expect((await signIn(other, 'felix.garrow@tackline.test', 'tackline-demo')).status).toBe(303);
		const theirs = await page(other);
		expect(theirs.kept).toBe(false);
		expect(theirs.html).not.toBe(mine.html);
		const anonymous = await fetch(new URL('/commissions', first.base), { redirect: 'manual' });
		expect(anonymous.status).not.toBe(200);
	});

	it('answer a validator with 304 while current, and the new page after a change', async () => {
		const client = await customer();
		await page(client);
		const kept = await client.get('/commissions');
		const etag = kept.headers.get('etag');
		expect(etag).toBeTruthy();
		const cookie = [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ');
		// node:http, as a browser revalidating its own copy would ask (fetch() would add Cache-Control: no-cache),
		// with the Accept headers fetch() sent before: they are part of what the answer was kept for.
		const revalidate = () =>
			statusOf('/commissions', { cookie, accept: '*/*', 'accept-language': '*', 'if-none-match': etag! });
		expect(await revalidate()).toBe(304);
		await db
			.update(commission)
			.set({ title: `Changed ${randomUUID().slice(0, 8)}` })
			.where(eq(commission.id, await ownCommissionId()));
		expect(await revalidate()).toBe(200);
	});

	it('leave pages that are not on the list to the app every time', async () => {
		const client = await customer();
		for (let i = 0; i < 2; i++) {
			const response = await client.get('/account');
			expect(response.status).toBe(200);
			expect(response.headers.has('age')).toBe(false);
		}
	});

	it('go to the app when the request asks for a fresh answer (a reload)', async () => {
		const client = await customer();
		await page(client);
		expect((await page(client)).kept).toBe(true);
		const cookie = [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ');
		const reloaded = await fetch(`${baseUrl}/commissions`, { headers: { cookie, 'cache-control': 'max-age=0' } });
		expect(reloaded.status).toBe(200);
		expect(reloaded.headers.has('age')).toBe(false);
	});
});

describe('lists from the API sent again', () => {
	const tailorsNear = '/api/v1/tailors?near=46.85,3.21&radiusKm=30';

	it('are kept for anyone without a session, and count against the per-address limit all the same', async () => {
		const address = newClient().address;
		const hit = () => fetch(baseUrl + tailorsNear, { headers: { 'x-forwarded-for': address } });
		const first = await hit();
		expect(first.status).toBe(200);
		const second = await hit();
		expect(second.headers.has('age')).toBe(true);
		expect(await second.text()).toBe(await first.text());
		let last: Response | null = null;
		for (let batch = 0; batch < 14 && last?.status !== 429; batch++) {
			const responses = await Promise.all(Array.from({ length: 50 }, hit));
			last = responses.find((r) => r.status === 429) ?? responses[0];
		}
		expect(last?.status).toBe(429);
		expect((await last!.json()).error.code).toBe('rate_limited');
	});

	it('are kept for a signed-in tailor, apart from anyone else', async () => {
		const tailor = newClient();
		expect((await signIn(tailor, 'tailor@tackline.test', 'tackline-demo')).status).toBe(303);
		const first = await tailor.json('GET', '/api/v1/commissions');
		expect(first.status).toBe(200);
		const second = await tailor.json('GET', '/api/v1/commissions');
		expect(second.headers.has('age')).toBe(true);
		expect(second.headers.get('x-search-source')).toBe(first.headers.get('x-search-source'));
		// A customer may not list commissions: a kept answer must not change that.
		const other = await customer();
		expect((await other.json('GET', '/api/v1/commissions')).status).toBe(403);
	});
});
