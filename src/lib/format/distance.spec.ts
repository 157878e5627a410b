import { describe, expect, it } from 'vitest';
import { formatDistance } from './distance';

describe('formatDistance', () => {
	it('gives tenths of a kilometre below ten', () => {
		expect(formatDistance(0.04)).toBe('under 0.1 km');
		expect(formatDistance(0.06)).toBe('0.1 km');
		expect(formatDistance(2.96)).toBe('3.0 km');
		expect(formatDistance(9.94)).toBe('9.9 km');
	});

	it('gives whole kilometres from ten, said as approximate', () => {
		expect(formatDistance(9.96)).toBe('about 10 km');
		expect(formatDistance(14.4)).toBe('about 14 km');
		expect(formatDistance(59.5)).toBe('about 60 km');
	});
});
