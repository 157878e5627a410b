import { describe, expect, it } from 'vitest';
import type { ComparedQuote } from '$lib/types/quote-comparison';
import { deliveryText, responseText, sortQuotes } from './sort';

function q(id: string, fields: Partial<ComparedQuote>): ComparedQuote {
	return {
		id,
		status: 'sent',
		tailor: { id, name: id, slug: null, town: null },
		priceMinor: 50_000,
		currency: 'EUR',
		deliveryDate: '2027-02-20',
		daysBeforeNeeded: 5,
		fittings: 1,
		fabricIncluded: true,
		advanceMinor: 0,
		message: '',
		validUntil: '2027-01-01T00:00:00.000Z',
		createdAt: '2026-12-01T00:00:00.000Z',
		declineReason: null,
		distanceKm: 3,
		leadTimeDays: null,
		responseHours: null,
		responseSample: 0,
		portfolio: [],
		threadId: null,
		fit: { points: 5, max: 9, criteria: [] },
		...fields
	};
}

const quotes = [
	q('a', {
		priceMinor: 60_000,
		deliveryDate: '2027-02-10',
		distanceKm: null,
		fit: { points: 7, max: 9, criteria: [] }
	}),
	q('b', { priceMinor: 40_000, deliveryDate: '2027-02-25', distanceKm: 12, fit: { points: 7, max: 9, criteria: [] } }),
	q('c', { priceMinor: 50_000, deliveryDate: '2027-02-15', distanceKm: 2, fit: { points: 9, max: 9, criteria: [] } })
];

describe('sortQuotes', () => {
	it('sorts by each key, ties going to the lower price, unknown distances last', () => {
		expect(sortQuotes(quotes, 'fit').map((x) => x.id)).toEqual(['c', 'b', 'a']);
		expect(sortQuotes(quotes, 'price').map((x) => x.id)).toEqual(['b', 'c', 'a']);
		expect(sortQuotes(quotes, 'delivery').map((x) => x.id)).toEqual(['a', 'c', 'b']);
		expect(sortQuotes(quotes, 'distance').map((x) => x.id)).toEqual(['c', 'b', 'a']);
	});

	it('leaves the given list alone', () => {
		sortQuotes(quotes, 'price');
		expect(quotes.map((x) => x.id)).toEqual(['a', 'b', 'c']);
	});
});

describe('words', () => {
	it('says response times and delivery in plain words', () => {
		expect(responseText(null)).toBe('New to quoting');
		expect(responseText(0.4)).toBe('Usually within an hour');
		expect(responseText(5.2)).toBe('Usually about 5 hours');
		expect(responseText(80)).toBe('Usually about 3 days');
		expect(deliveryText(0)).toBe('On the day you need it');
		expect(deliveryText(1)).toBe('1 day before you need it');
		expect(deliveryText(-4)).toBe('4 days after you need it');
	});
});
