import { describe, expect, it } from 'vitest';
import { baseUrl, newClient } from './http';

// Drafts, layouts and estimates are pure functions of the request body: server/pure-answers.js sends the answer
// to a body it has seen again from memory (with an `Age` header), after the same per-address limit.
function draft(hip: number) {
	return JSON.stringify({
		garment: 'wide-leg-trousers',
		unit: 'in',
		measurements: { hip_girth: hip, waist_girth: 28, thigh_girth: 25 },
		options: { length: 45.5 }
	});
}

function post(body: string, address = newClient().address) {
	return fetch(`${baseUrl}/api/v1/drafts`, {
		method: 'POST',
		headers: { 'content-type': 'application/json', origin: baseUrl, 'x-forwarded-for': address },
		body
	});
}

describe('answers that depend only on the body', () => {
	it('are sent again for the same body, the same as the app worked them out', async () => {
		// The app's first marked answer tells the entry which address answers purely.
		expect((await post(draft(39.5))).status).toBe(200);
		const body = draft(40.125);
		const first = await post(body);
		expect(first.status).toBe(200);
		expect(first.headers.has('x-tackline-pure')).toBe(false);
		const firstText = await first.text();
		const again = await post(body);
		expect(again.status).toBe(200);
		expect(again.headers.has('age')).toBe(true);
		expect(await again.text()).toBe(firstText);
	});

	it('are worked out by the app for any other body, and are not mixed up', async () => {
		await post(draft(40.25));
		const other = await post(draft(41.5));
		expect(other.status).toBe(200);
		const [a, b] = await Promise.all([(await post(draft(40.25))).json(), other.json()]);
		expect(JSON.stringify(a)).not.toBe(JSON.stringify(b));
	});

	it('are never kept for a refused body: each refusal comes from the app', async () => {
		const bad = JSON.stringify({ garment: 'wide-leg-trousers', unit: 'in', measurements: { hip_girth: 'wide' } });
		for (let i = 0; i < 3; i++) {
			const refused = await post(bad);
			expect(refused.status).toBe(400);
			expect(refused.headers.has('age')).toBe(false);
			expect((await refused.json()).error.code).toBe('invalid_input');
		}
	});

	it('count against the per-address limit all the same', async () => {
		const address = newClient().address;
		const body = draft(40.375);
		await post(body, address);
		let last: Response | null = null;
		for (let batch = 0; batch < 14 && last?.status !== 429; batch++) {
			const responses = await Promise.all(Array.from({ length: 50 }, () => post(body, address)));
			last = responses.find((r) => r.status === 429) ?? responses[0];
		}
		expect(last?.status).toBe(429);
		expect((await last!.json()).error.code).toBe('rate_limited');
	});
});
