import { describe, expect, it } from 'vitest';
import { toApiError } from './api-errors';

describe('toApiError', () => {
	it("reshapes SvelteKit's plain-text 405 into the JSON error shape, keeping Allow", async () => {
		const response = await toApiError(
			new Response('GET method not allowed', { status: 405, headers: { allow: 'POST', 'content-type': 'text/plain' } })
		);
		expect(response.status).toBe(405);
		expect(response.headers.get('allow')).toBe('POST');
		expect(await response.json()).toEqual({
			error: {
				code: 'method_not_allowed',
				message: 'This address does not answer that method. It answers POST.',
				issues: []
			}
		});
	});

	it('keeps the message and code of a thrown error, and never shows internal text on a 500', async () => {
		const thrown = await toApiError(
			Response.json({ message: 'Sign in first.', code: 'unauthenticated' }, { status: 401 })
		);
		expect(await thrown.json()).toMatchObject({ error: { code: 'unauthenticated', message: 'Sign in first.' } });
		const html = await toApiError(
			new Response('<h1>oops at db.ts:12</h1>', { status: 500, headers: { 'content-type': 'text/html' } })
		);
		expect((await html.json()).error).toEqual({
			code: 'internal',
			message: 'Something went wrong on our side.',
			issues: []
		});
	});

	it('leaves answers already in the shape, and successes, untouched', async () => {
		const shaped = Response.json({ error: { code: 'invalid_input', message: 'x', issues: [] } }, { status: 400 });
		expect(await toApiError(shaped)).toBe(shaped);
		const ok = Response.json({ fine: true });
		expect(await toApiError(ok)).toBe(ok);
	});
});

describe("an endpoint's own JSON", () => {
	it('is left alone, like the health report answered with 503', async () => {
		const report = Response.json({ status: 'down', checks: { database: 'down' } }, { status: 503 });
		expect(await toApiError(report)).toBe(report);
	});
});
