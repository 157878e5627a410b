import { describe, expect, it } from 'vitest';
import { readJson } from './respond';

const request = (body: BodyInit, type?: string) =>
	new Request('http://localhost/api/v1/x', {
		method: 'POST',
		body,
		headers: type ? { 'content-type': type } : {}
	});

async function refusal(result: Awaited<ReturnType<typeof readJson>>) {
	if (result.ok) throw new Error('expected a refusal');
	return { status: result.response.status, body: await result.response.json() };
}

describe('readJson', () => {
	it('reads JSON sent as application/json', async () => {
		expect(await readJson(request('{"a":1}', 'application/json; charset=utf-8'))).toEqual({ ok: true, body: { a: 1 } });
	});

	it('answers 415 for any other content type, or none', async () => {
		expect((await refusal(await readJson(request('{"a":1}', 'text/plain')))).status).toBe(415);
		expect(await refusal(await readJson(request(new Uint8Array([123, 125]))))).toMatchObject({
			status: 415,
			body: { error: { code: 'unsupported_media_type' } }
		});
	});

	it('answers 413 past the limit and 400 for broken JSON', async () => {
		const big = JSON.stringify({ text: 'x'.repeat(2000) });
		expect(await refusal(await readJson(request(big, 'application/json'), { limit: 1000 }))).toMatchObject({
			status: 413,
			body: { error: { code: 'too_large' } }
		});
		expect((await refusal(await readJson(request('{"a":', 'application/json')))).body.error.code).toBe('invalid_json');
	});

	it('refuses control characters anywhere in the body, naming the path', async () => {
		const { status, body } = await refusal(
			await readJson(request(JSON.stringify({ notions: [{ label: 'Zip\u0000' }] }), 'application/json'))
		);
		expect(status).toBe(400);
		expect(body.error.issues).toEqual([{ path: 'notions.0.label', message: 'Contains control characters.' }]);
	});
});
