import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime, garmentName } from './index';

describe('formatDate', () => {
	it('shows a calendar date without shifting it by time zone', () => {
		expect(formatDate('2027-01-31')).toBe('31 Jan 2027');
	});
});

describe('formatDateTime', () => {
	// IANA tz database: Lisbon is UTC+0 in January, New York UTC-5.
	it('shows the moment in the viewer’s zone and names the zone', () => {
		const at = new Date('2027-01-10T09:05:00Z');
		expect(formatDateTime(at, 'Europe/Lisbon')).toBe('10 Jan 2027, 09:05 (UTC+00:00)');
		expect(formatDateTime(at, 'America/New_York')).toBe('10 Jan 2027, 04:05 (UTC-05:00)');
		expect(formatDateTime(at, 'UTC')).toBe('10 Jan 2027, 09:05 (UTC+00:00)');
	});
});

describe('garmentName', () => {
	it('names catalogue garments and falls back to readable words', () => {
		expect(garmentName('wide-leg-trousers')).not.toBe('wide-leg-trousers');
		expect(garmentName('morning-coat')).toBe('morning coat');
	});
});
