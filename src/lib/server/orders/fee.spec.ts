import { afterEach, describe, expect, it, vi } from 'vitest';
import { rateText, splitPrice } from './fee';

const env: Record<string, string | undefined> = {};
vi.mock('$env/dynamic/private', () => ({ env }));
const { platformFeeBasisPoints } = await import('../services/platform-fee');

describe('splitPrice', () => {
	it('takes the rate of the price and leaves the rest to the tailor', () => {
		// 10 % of €450.00 is €45.00 exactly.
		expect(splitPrice(45_000, 'EUR', 1000)).toEqual({
			priceMinor: 45_000,
			platformFeeMinor: 4500,
			tailorPayoutMinor: 40_500,
			platformFeeBasisPoints: 1000,
			currency: 'EUR',
			exponent: 2
		});
	});

	it('rounds half a minor unit up', () => {
		// 10 % of €0.05 is 0.5 cent → 1 cent; of €123.45 it is 1 234.5 cents → 1 235.
		expect(splitPrice(5, 'EUR', 1000).platformFeeMinor).toBe(1);
		expect(splitPrice(12_345, 'EUR', 1000).platformFeeMinor).toBe(1235);
		// 12.5 % of €1.00 is 12.5 cents → 13; of €0.04 it is 0.5 cent → 1.
		expect(splitPrice(100, 'EUR', 1250).platformFeeMinor).toBe(13);
		expect(splitPrice(4, 'EUR', 1250).platformFeeMinor).toBe(1);
	});

	it('rounds below half a minor unit down', () => {
		// 10 % of €123.44 is 1 234.4 cents → 1 234; 7.5 % of €0.06 is 0.45 cent → 0.
		expect(splitPrice(12_344, 'EUR', 1000).platformFeeMinor).toBe(1234);
		expect(splitPrice(6, 'EUR', 750).platformFeeMinor).toBe(0);
		// 10 % of €0.04 is 0.4 cent: no fee at all, the tailor gets the whole price.
		expect(splitPrice(4, 'EUR', 1000)).toMatchObject({ platformFeeMinor: 0, tailorPayoutMinor: 4 });
	});

	it('rounds to the whole yen, JPY having no minor unit (ISO 4217 exponent 0)', () => {
		// 10 % of ¥19 995 is ¥1 999.5 → ¥2 000; of ¥19 994 it is ¥1 999.4 → ¥1 999.
		expect(splitPrice(19_995, 'JPY', 1000)).toMatchObject({
			platformFeeMinor: 2000,
			tailorPayoutMinor: 17_995,
			exponent: 0
		});
		expect(splitPrice(19_994, 'JPY', 1000)).toMatchObject({ platformFeeMinor: 1999, tailorPayoutMinor: 17_995 });
	});

	it('rounds to the fils, KWD having three decimals (ISO 4217 exponent 3)', () => {
		// 10 % of KWD 12.345 is 1.2345 → KWD 1.235 (half a fils up); payout KWD 11.110.
		expect(splitPrice(12_345, 'KWD', 1000)).toMatchObject({
			platformFeeMinor: 1235,
			tailorPayoutMinor: 11_110,
			exponent: 3
		});
	});

	it('always adds up to the price', () => {
		for (let price = 1; price <= 2000; price += 7) {
			for (const rate of [0, 1, 333, 1000, 1250, 2999, 5000]) {
				const split = splitPrice(price, 'EUR', rate);
				expect(split.platformFeeMinor + split.tailorPayoutMinor).toBe(price);
				expect(split.platformFeeMinor).toBeGreaterThanOrEqual(0);
				// Never further than half a minor unit from the exact fee.
				expect(Math.abs(split.platformFeeMinor * 10_000 - price * rate)).toBeLessThanOrEqual(5000);
			}
		}
	});

	it('refuses what is not money', () => {
		expect(() => splitPrice(0, 'EUR', 1000)).toThrow(RangeError);
		expect(() => splitPrice(10.5, 'EUR', 1000)).toThrow(RangeError);
		expect(() => splitPrice(1000, 'EUR', -1)).toThrow(RangeError);
		expect(() => splitPrice(1000, 'eur', 1000)).toThrow(RangeError);
		expect(() => splitPrice(Number.MAX_SAFE_INTEGER, 'EUR', 1000)).toThrow(RangeError);
	});
});

describe('platformFeeBasisPoints', () => {
	afterEach(() => delete env.PLATFORM_FEE_PERCENT);

	it('is 10 % unless configured', () => {
		expect(platformFeeBasisPoints()).toBe(1000);
	});

	it('reads the percentage exactly, to two decimals', () => {
		env.PLATFORM_FEE_PERCENT = '12.5';
		expect(platformFeeBasisPoints()).toBe(1250);
		env.PLATFORM_FEE_PERCENT = '7.25';
		expect(platformFeeBasisPoints()).toBe(725);
		env.PLATFORM_FEE_PERCENT = '0';
		expect(platformFeeBasisPoints()).toBe(0);
	});

	it('falls back to the default for a value it cannot trust', () => {
		for (const bad of ['-5', 'ten', '12.345', '80', '1e1']) {
			env.PLATFORM_FEE_PERCENT = bad;
			expect(platformFeeBasisPoints(), bad).toBe(1000);
		}
	});
});

describe('rateText', () => {
	it('writes a rate as people read it', () => {
		expect(rateText(1000)).toBe('10 %');
		expect(rateText(1250)).toBe('12.5 %');
		expect(rateText(725)).toBe('7.25 %');
		expect(rateText(5)).toBe('0.05 %');
	});
});
