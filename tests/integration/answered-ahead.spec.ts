import { describe, expect, it } from 'vitest';
import { newClient } from './http';

const baseUrl = process.env.TACKLINE_BASE_URL ?? 'http://localhost:3000';

// The working dressmaker's trouser method (common practice), worked example in inches.
const trousers = {
	garment: 'wide-leg-trousers',
	unit: 'in',
	measurements: { hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
	options: { length: 45.5 }
};

function postDraft(body: unknown) {
	return fetch(`${baseUrl}/api/v1/drafts`, {
		method: 'POST',
		headers: { 'content-type': 'application/json', origin: baseUrl, 'x-forwarded-for': newClient().address },
		body: JSON.stringify(body)
	});
}

describe('POST /api/v1/drafts', () => {
	it('packs the pieces’ boxes unless the marker is asked for, and answers a repeated request alike', async () => {
		const first = await postDraft(trousers);
		expect(first.status).toBe(200);
		const text = await first.text();
		const draft = JSON.parse(text) as { fabric: { nested: boolean; length: number; efficiency: number } };
		expect(draft.fabric.nested).toBe(false);
		expect(draft.fabric.length).toBeGreaterThan(0);
		const again = await postDraft(trousers);
		expect(again.headers.get('content-type')).toContain('application/json');
		expect(await again.text()).toBe(text);
	});

	it('nests the real outlines when asked, never needing more cloth than the boxes', async () => {
		const boxes = (await (await postDraft(trousers)).json()) as { fabric: { length: number } };
		const response = await postDraft({ ...trousers, nest: true });
		expect(response.status).toBe(200);
		const nested = (await response.json()) as { fabric: { nested: boolean; length: number } };
		// Within its budget the marker finds a layout no longer than the boxes, or keeps the boxes.
		expect(nested.fabric.length).toBeLessThanOrEqual(boxes.fabric.length);
		if (!nested.fabric.nested) expect(nested.fabric.length).toBe(boxes.fabric.length);
	}, 30_000);

	it('refuses a marker option that is not a yes or no', async () => {
		const response = await postDraft({ ...trousers, nest: 'please' });
		expect(response.status).toBe(400);
		const body = (await response.json()) as { error: { issues: { path: string }[] } };
		expect(body.error.issues.map((i) => i.path)).toContain('nest');
	});
});

describe('answers kept in front of the app', () => {
	it('sends the garment catalogue again from memory, compressed when asked, with its ETag', async () => {
		const headers = { 'x-forwarded-for': newClient().address };
		const first = await fetch(`${baseUrl}/api/v1/garments?unit=in`, { headers });
		const body = await first.text();
		const etag = first.headers.get('etag');
		expect(first.headers.get('cache-control')).toBe('public, max-age=3600');

		const kept = await fetch(`${baseUrl}/api/v1/garments?unit=in`, { headers });
		expect(kept.status).toBe(200);
		expect(kept.headers.get('etag')).toBe(etag);
		expect(kept.headers.get('vary')).toBe('Accept-Encoding');
		expect(kept.headers.get('x-content-type-options')).toBe('nosniff');
		expect(await kept.text()).toBe(body);

		const gzipped = await fetch(`${baseUrl}/api/v1/garments?unit=in`, {
			headers: { ...headers, 'accept-encoding': 'gzip' }
		});
		expect(gzipped.headers.get('content-encoding')).toBe('gzip');
		expect(await gzipped.text()).toBe(body); // fetch decompresses it

		const notModified = await fetch(`${baseUrl}/api/v1/garments?unit=in`, {
			headers: { ...headers, 'if-none-match': etag! }
		});
		expect(notModified.status).toBe(304);

		// Another unit is another answer; a bad one still reaches the app and its error shape.
		const metric = await (await fetch(`${baseUrl}/api/v1/garments?unit=cm`, { headers })).text();
		expect(metric).not.toBe(body);
		const bad = await fetch(`${baseUrl}/api/v1/garments?unit=mm`, { headers });
		expect(bad.status).toBe(400);
		expect(((await bad.json()) as { error: { code: string } }).error.code).toBe('invalid_input');
	});

	it('lets requests with a session through to the app, which checks the session', async () => {
		await fetch(`${baseUrl}/api/v1/garments`);
		const forged = await fetch(`${baseUrl}/api/v1/garments`, {
			headers: { cookie: 'authjs.session-token=not-a-token', 'x-forwarded-for': newClient().address }
		});
		expect(forged.status).toBe(200);
		// The app's own answer: the shared copy is the one that says it varies by encoding.
		expect(forged.headers.get('vary')).toBeNull();
	});

	it('sends the calculator built ahead, whatever its address asks for', async () => {
		const plain = await fetch(`${baseUrl}/draft-calculator`);
		expect(plain.status).toBe(200);
		expect(plain.headers.get('cache-control')).toBe('no-cache');
		expect(plain.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
		const page = await plain.text();
		expect(page).toContain('Draft calculator');
		const withGarment = await fetch(`${baseUrl}/draft-calculator?garment=shirt&unit=in`);
		expect(withGarment.headers.get('etag')).toBe(plain.headers.get('etag'));
	});
});
