import { describe, expect, it } from 'vitest';
import { formatMoney, formatMoneyRange } from './money';

// Intl separates some parts with no-break or thin spaces; compare with plain spaces.
const plain = (text: string) => text.replace(/[\u00a0\u2009\u202f]/g, ' ');

describe('formatMoney', () => {
	it('drops the minor digits when the amount is whole', () => {
		expect(formatMoney(45000, 'EUR')).toBe('€450');
		expect(formatMoney(0, 'GBP')).toBe('£0');
	});

	it('shows every minor digit when the amount is not whole', () => {
		expect(formatMoney(6050, 'EUR')).toBe('€60.50');
		expect(formatMoney(6005, 'EUR')).toBe('€60.05');
		expect(formatMoney(-1999, 'USD')).toBe('-$19.99');
	});

	it('uses the ISO 4217 exponent of the currency', () => {
		// ISO 4217: JPY has no minor unit, KWD has three decimal places.
		expect(formatMoney(19500, 'JPY')).toBe('¥19,500');
		expect(plain(formatMoney(1234, 'KWD'))).toBe('KWD 1.234');
		expect(plain(formatMoney(1000, 'KWD'))).toBe('KWD 1');
	});

	it('formats large amounts exactly, without float rounding', () => {
		expect(formatMoney(900719925474099, 'EUR')).toBe('€9,007,199,254,740.99');
	});

	it('follows the locale when one is given', () => {
		expect(plain(formatMoney(123456, 'EUR', 'de'))).toBe('1.234,56 €');
	});

	it('refuses amounts that are not whole minor units', () => {
		expect(() => formatMoney(12.5, 'EUR')).toThrow(RangeError);
	});
});

describe('formatMoneyRange', () => {
	it('writes a whole-unit budget with an en dash', () => {
		expect(plain(formatMoneyRange(45000, 65000, 'EUR'))).toBe('€450 – €650');
		expect(plain(formatMoneyRange(6000, 9000, 'EUR'))).toBe('€60 – €90');
	});

	it('keeps minor digits on both ends when either end needs them', () => {
		expect(plain(formatMoneyRange(6000, 9050, 'EUR'))).toBe('€60.00 – €90.50');
	});

	it('shows one amount when both ends are the same', () => {
		expect(formatMoneyRange(45000, 45000, 'EUR')).toBe('€450');
	});
});
