import { describe, expect, it } from 'vitest';
import { createRequest, patchRequest, profileForm } from './schemas';

describe('createRequest', () => {
	it('reads values in the request’s unit into millimetres', () => {
		const parsed = createRequest.parse({ label: 'Me', unit: 'in', values: { hip_girth: 40.125 } });
		// 1 in = 25.4 mm exactly (international yard and pound agreement, 1959).
		expect(parsed.valuesMm.hip_girth).toBeCloseTo(1019.175, 9);
		expect(parsed).toMatchObject({ label: 'Me', unit: 'in', takenBy: 'self', takenAt: null, notes: '' });
	});

	it('names every unknown code and every impossible value', () => {
		const result = createRequest.safeParse({
			label: 'Me',
			unit: 'cm',
			values: { hip_girth: 100, chest: 90, waist: 70, waist_girth: -1 }
		});
		expect(result.success).toBe(false);
		const paths = result.error!.issues.map((issue) => issue.path.join('.'));
		expect(paths).toEqual(expect.arrayContaining(['values.chest', 'values.waist', 'values.waist_girth']));
		expect(paths).not.toContain('values.hip_girth');
	});

	it('refuses fields it does not know, a blank label and a day in the future', () => {
		expect(createRequest.safeParse({ label: 'Me', unit: 'cm', values: {}, colour: 'red' }).success).toBe(false);
		expect(createRequest.safeParse({ label: '   ', unit: 'cm' }).success).toBe(false);
		expect(createRequest.safeParse({ label: 'Me', unit: 'mm' }).success).toBe(false);
		expect(createRequest.safeParse({ label: 'Me', unit: 'cm', takenAt: '2999-01-01' }).success).toBe(false);
		const dated = createRequest.parse({ label: 'Me', unit: 'cm', takenAt: '2026-03-04' });
		expect(dated.takenAt?.toISOString()).toBe('2026-03-04T00:00:00.000Z');
	});
});

describe('patchRequest', () => {
	it('keeps only what is sent; null removes a measurement', () => {
		expect(patchRequest.parse({ label: 'Him' })).toEqual({ label: 'Him' });
		expect(patchRequest.parse({ values: { hip_girth: null, waist_girth: 70 } })).toEqual({
			valuesPatch: { hip_girth: null, waist_girth: 70 }
		});
		expect(patchRequest.parse({ takenAt: null })).toEqual({ takenAt: null });
	});

	it('refuses unknown codes and fields', () => {
		expect(patchRequest.safeParse({ values: { elbow: 3 } }).success).toBe(false);
		expect(patchRequest.safeParse({ owner: 'someone' }).success).toBe(false);
	});
});

describe('profileForm', () => {
	it('reads an empty date as none and the tick as a yes', () => {
		const parsed = profileForm.parse({
			label: 'Me',
			unit: 'cm',
			takenBy: 'tailor',
			takenAt: '',
			notes: '',
			confirmed: 'yes'
		});
		expect(parsed).toEqual({ label: 'Me', unit: 'cm', takenBy: 'tailor', takenAt: null, notes: '', confirmed: true });
	});
});
