import { describe, expect, it } from 'vitest';
import { isDatabaseUnavailable, outageResponse } from './outage';

describe('isDatabaseUnavailable', () => {
	it('recognises a refused connection, also wrapped in a query error or an AggregateError', () => {
		const refused = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' });
		expect(isDatabaseUnavailable(refused)).toBe(true);
		expect(isDatabaseUnavailable(new Error('Failed query: select 1', { cause: refused }))).toBe(true);
		expect(isDatabaseUnavailable(new AggregateError([refused]))).toBe(true);
	});

	it('recognises PostgreSQL shutting down or starting up (SQLSTATE 57P01, 57P03, class 08)', () => {
		expect(isDatabaseUnavailable(Object.assign(new Error('terminating connection'), { code: '57P01' }))).toBe(true);
		expect(
			isDatabaseUnavailable(Object.assign(new Error('the database system is starting up'), { code: '57P03' }))
		).toBe(true);
		expect(isDatabaseUnavailable(Object.assign(new Error('connection failure'), { code: '08006' }))).toBe(true);
		expect(isDatabaseUnavailable(new Error('Connection terminated unexpectedly'))).toBe(true);
	});

	it('leaves ordinary failures alone: they are bugs, not outages', () => {
		expect(isDatabaseUnavailable(Object.assign(new Error('duplicate key'), { code: '23505' }))).toBe(false);
		expect(isDatabaseUnavailable(new TypeError('x is undefined'))).toBe(false);
		expect(isDatabaseUnavailable(null)).toBe(false);
	});
});

describe('outageResponse', () => {
	it('answers pages with a calm 503 and the API with its error shape, both with Retry-After', async () => {
		const page = outageResponse('/commissions');
		expect(page.status).toBe(503);
		expect(page.headers.get('retry-after')).toBe('30');
		expect(await page.text()).toContain('Nothing you saved is lost');

		const api = outageResponse('/api/v1/drafts');
		expect(api.status).toBe(503);
		expect((await api.json()).error.code).toBe('unavailable');
	});
});
