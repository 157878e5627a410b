import { expect, it } from 'vitest';
import { baseUrl } from './http';

it('reports every check as ok', async () => {
	const response = await fetch(`${baseUrl}/api/v1/health`);
	expect(response.status).toBe(200);
	expect(await response.json()).toEqual({ status: 'ok', checks: { database: 'ok', mail: 'ok', storage: 'ok' } });
});
