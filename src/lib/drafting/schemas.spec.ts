import { describe, expect, it } from 'vitest';
import { draftRequestSchema, layoutRequestSchema, quoteRequestSchema } from './schemas';

const paths = (result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[] }> } }) =>
	result.error?.issues.map((i) => i.path.join('.')) ?? [];

describe('draftRequestSchema', () => {
	const valid = { garment: 'cropped-top', unit: 'in', measurements: { bust_girth: 36 } };
	it('accepts a minimal request and fills defaults', () => {
		const parsed = draftRequestSchema.parse(valid);
		expect(parsed.options).toEqual({});
	});
	it('names each bad field', () => {
		expect(paths(draftRequestSchema.safeParse({ ...valid, garment: 'cape' }))).toEqual(['garment']);
		expect(paths(draftRequestSchema.safeParse({ ...valid, unit: 'mm' }))).toEqual(['unit']);
		expect(paths(draftRequestSchema.safeParse({ ...valid, measurements: { bust_girth: -3 } }))).toEqual([
			'measurements.bust_girth'
		]);
		expect(paths(draftRequestSchema.safeParse({ ...valid, measurements: { chest: 36 } }))).toEqual(['measurements']);
		expect(paths(draftRequestSchema.safeParse({ ...valid, options: { fit: 'baggy' } }))).toEqual(['options.fit']);
		expect(paths(draftRequestSchema.safeParse({ ...valid, options: { length: 2 } }))).toEqual(['options.length']);
		expect(paths(draftRequestSchema.safeParse({ ...valid, fabric: { width: 0 } }))).toEqual(['fabric.width']);
		expect(paths(draftRequestSchema.safeParse({ ...valid, extra: 1 }))).toEqual(['']);
	});
	it('checks length options in the request’s unit', () => {
		expect(draftRequestSchema.safeParse({ ...valid, options: { length: 18 } }).success).toBe(true);
		expect(
			draftRequestSchema.safeParse({ ...valid, unit: 'cm', measurements: { bust_girth: 90 }, options: { length: 18 } })
				.success
		).toBe(false);
		expect(
			draftRequestSchema.safeParse({
				...valid,
				unit: 'cm',
				measurements: { bust_girth: 90 },
				options: { length: 45.72 }
			}).success
		).toBe(true);
	});
});

describe('layoutRequestSchema', () => {
	it('refuses a piece wider than the fabric unless it may turn', () => {
		expect(paths(layoutRequestSchema.safeParse({ width: 10, unit: 'cm', pieces: [{ w: 12, h: 5 }] }))).toEqual([
			'pieces.0.w'
		]);
		expect(
			layoutRequestSchema.safeParse({ width: 10, unit: 'cm', pieces: [{ w: 12, h: 5, rotate: 'any' }] }).success
		).toBe(true);
		expect(paths(layoutRequestSchema.safeParse({ width: 10, unit: 'cm', pieces: [] }))).toEqual(['pieces']);
		expect(
			paths(layoutRequestSchema.safeParse({ width: 10, unit: 'cm', pieces: [{ w: 1, h: 1, quantity: 1.5 }] }))
		).toEqual(['pieces.0.quantity']);
	});
});

describe('quoteRequestSchema', () => {
	const valid = { currency: 'KES', garment: 'tunic', fabric: { supply: 'customer' }, hourlyRateMinor: 50000 };
	it('accepts integer minor units and a known currency', () => {
		expect(quoteRequestSchema.safeParse(valid).success).toBe(true);
	});
	it('refuses floats for money, unknown currencies and a missing labour source', () => {
		expect(paths(quoteRequestSchema.safeParse({ ...valid, hourlyRateMinor: 12.5 }))).toEqual(['hourlyRateMinor']);
		expect(paths(quoteRequestSchema.safeParse({ ...valid, currency: 'XYZ' }))).toEqual(['currency']);
		expect(paths(quoteRequestSchema.safeParse({ ...valid, garment: undefined }))).toEqual(['labourHours']);
		expect(
			paths(quoteRequestSchema.safeParse({ ...valid, fabric: { supply: 'tailor', per: 'yd', length: 2 } }))
		).toEqual(['fabric.pricePerUnitMinor']);
	});
});

describe('caps against oversized requests', () => {
	it('refuses more pieces than a garment needs, and cloth or pieces beyond any bolt', () => {
		const tiny = { w: 0.1, h: 0.1, rotate: 'any' };
		expect(paths(layoutRequestSchema.safeParse({ width: 150, unit: 'cm', pieces: Array(1000).fill(tiny) }))).toEqual([
			'pieces'
		]);
		expect(
			paths(layoutRequestSchema.safeParse({ width: 150, unit: 'cm', pieces: [{ ...tiny, quantity: 101 }] }))
		).toEqual(['pieces.0.quantity', 'pieces']);
		expect(paths(layoutRequestSchema.safeParse({ width: 400, unit: 'cm', pieces: [tiny] }))).toEqual(['width']);
		expect(paths(layoutRequestSchema.safeParse({ width: 60, unit: 'in', pieces: [{ w: 20, h: 200 }] }))).toEqual([
			'pieces.0.h'
		]);
		expect(
			layoutRequestSchema.safeParse({ width: 60, unit: 'in', pieces: [{ w: 20, h: 100, quantity: 100 }] }).success
		).toBe(true);
	});
	it('caps the cloth of a draft the same way', () => {
		const request = { garment: 'cropped-top', unit: 'cm', measurements: { bust_girth: 90 } };
		expect(paths(draftRequestSchema.safeParse({ ...request, fabric: { width: 1000 } }))).toEqual(['fabric.width']);
		expect(paths(draftRequestSchema.safeParse({ ...request, fabric: { width: 150, repeat: 500 } }))).toEqual([
			'fabric.repeat'
		]);
	});
});
