import { describe, expect, it } from 'vitest';
import { bestFitHint, daysBetween, formatKm, scoreQuotes, type FitInput } from './fit';

const context = { dateNeeded: '2027-03-01', budget: { minMinor: 40_000, maxMinor: 60_000, currency: 'EUR' } };

function q(id: string, fields: Partial<FitInput> = {}): FitInput {
	return {
		id,
		tailorName: `Workroom ${id}`,
		priceMinor: 50_000,
		currency: 'EUR',
		deliveryDate: '2027-02-20',
		distanceKm: 3,
		...fields
	};
}

describe('scoreQuotes', () => {
	it('scores each check and shows the working', () => {
		const fits = scoreQuotes(
			[q('a'), q('b', { priceMinor: 65_000, deliveryDate: '2027-03-04', distanceKm: 12 })],
			context
		);
		expect(fits.get('a')).toEqual({
			points: 9,
			max: 9,
			criteria: [
				{ id: 'on_time', label: 'On time', points: 3, max: 3, detail: 'Ready 9 days early' },
				{ id: 'budget', label: 'Within budget', points: 2, max: 2, detail: 'Within your budget of €400 – €600' },
				{ id: 'price', label: 'Price', points: 2, max: 2, detail: 'The lowest price' },
				{ id: 'distance', label: 'Distance', points: 2, max: 2, detail: '3.0 km from your area' }
			]
		});
		const b = fits.get('b')!;
		expect(b.points).toBe(0 + 0 + 1 + 1);
		expect(b.criteria.map((c) => c.detail)).toEqual([
			'3 days late',
			'€50 over your budget of €400 – €600',
			'The second lowest price',
			'12 km from your area'
		]);
	});

	it('leaves out a check it cannot make', () => {
		const fits = scoreQuotes([q('a', { currency: 'GBP', distanceKm: null })], {
			dateNeeded: null,
			budget: context.budget
		});
		expect(fits.get('a')).toMatchObject({ points: 2, max: 2 });
		expect(fits.get('a')!.criteria.map((c) => c.id)).toEqual(['price']);
	});

	it('lets equal prices share a place', () => {
		const fits = scoreQuotes([q('a'), q('b'), q('c', { priceMinor: 55_000 })], context);
		expect(['a', 'b', 'c'].map((id) => fits.get(id)!.criteria.find((c) => c.id === 'price')!.points)).toEqual([
			2, 2, 1
		]);
	});
});

describe('bestFitHint', () => {
	it('names the best quote and why, in plain words', () => {
		const live = [q('a', { deliveryDate: '2027-03-05' }), q('b', { priceMinor: 55_000 })];
		const hint = bestFitHint(live, scoreQuotes(live, context))!;
		expect(hint.quoteId).toBe('b');
		expect(hint.text).toBe(
			'Workroom b fits best: ready 9 days early, within your budget of €400 – €600, the second lowest price, 3.0 km from your area (8 of 9 points).'
		);
	});

	it('breaks a tie on the lower price and says so', () => {
		const live = [q('a', { priceMinor: 52_000 }), q('b', { priceMinor: 51_000, distanceKm: 12 })];
		const fits = scoreQuotes(live, context);
		expect(fits.get('a')!.points).toBe(fits.get('b')!.points);
		const hint = bestFitHint(live, fits)!;
		expect(hint.quoteId).toBe('b');
		expect(hint.tiedWith).toEqual(['Workroom a']);
	});

	it('has nothing to say without live quotes', () => {
		expect(bestFitHint([], new Map())).toBeNull();
	});
});

describe('helpers', () => {
	it('counts days between dates across month ends and a leap day', () => {
		expect(daysBetween('2028-02-27', '2028-03-01')).toBe(3);
		expect(daysBetween('2027-03-01', '2027-02-20')).toBe(-9);
	});

	it('rounds distances to what coarse places allow', () => {
		expect(formatKm(0.4)).toBe('under 1 km');
		expect(formatKm(3.44)).toBe('3.4 km');
		expect(formatKm(27.6)).toBe('28 km');
	});
});
