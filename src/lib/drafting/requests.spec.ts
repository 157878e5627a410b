import { describe, expect, it } from 'vitest';
import { estimateQuoteRequest, layoutRectangles } from './requests';
import { quoteRequestSchema } from './schemas';

describe('layoutRectangles', () => {
	it('packs four 5×5 squares into a 10-wide strip at the optimum, 10 (hand check)', () => {
		const response = layoutRectangles({ width: 10, unit: 'cm', pieces: [{ w: 5, h: 5, quantity: 4 }] });
		expect(response).toMatchObject({ unit: 'cm', width: 10, length: 10, efficiency: 1, lowerBound: 10 });
		expect(response.placements).toHaveLength(4);
	});
});

describe('estimateQuoteRequest', () => {
	it('takes the garment’s default labour hours when none are given', () => {
		const quote = estimateQuoteRequest({
			currency: 'USD',
			garment: 'wide-leg-trousers',
			fabric: { supply: 'customer' },
			hourlyRateMinor: 3000
		});
		expect(quote.labourHours).toBe(8);
		expect(quote.totalMinor).toBe(24000);
	});

	it('prices the lining of a lined garment when the request gives it, and refuses a lining of no length', () => {
		// Cost-plus (common practice), worked by hand: 1.2 m × 9.00 = 10.80 of lining; 10 h × 30.00 = 300.00.
		const quote = estimateQuoteRequest({
			currency: 'EUR',
			garment: 'waistcoat',
			fabric: { supply: 'customer' },
			lining: { pricePerUnitMinor: 900, per: 'm', length: 1.2 },
			labourHours: 10,
			hourlyRateMinor: 3000
		});
		expect(quote.lines.map((l) => [l.id, l.amountMinor])).toEqual([
			['fabric', 0],
			['lining', 1080],
			['labour', 30000]
		]);
		expect(
			quoteRequestSchema.safeParse({ ...baseQuote, lining: { pricePerUnitMinor: 900, per: 'm', length: 0 } }).success
		).toBe(false);
		expect(
			quoteRequestSchema.safeParse({ ...baseQuote, lining: { pricePerUnitMinor: 900, per: 'ell', length: 1 } }).success
		).toBe(false);
	});
});

const baseQuote = { currency: 'EUR', fabric: { supply: 'customer' as const }, labourHours: 1, hourlyRateMinor: 100 };
