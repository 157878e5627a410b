import { RateLimiterMemory } from 'rate-limiter-flexible';
import { describe, expect, it } from 'vitest';
import { leasedLimit } from './lease';

/** A shared counter as rate-limiter-flexible keeps it (in memory here, in PostgreSQL in the app). */
function counter(points: number) {
	const store = new RateLimiterMemory({ points, duration: 60 });
	const calls: number[] = [];
	const take = (key: string, n: number) => {
		calls.push(n);
		return store.consume(key, n);
	};
	return { store, take, calls };
}

async function spend(
	gate: (key: string) => { allowed: boolean } | Promise<{ allowed: boolean }>,
	key: string,
	times: number
) {
	const outcomes = await Promise.all(Array.from({ length: times }, () => Promise.resolve(gate(key))));
	return outcomes.filter((o) => o.allowed).length;
}

describe('leasedLimit', () => {
	it('allows exactly the limit from one process, asking the counter once per lease', async () => {
		const { take, calls } = counter(25);
		const gate = leasedLimit(take, { limit: 25, size: 10 });
		expect(await spend(gate, 'a', 40)).toBe(25);
		// Three leases (10, 10, then the 5 left) and one refusal that blocks the key locally.
		expect(calls.length).toBeLessThanOrEqual(4);
		const refused = await gate('a');
		expect(refused).toMatchObject({ allowed: false });
		expect(refused.allowed === false && refused.retryAfterSeconds).toBeGreaterThan(0);
		expect(calls.length).toBeLessThanOrEqual(4);
	});

	it('answers without waiting while a lease lasts, and with a promise when it must ask the counter', async () => {
		const { take, calls } = counter(100);
		const gate = leasedLimit(take, { limit: 100, size: 5 });
		const first = gate('a');
		expect(first).toBeInstanceOf(Promise);
		expect(await first).toEqual({ allowed: true });
		for (let i = 0; i < 4; i++) expect(gate('a')).toEqual({ allowed: true });
		expect(calls).toEqual([5]);
		expect(gate('a')).toBeInstanceOf(Promise);
	});

	it('keeps keys apart', async () => {
		const { take } = counter(10);
		const gate = leasedLimit(take, { limit: 10, size: 5 });
		expect(await spend(gate, 'a', 12)).toBe(10);
		expect(await spend(gate, 'b', 3)).toBe(3);
	});

	it('lets two processes on one counter exceed the limit by at most their unspent leases', async () => {
		const { take } = counter(100);
		const one = leasedLimit(take, { limit: 100, size: 10 });
		const two = leasedLimit(take, { limit: 100, size: 10 });
		let allowed = 0;
		for (let round = 0; round < 30; round++) {
			allowed += await spend(one, 'a', 3);
			allowed += await spend(two, 'a', 4);
		}
		expect(allowed).toBeGreaterThanOrEqual(100 - 2 * 9);
		expect(allowed).toBeLessThanOrEqual(100 + 2 * 9);
	});

	it('passes on a failure of the counter itself', async () => {
		const gate = leasedLimit(() => Promise.reject(new Error('database away')), { limit: 10, size: 5 });
		await expect(gate('a')).rejects.toThrow('database away');
	});
});
