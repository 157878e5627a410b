import { describe, expect, it } from 'vitest';
import { baseUrl, newClient, signIn } from './http';

const demoPassword = 'tackline-demo';

async function post(path: string, body: BodyInit, headers: Record<string, string>) {
	return fetch(baseUrl + path, {
		method: 'POST',
		body,
		headers: {
			origin: baseUrl,
			accept: 'text/html',
			'x-forwarded-for': `198.19.7.${Math.floor(Math.random() * 250) + 1}`,
			...headers
		},
		redirect: 'manual'
	});
}

describe('form actions refuse malformed bodies with a 4xx and a message', () => {
	it('answers text/plain 415, broken multipart 400 and an oversized form 413, re-rendering the form', async () => {
		const plain = await post('/sign-in?/password', 'email=a@b.test', { 'content-type': 'text/plain' });
		expect(plain.status).toBe(415);
		const broken = await post('/sign-up', 'garbage', { 'content-type': 'multipart/form-data; boundary=abc' });
		expect(broken.status).toBe(400);
		expect(await broken.text()).toContain('The form could not be read');
		const huge = await post('/sign-up', `name=${'a'.repeat(300_000)}`, {
			'content-type': 'application/x-www-form-urlencoded'
		});
		expect(huge.status).toBe(413);
		expect(await huge.text()).toContain('larger than the 64 KB');
	});

	it('refuses NUL in a text field with a message beside the field instead of a 500', async () => {
		const response = await post(
			'/sign-up',
			new URLSearchParams({
				name: 'Ada\u0000',
				email: 'nul@example.test',
				password: 'a long enough one',
				role: 'customer'
			}),
			{
				'content-type': 'application/x-www-form-urlencoded'
			}
		);
		expect(response.status).toBe(400);
		expect(await response.text()).toContain('Remove the invisible control characters');
	});
});

describe('search parameters never cause a 500', () => {
	it('ignores a NUL search and out-of-range or garbage cursors on the people list', async () => {
		const admin = newClient();
		await signIn(admin, 'admin@tackline.test', demoPassword);
		for (const query of [
			'q=%00',
			'q=a%00b',
			'after=99999999999999999999_00000000-0000-0000-0000-000000000000',
			'after=1_zz',
			'after=%00'
		]) {
			const response = await admin.get(`/desk/users?${query}`);
			expect(response.status, query).toBe(200);
		}
	});

	it('survives redirectTo carrying CR, LF or an ideographic space', async () => {
		const customer = newClient();
		await signIn(customer, 'customer@tackline.test', demoPassword);
		for (const target of ['/%0D%0Aevil', '/%0A/evil.example', '/%E3%80%80evil', '%E3%80%80']) {
			const response = await customer.get(`/sign-in?redirectTo=${target}`);
			expect(response.status, target).toBeLessThan(500);
		}
		const anonymous = newClient();
		const response = await anonymous.post('/sign-in?/password', {
			email: 'customer@tackline.test',
			password: demoPassword,
			redirectTo: '/\r\n\u3000evil'
		});
		expect(response.status).toBeLessThan(500);
	});
});

describe('the JSON API answers its error shape for every failure', () => {
	const json = async (response: Response) => ({ status: response.status, body: await response.json() });

	it('415 for a body that is not JSON, 413 past the limit', async () => {
		const csv = await json(await post('/api/v1/layouts', '{}', { 'content-type': 'text/csv' }));
		expect(csv).toMatchObject({ status: 415, body: { error: { code: 'unsupported_media_type' } } });
		const big = await json(
			await post('/api/v1/drafts', JSON.stringify({ pad: 'x'.repeat(100_000) }), { 'content-type': 'application/json' })
		);
		expect(big).toMatchObject({ status: 413, body: { error: { code: 'too_large' } } });
	});

	it('404 for unknown addresses, 405 for a wrong method, 403 for a cross-site form post', async () => {
		expect(await json(await fetch(`${baseUrl}/api/v2/nothing`))).toMatchObject({
			status: 404,
			body: { error: { code: 'not_found' } }
		});
		const wrongMethod = await fetch(`${baseUrl}/api/v1/layouts`, { headers: { accept: 'text/html' } });
		expect(wrongMethod.headers.get('allow')).toContain('POST');
		expect(await json(wrongMethod)).toMatchObject({ status: 405, body: { error: { code: 'method_not_allowed' } } });
		const crossSite = await fetch(`${baseUrl}/api/v1/layouts`, {
			method: 'POST',
			body: '{}',
			headers: { 'content-type': 'text/plain', origin: 'https://elsewhere.example' }
		});
		expect(await json(crossSite)).toMatchObject({ status: 403, body: { error: { code: 'cross_site' } } });
	});
});

describe('denial of service', () => {
	it('answers one 64 KB request of 1 000 tiny pieces with a 4xx', async () => {
		const pieces = Array.from({ length: 1000 }, () => ({ w: 0.1, h: 0.1, quantity: 1, rotate: 'any' }));
		const body = JSON.stringify({ width: 150, unit: 'cm', pieces });
		expect(body.length).toBeGreaterThan(40_000);
		const response = await post('/api/v1/layouts', body, { 'content-type': 'application/json' });
		expect(response.status).toBeGreaterThanOrEqual(400);
		expect(response.status).toBeLessThan(500);
	});

	it('keeps answering the health check while heavy but valid layouts are worked out', async () => {
		const pieces = Array.from({ length: 50 }, (_, i) => ({
			w: 3 + (i % 7) * 4.3,
			h: 5 + (i % 5) * 6.1,
			quantity: 2,
			rotate: 'any'
		}));
		const heavy = Array.from({ length: 4 }, () =>
			post('/api/v1/layouts', JSON.stringify({ width: 150, unit: 'cm', pieces }), {
				'content-type': 'application/json'
			})
		);
		const health = await fetch(`${baseUrl}/api/v1/health`);
		expect(health.status).toBeLessThan(500);
		for (const response of await Promise.all(heavy)) {
			expect(response.status).toBe(200);
			expect((await response.json()).placements).toHaveLength(100);
		}
	});
});

describe('protective headers', () => {
	it('are on static files too', async () => {
		const page = await (await fetch(`${baseUrl}/sign-in`)).text();
		const asset = page.match(/\/_app\/immutable\/[^"']+\.(js|css)/)?.[0];
		expect(asset).toBeTruthy();
		const response = await fetch(baseUrl + asset);
		expect(response.status).toBe(200);
		expect(response.headers.get('x-content-type-options')).toBe('nosniff');
		expect(response.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
	});
});
