import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { controlCharacterMessage, keepValues, parseForm, readForm, text } from './forms';

const schema = z.object({ name: z.string().min(2, 'Too short.'), age: z.coerce.number().int() });

function form(fields: Record<string, string>) {
	const data = new FormData();
	for (const [key, value] of Object.entries(fields)) data.set(key, value);
	return data;
}

describe('parseForm', () => {
	it('returns typed data when the fields are valid', () => {
		expect(parseForm(schema, form({ name: 'Ada', age: '31' }))).toEqual({ ok: true, data: { name: 'Ada', age: 31 } });
	});

	it('returns messages per field when they are not', () => {
		const result = parseForm(schema, form({ name: 'A', age: 'x' }));
		expect(result.ok).toBe(false);
		if (!result.ok) {
			expect(result.errors.name).toEqual(['Too short.']);
			expect(result.errors.age).toHaveLength(1);
		}
	});
});

describe('keepValues', () => {
	it('keeps only the named fields, so passwords are never echoed back', () => {
		expect(keepValues(form({ email: 'a@b.test', password: 'secret' }), ['email'])).toEqual({ email: 'a@b.test' });
	});
});

describe('control characters', () => {
	it('refuses NUL in any field before the schema runs, keeping line breaks for text areas', () => {
		const result = parseForm(schema, form({ name: 'Ada\u0000', age: '3' }));
		expect(result).toEqual({ ok: false, errors: { name: [controlCharacterMessage] } });
		const notes = z.object({ notes: text({ max: 100, multiline: true }) });
		expect(parseForm(notes, form({ notes: 'line one\r\nline two' }))).toEqual({
			ok: true,
			data: { notes: 'line one\r\nline two' }
		});
	});

	it('text() refuses line breaks in a single-line field and says why', () => {
		const single = z.object({ name: text({ max: 80 }) });
		const result = parseForm(single, form({ name: 'Ada\nQuill' }));
		expect(result.ok).toBe(false);
		if (!result.ok) expect(result.errors.name).toEqual([controlCharacterMessage]);
	});
});

describe('readForm', () => {
	const post = (body: BodyInit, type?: string) =>
		new Request('http://localhost/x', { method: 'POST', body, headers: type ? { 'content-type': type } : {} });

	it('reads URL-encoded and multipart forms', async () => {
		const read = await readForm(post('name=Ada', 'application/x-www-form-urlencoded'));
		expect(read.ok && read.data.get('name')).toBe('Ada');
		const multipart = new FormData();
		multipart.set('name', 'Ada');
		const fromMultipart = await readForm(new Request('http://localhost/x', { method: 'POST', body: multipart }));
		expect(fromMultipart.ok && fromMultipart.data.get('name')).toBe('Ada');
	});

	it('turns a body that is not a form, a broken one or an oversized one into a 4xx with a message', async () => {
		expect(await readForm(post('name=Ada', 'text/plain'))).toMatchObject({ ok: false, status: 415 });
		expect(await readForm(post(new Uint8Array([1, 2, 3])))).toMatchObject({ ok: false, status: 415 });
		expect(await readForm(post('garbage', 'multipart/form-data; boundary=abc'))).toMatchObject({
			ok: false,
			status: 400
		});
		const big = await readForm(post(`name=${'a'.repeat(5000)}`, 'application/x-www-form-urlencoded'), { limit: 1000 });
		expect(big).toMatchObject({ ok: false, status: 413, values: {} });
		if (!big.ok) expect(big.errors.form?.[0]).toMatch(/larger than/);
	});
});
