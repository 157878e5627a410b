import { describe, expect, it } from 'vitest';
import { segments } from './segments';

describe('segments', () => {
	it('keeps plain text as one text segment', () => {
		expect(segments('Hello there,\nsee you Tuesday.')).toEqual([
			{ kind: 'text', text: 'Hello there,\nsee you Tuesday.' }
		]);
	});

	it('turns web and mail addresses into links between text', () => {
		expect(segments('Swatches at https://cloth.example.com/linen?x=1 or mail me@example.org.')).toEqual([
			{ kind: 'text', text: 'Swatches at ' },
			{ kind: 'link', text: 'https://cloth.example.com/linen?x=1', href: 'https://cloth.example.com/linen?x=1' },
			{ kind: 'text', text: ' or mail ' },
			{ kind: 'link', text: 'me@example.org', href: 'mailto:me@example.org' },
			{ kind: 'text', text: '.' }
		]);
	});

	it('gives a bare domain an https address', () => {
		expect(segments('see www.example.com')).toEqual([
			{ kind: 'text', text: 'see ' },
			{ kind: 'link', text: 'www.example.com', href: 'https://www.example.com/' }
		]);
	});

	it('never makes a link of javascript: or data: addresses, and keeps markup as text', () => {
		const body = 'javascript:alert(1) data:text/html,<b>x</b> <a href="https://evil.example">y</a>';
		const found = segments(body);
		expect(found.filter((s) => s.kind === 'link').every((s) => /^https?:/.test((s as { href: string }).href))).toBe(
			true
		);
		expect(found.map((s) => s.text).join('')).toBe(body);
	});
});
