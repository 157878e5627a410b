import { describe, expect, it } from 'vitest';
import { estimateQuoteRequest, layoutRectangles } from './requests';

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
});
