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
