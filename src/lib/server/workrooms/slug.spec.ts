import { describe, expect, it } from 'vitest';
import { firstFreeSlug, slugify } from './slug';

describe('slugify', () => {
	it('makes lower-case ASCII words joined by hyphens', () => {
		expect(slugify('Obi Cut & Stitch')).toBe('obi-cut-and-stitch');
		expect(slugify('  Crème Brûlée Atelier!  ')).toBe('creme-brulee-atelier');
		expect(slugify('Pellow — Daughter No. 2')).toBe('pellow-daughter-no-2');
	});

	it('falls back to a word when nothing Latin is left, and keeps to 60 characters', () => {
		expect(slugify('仕立て屋')).toBe('workroom');
		const long = slugify('Very '.repeat(30));
		expect(long.length).toBeLessThanOrEqual(60);
		expect(long.endsWith('-')).toBe(false);
	});

	it('never makes a slug that reads as a user id', () => {
		const id = '5eed0000-0000-4000-8000-000100000006';
		expect(slugify(id)).toBe(`workroom-${id}`);
	});
});

describe('firstFreeSlug', () => {
	it('numbers a taken slug from 2', () => {
		expect(firstFreeSlug('quill', [])).toBe('quill');
		expect(firstFreeSlug('quill', ['quill'])).toBe('quill-2');
		expect(firstFreeSlug('quill', ['quill', 'quill-2', 'quill-4'])).toBe('quill-3');
	});
});
