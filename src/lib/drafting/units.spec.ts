import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	formatCentimetres,
	formatFabricLength,
	formatInches,
	formatLength,
	fromMm,
	parseLength,
	parseLengths,
	retypeLengths,
	roundUpFabric,
	toMm,
	toUnitValue
} from './units';

function parsedMm(text: string, unit: 'in' | 'cm'): number {
	const parsed = parseLength(text, unit);
	if (!parsed.ok) throw new Error(parsed.message);
	return parsed.mm;
}

describe('exact conversion constants', () => {
	// International Yard and Pound Agreement (1959): 1 in = 25.4 mm, 1 yd = 0.9144 m exactly.
	it('converts inches and yards exactly', () => {
		expect(toMm(1, 'in')).toBe(25.4);
		expect(toMm(36, 'in')).toBeCloseTo(914.4, 10);
		expect(toMm(1 / 8, 'in')).toBe(3.175);
		expect(toMm(5 / 8, 'in')).toBe(15.875);
		expect(fromMm(25.4, 'cm')).toBe(2.54);
		expect(fromMm(1000, 'in')).toBeCloseTo(39.3700787, 6);
	});
});

describe('parseLength', () => {
	it('reads decimals, mixed fractions and vulgar fractions as the same length', () => {
		const expected = 10.25 * 25.4;
		for (const text of ['10.25', '10 1/4', '10-1/4', '10¼', '10 ¼', ' 10 1/4 in', '10.25"', '10,25']) {
			expect(parsedMm(text, 'in'), text).toBeCloseTo(expected, 9);
		}
	});

	it('lets a unit suffix override the field unit', () => {
		expect(parsedMm('26 cm', 'in')).toBe(260);
		expect(parsedMm('10 in', 'cm')).toBeCloseTo(254, 9);
		expect(parsedMm('260 mm', 'in')).toBe(260);
		expect(parsedMm('26,5', 'cm')).toBe(265);
	});

	it('reads a bare fraction and every eighth', () => {
		expect(parsedMm('3/8', 'in')).toBeCloseTo(9.525, 9);
		expect(parsedMm('⅞', 'in')).toBeCloseTo(22.225, 9);
		expect(parsedMm('40 ⅝', 'in')).toBeCloseTo(40.625 * 25.4, 9);
	});

	it('refuses text that is not a length', () => {
		for (const text of ['', 'abc', '10 5/4', '1/0', '-3', '10 1/4 1/8', '12 feet']) {
			expect(parseLength(text, 'in').ok, text).toBe(false);
		}
	});
});

describe('formatting', () => {
	it('shows inches to the nearest eighth as a fraction', () => {
		expect(formatInches(10.375 * 25.4)).toBe('10 3/8');
		expect(formatInches(10.5 * 25.4)).toBe('10 1/2');
		expect(formatInches(0.375 * 25.4)).toBe('3/8');
		expect(formatInches(11 * 25.4)).toBe('11');
		expect(formatInches(10.99 * 25.4)).toBe('11');
		// ASTM D5585-11e1 Table 1 writes misses body sizes in eighths, e.g. 40 3/8 and 31 1/8.
		expect(formatInches(40.375 * 25.4)).toBe('40 3/8');
		expect(formatInches(31.125 * 25.4)).toBe('31 1/8');
	});

	it('shows centimetres to one decimal without a trailing zero', () => {
		expect(formatCentimetres(265)).toBe('26.5');
		expect(formatCentimetres(260)).toBe('26');
		expect(formatCentimetres(254)).toBe('25.4');
		expect(formatLength(254, 'cm', { withUnit: true })).toBe('25.4 cm');
		expect(formatLength(254, 'in', { withUnit: true })).toBe('10 in');
	});

	it('rounds API values to a thousandth of an inch or a hundredth of a centimetre', () => {
		expect(toUnitValue(1016 / 4, 'in')).toBe(10);
		expect(toUnitValue(9.525, 'in')).toBe(0.375);
		expect(toUnitValue(123.456, 'cm')).toBe(12.35);
	});
});

describe('fabric rounding', () => {
	// Buying steps (common practice): 1/8 yd where fabric is sold by the yard, 0.1 m where sold by the metre.
	it('rounds up to the next eighth of a yard', () => {
		expect(roundUpFabric(914.4, 'yd').value).toBe(1);
		expect(roundUpFabric(914.5, 'yd').value).toBe(1.125);
		expect(roundUpFabric(2.6 * 914.4, 'yd').value).toBe(2.625);
		expect(formatFabricLength(2.625, 'yd')).toBe('2 5/8 yd');
	});

	it('rounds up to the next tenth of a metre', () => {
		expect(roundUpFabric(1500, 'm').value).toBe(1.5);
		expect(roundUpFabric(1501, 'm').value).toBe(1.6);
		expect(formatFabricLength(1.6, 'm')).toBe('1.6 m');
	});
});

describe('round trips (property)', () => {
	it('mm → unit → mm returns the same length', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 0.1, max: 5000, noNaN: true }),
				fc.constantFrom('in' as const, 'cm' as const),
				(mm, unit) => {
					expect(toMm(fromMm(mm, unit), unit)).toBeCloseTo(mm, 9);
				}
			)
		);
	});

	it('any whole number of eighths displays and parses back exactly', () => {
		fc.assert(
			fc.property(fc.integer({ min: 1, max: 8 * 120 }), (eighths) => {
				const mm = (eighths / 8) * 25.4;
				expect(parsedMm(formatInches(mm), 'in')).toBeCloseTo(mm, 9);
			})
		);
	});

	it('any whole number of millimetres displays in cm and parses back exactly', () => {
		fc.assert(
			fc.property(fc.integer({ min: 1, max: 3000 }), (mm) => {
				expect(parsedMm(formatCentimetres(mm), 'cm')).toBeCloseTo(mm, 9);
			})
		);
	});

	it('display is never more than half an eighth away from the true length', () => {
		fc.assert(
			fc.property(fc.double({ min: 0, max: 3000, noNaN: true }), (mm) => {
				expect(Math.abs(parsedMmOrZero(formatInches(mm)) - mm)).toBeLessThanOrEqual(3.175 / 2 + 1e-9);
			})
		);
	});
});

function parsedMmOrZero(text: string): number {
	return text === '0' ? 0 : parsedMm(text, 'in');
}

describe('parseLengths and retypeLengths', () => {
	it('reads the three ways of writing 10 3/8 in alike and names what it cannot read', () => {
		const parsed = parseLengths({ a: '10 3/8', b: '10⅜', c: '10.375', d: 'ten', e: '  ' }, 'in');
		// 10.375 in × 25.4 mm/in = 263.525 mm (1 in = 25.4 mm exactly).
		for (const key of ['a', 'b', 'c']) expect(parsed.mm[key], key).toBeCloseTo(263.525, 9);
		expect(Object.keys(parsed.problems)).toEqual(['d']);
		expect(parsed.mm.e).toBeUndefined();
	});

	it('rewrites readable entries in the other unit and leaves the rest as typed', () => {
		const texts = { hip: '40', waist: '28 1/2', odd: 'ten' };
		const inCm = retypeLengths(texts, parseLengths(texts, 'in'), 'cm');
		// 40 in = 101.6 cm; 28.5 in = 72.39 cm, shown to one decimal.
		expect(inCm).toEqual({ hip: '101.6', waist: '72.4', odd: 'ten' });
	});
});
