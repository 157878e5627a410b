import { describe, expect, it } from 'vitest';
import { formatSizeBand } from './size-band';

describe('formatSizeBand', () => {
	const band = [
		{ dimension: 'bust_girth', lowerMm: 860, upperMm: 900 },
		{ dimension: 'hip_girth', lowerMm: 940, upperMm: 980 }
	];

	it('names each dimension with its range in centimetres', () => {
		expect(formatSizeBand(band, 'cm')).toBe('bust 86–90 cm, hip 94–98 cm');
	});

	it('gives inches to the eighth for a reader who works in inches', () => {
		// 86 cm = 33.858 in, to the nearest eighth 33 7/8; 90 cm = 35.433 in → 35 3/8 (1 in = 25.4 mm exactly).
		expect(formatSizeBand(band.slice(0, 1), 'in')).toBe('bust 33 7/8–35 3/8 in');
	});

	it('is empty for a commission without a band', () => {
		expect(formatSizeBand([], 'cm')).toBe('');
	});
});
