import { describe, expect, it } from 'vitest';
import { homeFor, safeRedirectTarget } from './guard';

describe('homeFor', () => {
	it('sends each role to its own area', () => {
		expect(homeFor('customer')).toBe('/commissions');
		expect(homeFor('tailor')).toBe('/workroom');
		expect(homeFor('admin')).toBe('/desk');
	});
});

describe('safeRedirectTarget', () => {
	it('follows same-site paths only', () => {
		expect(safeRedirectTarget('/workroom?tab=quotes', '/')).toBe('/workroom?tab=quotes');
		for (const target of [
			'https://elsewhere.example',
			'//elsewhere.example',
			'/\\elsewhere.example',
			'javascript:alert(1)',
			'',
			null,
			undefined
		]) {
			expect(safeRedirectTarget(target, '/home')).toBe('/home');
		}
	});
});

describe('safeRedirectTarget after the URL parser', () => {
	it('refuses targets the parser turns into another host, and encodes what a header cannot carry', () => {
		expect(safeRedirectTarget('/\t/evil.example', '/home')).toBe('/home');
		expect(safeRedirectTarget('/\r\n/evil.example', '/home')).toBe('/home');
		expect(safeRedirectTarget('/\r\nevil', '/home')).toBe('/evil');
		expect(safeRedirectTarget('/\u3000evil', '/home')).toBe('/%E3%80%80evil');
	});
});
