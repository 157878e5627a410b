import { expect, it } from 'vitest';
import { baseUrl, newClient, signIn } from './http';
import { searchStandin } from './search';

it('reports every check as ok, with no internal details for the public', async () => {
	const response = await fetch(`${baseUrl}/api/v1/health`);
	expect(response.status).toBe(200);
	expect(await response.json()).toEqual({
		status: 'ok',
		checks: { database: 'ok', mail: 'ok', queue: 'ok', storage: 'ok', search: 'ok' }
	});
});

it('shows an administrator when the relay was last checked', async () => {
	const admin = newClient();
	expect((await signIn(admin, 'admin@tackline.test', 'tackline-demo')).status).toBe(303);
	const body = await (await admin.get('/api/v1/health')).json();
	expect(body.checks).toEqual({ database: 'ok', mail: 'ok', queue: 'ok', storage: 'ok', search: 'ok' });
	expect(Number.isNaN(Date.parse(body.details.mailCheckedAt))).toBe(false);
});

it('stays up when search is down, reporting search degraded with HTTP 200, and recovers', async () => {
	await searchStandin().stop();
	try {
		// The check is remembered for five seconds.
		await new Promise((resolve) => setTimeout(resolve, 5500));
		const response = await fetch(`${baseUrl}/api/v1/health`);
		expect(response.status).toBe(200);
		expect(await response.json()).toMatchObject({ status: 'degraded', checks: { search: 'degraded', database: 'ok' } });
	} finally {
		await searchStandin().start();
	}
	await new Promise((resolve) => setTimeout(resolve, 5500));
	expect((await (await fetch(`${baseUrl}/api/v1/health`)).json()).checks.search).toBe('ok');
});
