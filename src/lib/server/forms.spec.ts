import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { keepValues, parseForm } from './forms';

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
