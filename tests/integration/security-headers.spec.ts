import { expect, it } from 'vitest';
import { newClient } from './http';

it('sends a content security policy and the other protective headers on pages', async () => {
	const response = await newClient().get('/sign-in');
	const csp = response.headers.get('content-security-policy') ?? '';
	expect(csp).toContain("default-src 'self'");
	expect(csp).toContain("frame-ancestors 'none'");
	expect(csp).toMatch(/script-src 'self'[^;]*'(sha256|nonce)-/);
	expect(response.headers.get('x-content-type-options')).toBe('nosniff');
	expect(response.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
});

it('adds them to redirects answered by the sign-in library too', async () => {
	const response = await newClient().get('/auth/signin');
	expect(response.status).toBeGreaterThanOrEqual(300);
	expect(response.status).toBeLessThan(400);
	expect(response.headers.get('x-content-type-options')).toBe('nosniff');
});

it("never shows the sign-in library's own pages: they redirect to ours", async () => {
	for (const path of ['/auth/signin', '/auth/signout', '/auth/error', '/auth/verify-request']) {
		const response = await newClient().get(path);
		expect(response.status, path).toBe(302);
		expect(response.headers.get('location'), path).toMatch(/^(http:\/\/localhost:\d+)?\/sign-(in|out)/);
	}
});
