import { describe, expect, it } from 'vitest';

const baseUrl = process.env.TACKLINE_BASE_URL ?? 'http://localhost:3000';

async function get(query: string) {
	const response = await fetch(`${baseUrl}/api/v1/places?${query}`);
	return { status: response.status, body: await response.json() };
}

describe('GET /api/v1/places', () => {
	it('finds the demo districts and gazetteer towns by the start of their name', async () => {
		const { status, body } = await get('q=loom');
		expect(status).toBe(200);
		expect(body.items[0]).toMatchObject({ id: 'local:merrowgate-loomside', name: 'Loomside', country: 'FR' });
		// GeoNames 2657896: Zürich, CH.
		const zurich = await get('q=zuri&country=ch&limit=3');
		expect(zurich.body.items[0]).toMatchObject({ name: 'Zürich', country: 'CH' });
	}, 60_000);

	it('names the place nearest a point', async () => {
		const { status, body } = await get('near=46.8589,3.2199');
		expect(status).toBe(200);
		expect(body.items).toHaveLength(1);
		expect(body.items[0].name).toBe('Loomside');
	});

	it.each([
		['', 'no name and no point'],
		['q=', 'an empty name'],
		['q=Lyon&country=France', 'a country that is not an ISO code'],
		['near=north', 'a point that is not two numbers'],
		['near=91,10', 'a point off the earth'],
		['q=Lyon&limit=500', 'a limit above 20'],
		[`q=${'a'.repeat(101)}`, 'a name over 100 characters'],
		['q=Ly%00on', 'a name carrying a NUL byte']
	])('answers 400 with the error shape for %s (%s)', async (query) => {
		const { status, body } = await get(query);
		expect(status).toBe(400);
		expect(body.error.code).toBe('invalid_input');
		expect(body.error.issues.length).toBeGreaterThan(0);
	});
});
