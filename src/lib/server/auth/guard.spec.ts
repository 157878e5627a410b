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
			'/\t/evil.example',
			decodeURIComponent('%2F%09%2Fevil.example'),
			'/\t\\evil.example',
			'//evil',
			'/\\\\evil',
			'/\r\n/evil.example',
			'/\r\nSet-Cookie: a=b',
			'/\u3000/evil.example',
			'/./\n/evil.example',
			'/.//evil.example',
			' /evil',
			'',
			null,
			undefined
		]) {
			expect(safeRedirectTarget(target, '/home'), JSON.stringify(target)).toBe('/home');
		}
	});

	it('returns the path as the URL parser normalised it', () => {
		expect(safeRedirectTarget('/commissions/../workroom#top', '/')).toBe('/workroom#top');
		expect(safeRedirectTarget('/%2F%2Fevil.example', '/')).toBe('/%2F%2Fevil.example');
	});
});

describe('safeRedirectTarget after the URL parser', () => {
	it('refuses targets the parser would turn into another host, and anything a header cannot carry', () => {
		expect(safeRedirectTarget('/\t/evil.example', '/home')).toBe('/home');
		expect(safeRedirectTarget('/\r\n/evil.example', '/home')).toBe('/home');
		expect(safeRedirectTarget('/\r\nevil', '/home')).toBe('/home');
		expect(safeRedirectTarget('/\u3000evil', '/home')).toBe('/home');
	});
});
