import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { n } from './svg';

/** What the drawings wrote before `n` skipped fractional number-to-text: the reference it must match. */
const reference = (value: number) => (Math.round(value * 10) / 10).toString();

describe('n (a drawing coordinate to a tenth)', () => {
	it('writes what Number#toString writes for the value rounded to a tenth', () => {
		for (const value of [0, -0, 0.04, -0.04, 0.05, -0.05, 0.15, -0.15, 7, -7, 12.34, -12.35, 999.95, 1e14, -1e14])
			expect(n(value)).toBe(reference(value));
		for (const odd of [NaN, Infinity, -Infinity, 1e300, -1e300]) expect(n(odd)).toBe(reference(odd));
		fc.assert(
			fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (value) => n(value) === reference(value)),
			{ numRuns: 20_000 }
		);
		fc.assert(
			fc.property(fc.double(), (value) => n(value) === reference(value)),
			{ numRuns: 20_000 }
		);
	});
});
