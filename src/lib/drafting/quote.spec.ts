import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { estimateQuote, formatMoney, isCurrencyCode, minorUnitExponent, parseMoney } from './quote';

describe('ISO 4217 minor units', () => {
	it('matches the published exponents', () => {
		// ISO 4217 tables (and Node 20 Intl / CLDR): USD, EUR, GBP, KES, NGN 2; JPY, UGX, CLP, XOF, RWF 0; KWD, BHD, TND 3.
		for (const code of ['USD', 'EUR', 'GBP', 'KES', 'NGN', 'GHS', 'ZAR', 'INR', 'TZS'])
			expect(minorUnitExponent(code), code).toBe(2);
		for (const code of ['JPY', 'UGX', 'CLP', 'XOF', 'RWF']) expect(minorUnitExponent(code), code).toBe(0);
		for (const code of ['KWD', 'BHD', 'TND']) expect(minorUnitExponent(code), code).toBe(3);
	});

	it('knows a currency code from a made-up one', () => {
		expect(isCurrencyCode('KES')).toBe(true);
		expect(isCurrencyCode('usd')).toBe(false);
		expect(isCurrencyCode('ZZZ')).toBe(false);
	});
});

describe('estimateQuote', () => {
	it('itemises fabric, labour, notions and extras in minor units', () => {
		const quote = estimateQuote({
			currency: 'USD',
			fabric: { supply: 'tailor', pricePerUnitMinor: 1299, per: 'yd', length: 2.625 },
			labourHours: 8,
			hourlyRateMinor: 3500,
			notions: [{ label: 'Zip', amountMinor: 450 }],
			extras: [{ label: 'Rush', amountMinor: 2000 }]
		});
		// 12.99 × 2.625 = 34.09875 → 34.10; 35.00 × 8 = 280.00.
		expect(quote.lines.map((l) => l.amountMinor)).toEqual([3410, 28000, 450, 2000]);
		expect(quote.totalMinor).toBe(33860);
		expect(quote.exponent).toBe(2);
		expect(quote.range).toEqual({ lowMinor: 30474, highMinor: 37246 });
	});

	it('charges nothing for fabric the customer supplies', () => {
		const quote = estimateQuote({
			currency: 'JPY',
			fabric: { supply: 'customer' },
			labourHours: 6.5,
			hourlyRateMinor: 3000
		});
		expect(quote.lines[0].amountMinor).toBe(0);
		expect(quote.totalMinor).toBe(19500);
		expect(quote.exponent).toBe(0);
	});

	it('converts yards to a per-metre price exactly (1 yd = 0.9144 m)', () => {
		const quote = estimateQuote({
			currency: 'EUR',
			fabric: { supply: 'tailor', pricePerUnitMinor: 1000, per: 'm', length: 2, lengthUnit: 'yd' },
			labourHours: 0,
			hourlyRateMinor: 0
		});
		expect(quote.lines[0].amountMinor).toBe(1829); // 10.00 × 1.8288 m = 18.288
	});

	it('prices a lined garment’s lining as its own line: lining length × lining price', () => {
		// Cost-plus pricing, cloth and lining each bought by length (common practice); worked by hand:
		// 2.0 m × 18.00 = 36.00 of cloth; 1.1 m × 7.50 = 8.25 of lining; 8 h × 30.00 = 240.00.
		const quote = estimateQuote({
			currency: 'GBP',
			fabric: { supply: 'tailor', pricePerUnitMinor: 1800, per: 'm', length: 2 },
			lining: { pricePerUnitMinor: 750, per: 'm', length: 1.1 },
			labourHours: 8,
			hourlyRateMinor: 3000
		});
		expect(quote.lines.map((l) => [l.id, l.amountMinor])).toEqual([
			['fabric', 3600],
			['lining', 825],
			['labour', 24000]
		]);
		expect(quote.lines[1].label).toBe('Lining, 1.1 m');
		expect(quote.totalMinor).toBe(28425);
	});

	it('converts a lining length in yards to a per-metre price exactly (1 yd = 0.9144 m)', () => {
		const quote = estimateQuote({
			currency: 'EUR',
			fabric: { supply: 'customer' },
			lining: { pricePerUnitMinor: 1000, per: 'm', length: 1.25, lengthUnit: 'yd' },
			labourHours: 0,
			hourlyRateMinor: 0
		});
		// 1.25 yd = 1.143 m; × 10.00 = 11.43.
		expect(quote.lines.find((l) => l.id === 'lining')!.amountMinor).toBe(1143);
		expect(quote.totalMinor).toBe(1143);
	});

	it('has no lining line for an unlined garment', () => {
		const quote = estimateQuote({
			currency: 'USD',
			fabric: { supply: 'tailor', pricePerUnitMinor: 1299, per: 'yd', length: 2.625 },
			labourHours: 8,
			hourlyRateMinor: 3500
		});
		expect(quote.lines.map((l) => l.id)).toEqual(['fabric', 'labour']);
	});

	it('always totals the integer lines exactly (property)', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 0, max: 100_000 }),
				fc.double({ min: 0, max: 20, noNaN: true }),
				fc.integer({ min: 0, max: 50_000 }),
				fc.double({ min: 0, max: 200, noNaN: true }),
				fc.array(fc.integer({ min: 0, max: 10_000 }), { maxLength: 5 }),
				(price, length, rate, hours, notions) => {
					const quote = estimateQuote({
						currency: 'GBP',
						fabric: { supply: 'tailor', pricePerUnitMinor: price, per: 'm', length },
						labourHours: hours,
						hourlyRateMinor: rate,
						notions: notions.map((amountMinor) => ({ label: 'n', amountMinor }))
					});
					for (const line of quote.lines) expect(Number.isInteger(line.amountMinor)).toBe(true);
					expect(quote.totalMinor).toBe(quote.lines.reduce((s, l) => s + l.amountMinor, 0));
					expect(quote.range.lowMinor).toBeLessThanOrEqual(quote.totalMinor);
					expect(quote.range.highMinor).toBeGreaterThanOrEqual(quote.totalMinor);
				}
			)
		);
	});
});

describe('money text', () => {
	it('parses prices without floating point', () => {
		expect(parseMoney('12.50', 'USD')).toBe(1250);
		expect(parseMoney('12,5', 'EUR')).toBe(1250);
		expect(parseMoney('0.29', 'USD')).toBe(29);
		expect(parseMoney('500', 'JPY')).toBe(500);
		expect(parseMoney('1.5', 'JPY')).toBeNull();
		expect(parseMoney('1.234', 'KWD')).toBe(1234);
		expect(parseMoney('abc', 'USD')).toBeNull();
	});

	it('formats minor units with the currency’s exponent', () => {
		expect(formatMoney(33860, 'USD')).toBe('$338.60');
		expect(formatMoney(19500, 'JPY')).toBe('¥19,500');
		expect(formatMoney(1234, 'KWD').replace(/\s/g, ' ')).toBe('KWD 1.234'); // Intl puts a no-break space here
	});
});
