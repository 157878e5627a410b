import { describe, expect, it } from 'vitest';
import { amountInputValue, currencyChoices, parseAmount } from './amount-input';

describe('parseAmount', () => {
	it('reads whole and decimal amounts as minor units', () => {
		expect(parseAmount('35', 'EUR')).toEqual({ ok: true, minor: 3500 });
		expect(parseAmount('35.5', 'EUR')).toEqual({ ok: true, minor: 3550 });
		expect(parseAmount('35,05', 'EUR')).toEqual({ ok: true, minor: 3505 });
		expect(parseAmount(' 1 250.00 ', 'GBP')).toEqual({ ok: true, minor: 125000 });
		expect(parseAmount('0.07', 'USD')).toEqual({ ok: true, minor: 7 });
	});

	it('uses the ISO 4217 exponent of the currency', () => {
		// ISO 4217: JPY has no minor unit; KWD has three decimal places.
		expect(parseAmount('1200', 'JPY')).toEqual({ ok: true, minor: 1200 });
		expect(parseAmount('12.5', 'JPY')).toEqual({ ok: false, message: 'JPY has no decimals.' });
		expect(parseAmount('4.125', 'KWD')).toEqual({ ok: true, minor: 4125 });
		expect(parseAmount('4.125', 'EUR')).toEqual({ ok: false, message: 'Use at most 2 decimals for EUR.' });
	});

	it('refuses what is not an amount', () => {
		for (const typed of ['', 'abc', '-5', '1e3', '3.', '.5', '1.2.3']) {
			expect(parseAmount(typed, 'EUR').ok).toBe(false);
		}
		expect(parseAmount('10', 'XYZ').ok).toBe(false);
		expect(parseAmount('99999999999999999999', 'EUR')).toEqual({ ok: false, message: 'That amount is too large.' });
	});
});

describe('amountInputValue', () => {
	it('writes minor units back as a typed amount that parses to the same value', () => {
		expect(amountInputValue(3550, 'EUR')).toBe('35.50');
		expect(amountInputValue(7, 'USD')).toBe('0.07');
		expect(amountInputValue(1200, 'JPY')).toBe('1200');
		for (const [minor, currency] of [
			[3550, 'EUR'],
			[4125, 'KWD'],
			[1200, 'JPY']
		] as const) {
			expect(parseAmount(amountInputValue(minor, currency), currency)).toEqual({ ok: true, minor });
		}
	});
});

describe('currencyChoices', () => {
	it('lists ISO 4217 codes with names', () => {
		const choices = currencyChoices();
		expect(choices.find((c) => c.code === 'EUR')?.name).toBe('Euro');
		expect(choices.every((c) => /^[A-Z]{3}$/.test(c.code))).toBe(true);
	});
});
