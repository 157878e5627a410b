import { expect, it } from 'vitest';
import { baseUrl, newClient, signIn } from './http';
import { searchStandin } from './search';
import { stripeStandin } from './stripe';

it('reports every check as ok, with no internal details for the public', async () => {
	const response = await fetch(`${baseUrl}/api/v1/health`);
	expect(response.status).toBe(200);
	expect(await response.json()).toEqual({
		status: 'ok',
		checks: { database: 'ok', mail: 'ok', queue: 'ok', storage: 'ok', search: 'ok', payments: 'ok' }
	});
});

it('shows an administrator when the relay was last checked', async () => {
	const admin = newClient();
	expect((await signIn(admin, 'admin@tackline.test', 'tackline-demo')).status).toBe(303);
	const body = await (await admin.get('/api/v1/health')).json();
	expect(body.checks).toEqual({ database: 'ok', mail: 'ok', queue: 'ok', storage: 'ok', search: 'ok', payments: 'ok' });
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

it('reports payments degraded with HTTP 200 while the payment processor is unreachable, and recovers', async () => {
	await stripeStandin().stop();
	try {
		await new Promise((resolve) => setTimeout(resolve, 5500));
		const response = await fetch(`${baseUrl}/api/v1/health`);
		expect(response.status).toBe(200);
		const body = await response.json();
		expect(body).toMatchObject({ status: 'degraded', checks: { payments: 'degraded', database: 'ok', search: 'ok' } });
		expect(JSON.stringify(body)).not.toMatch(/ECONN|127\.0\.0\.1|refused/i);
	} finally {
		await stripeStandin().start();
	}
	await new Promise((resolve) => setTimeout(resolve, 5500));
	expect((await (await fetch(`${baseUrl}/api/v1/health`)).json()).checks.payments).toBe('ok');
});
