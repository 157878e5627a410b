import { describe, expect, it } from 'vitest';
import { answerCache, type Answer } from './answers';

const answer = (body: string, keep = true): Answer => ({ status: 200, body, headers: {}, keep });

describe('answer cache', () => {
	it('works a request out once, and once only for identical requests in flight', async () => {
		const cache = answerCache({ maxEntries: 10, maxBytes: 1e6 });
		let runs = 0;
		const work = async () => {
			runs++;
			await new Promise((r) => setTimeout(r, 10));
			return answer('{"a":1}');
		};
		const both = await Promise.all([cache.get({ q: 1 }, work), cache.get({ q: 1 }, work)]);
		expect(both.map((a) => a.body)).toEqual(['{"a":1}', '{"a":1}']);
		expect((await cache.get({ q: 1 }, work)).body).toBe('{"a":1}');
		expect(runs).toBe(1);
		await cache.get({ q: 2 }, work);
		expect(runs).toBe(2);
	});

	it('peeks at a kept answer without working anything out, and counts the peek as a use', async () => {
		const cache = answerCache({ maxEntries: 2, maxBytes: 1e6 });
		let runs = 0;
		const work = () => Promise.resolve(answer(String(++runs)));
		expect(cache.peek('a')).toBeUndefined();
		expect(runs).toBe(0);
		await cache.get('a', work);
		await cache.get('b', work);
		expect(cache.peek('a')?.body).toBe('1'); // a is now the most recent
		await cache.get('c', work); // b goes
		expect(cache.peek('a')?.body).toBe('1');
		expect(cache.peek('b')).toBeUndefined();
		expect(runs).toBe(3);
	});

	it('does not keep what was not worked out (over budget, busy)', async () => {
		const cache = answerCache({ maxEntries: 10, maxBytes: 1e6 });
		let runs = 0;
		const work = () => Promise.resolve(answer(`busy ${++runs}`, false));
		expect((await cache.get('r', work)).body).toBe('busy 1');
		expect((await cache.get('r', work)).body).toBe('busy 2');
		expect(cache.size).toBe(0);
	});

	it('drops the least recently used past its bounds, by count and by size', async () => {
		const cache = answerCache({ maxEntries: 2, maxBytes: 1e6 });
		let runs = 0;
		const work = () => Promise.resolve(answer(String(++runs)));
		await cache.get('a', work);
		await cache.get('b', work);
		await cache.get('a', work); // a is now the most recent
		await cache.get('c', work); // b goes
		expect(cache.size).toBe(2);
		expect((await cache.get('a', work)).body).toBe('1');
		expect((await cache.get('b', work)).body).toBe('4');

		const small = answerCache({ maxEntries: 100, maxBytes: 800 });
		const sized = (n: number) => () => Promise.resolve(answer('x'.repeat(n)));
		await small.get(1, sized(40));
		await small.get(2, sized(40));
		await small.get(3, sized(40)); // 3 × 80 bytes = 240 ≤ 800
		expect(small.size).toBe(3);
		await small.get(4, sized(200)); // over an eighth of the bound: answered, not kept
		expect(small.size).toBe(3);
		for (let i = 5; i < 20; i++) await small.get(i, sized(40));
		expect(small.bytes).toBeLessThanOrEqual(800);
		expect(small.size).toBe(10);
	});
});
