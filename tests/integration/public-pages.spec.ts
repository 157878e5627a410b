import { describe, expect, it } from 'vitest';
import { baseUrl, newClient, signIn } from './http';

const publicPaths = ['/', '/how-it-works', '/measurement-guide'];
const signInLink = 'href="/sign-in"';

describe('public pages', () => {
	it.each(publicPaths)(
		'%s reaches a visitor as the page built ahead, with its own policy and a validator',
		async (path) => {
			const response = await fetch(baseUrl + path);
			expect(response.status).toBe(200);
			expect(response.headers.get('content-type')).toBe('text/html; charset=utf-8');
			expect(response.headers.get('cache-control')).toBe('no-cache');
			expect(response.headers.get('vary')).toContain('Cookie');
			const policy = response.headers.get('content-security-policy') ?? '';
			expect(policy).toMatch(/script-src 'self' 'sha256-[\w+/=]+'/);
			expect(policy).not.toContain('nonce-');
			expect(policy).toContain("frame-ancestors 'none'");
			expect(response.headers.get('x-frame-options')).toBe('DENY');
			expect(await response.text()).toContain(signInLink);

			const etag = response.headers.get('etag')!;
			const again = await fetch(baseUrl + path, { headers: { 'if-none-match': etag } });
			expect(again.status).toBe(304);
		}
	);

	it('is sent compressed to a browser that takes it', async () => {
		const response = await fetch(baseUrl + '/', { headers: { 'accept-encoding': 'br' } });
		expect(response.headers.get('content-encoding')).toBe('br');
		expect(await response.text()).toContain(signInLink);
		const gzip = await fetch(baseUrl + '/', { headers: { 'accept-encoding': 'gzip' } });
		expect(gzip.headers.get('content-encoding')).toBe('gzip');
	});

	it('is rendered for a signed-in person with their own header, and their page data', async () => {
		const client = newClient();
		expect((await signIn(client, 'customer@tackline.test', 'tackline-demo')).status).toBe(303);
		for (const path of publicPaths) {
			const response = await client.get(path);
			expect(response.status).toBe(200);
			expect(response.headers.get('content-security-policy')).toContain("'sha256-");
			const html = await response.text();
			expect(html).toContain('Rosalind Fairweather');
			expect(html).not.toContain(signInLink);
		}
		const data = await (await client.get('/__data.json')).text();
		expect(data).toContain('customer@tackline.test');
	});

	it('answers a visitor’s page data without anyone’s details, and leaves other methods to the app', async () => {
		const data = await fetch(`${baseUrl}/__data.json?x-sveltekit-invalidated=01`);
		expect(data.status).toBe(200);
		expect(await data.json()).toMatchObject({ type: 'data' });
		const post = await fetch(baseUrl + '/', { method: 'POST', headers: { origin: baseUrl } });
		expect(post.status).not.toBe(200);
	});
});
