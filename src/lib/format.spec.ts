import { describe, expect, it } from 'vitest';
import { formatDate, garmentName } from './format';

describe('formatDate', () => {
	it('shows a calendar date without shifting it by time zone', () => {
		expect(formatDate('2027-01-31')).toBe('31 Jan 2027');
	});
});

describe('garmentName', () => {
	it('names catalogue garments and falls back to readable words', () => {
		expect(garmentName('wide-leg-trousers')).not.toBe('wide-leg-trousers');
		expect(garmentName('morning-coat')).toBe('morning coat');
	});
});
