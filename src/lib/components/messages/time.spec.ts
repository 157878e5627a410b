import { describe, expect, it } from 'vitest';
import { formatWhen } from './time';

describe('formatWhen', () => {
	const now = new Date('2026-12-02T10:00:00Z');

	it('shows only the time for a message sent today where the reader is', () => {
		expect(formatWhen('2026-12-02T08:05:00Z', 'Europe/Paris', now)).toBe('09:05');
	});

	it('reads "today" in the reader’s time zone, not the server’s', () => {
		// 23:30 UTC on the 1st is already the 2nd in Auckland (UTC+13 in December).
		expect(formatWhen('2026-12-01T23:30:00Z', 'Pacific/Auckland', now)).toBe('12:30');
		expect(formatWhen('2026-12-01T23:30:00Z', 'UTC', now)).toBe('1 Dec, 23:30');
	});

	it('adds the year only for another year', () => {
		expect(formatWhen('2025-11-30T12:00:00Z', 'UTC', now)).toBe('30 Nov 2025, 12:00');
	});
});
