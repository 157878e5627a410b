import { describe, expect, it } from 'vitest';
import { leadTimeWarning, todayIn } from './lead-times';
import { amountForInput, budgetForm, garmentForm } from './schemas';

const budget = (fields: Record<string, string>) =>
	budgetForm.safeParse({ currency: 'EUR', budgetMin: '100', budgetMax: '200', dateNeeded: '2027-03-01', ...fields });

describe('budget form', () => {
	// Minor-unit exponents from ISO 4217: EUR 2, JPY 0, BHD 3.
	it('converts typed amounts with the currency’s own number of decimals', () => {
		expect(budget({ budgetMin: '60.50', budgetMax: '1,250' }).data).toMatchObject({
			budgetMinMinor: 6050,
			budgetMaxMinor: 125000
		});
		expect(budget({ currency: 'jpy', budgetMin: '12000', budgetMax: '19500' }).data).toMatchObject({
			currency: 'JPY',
			budgetMinMinor: 12000,
			budgetMaxMinor: 19500
		});
		expect(budget({ currency: 'BHD', budgetMin: '1.250', budgetMax: '2' }).data).toMatchObject({
			budgetMinMinor: 1250,
			budgetMaxMinor: 2000
		});
	});

	it('refuses too many decimals, a reversed range, an unknown currency and a date that does not exist', () => {
		expect(budget({ currency: 'JPY', budgetMin: '100.5' }).error?.issues[0]).toMatchObject({ path: ['budgetMin'] });
		expect(budget({ budgetMin: '300' }).error?.issues[0].message).toBe(
			'The lowest amount must not be above the highest.'
		);
		expect(budget({ currency: 'XYZ' }).success).toBe(false);
		expect(budget({ dateNeeded: '2027-02-30' }).success).toBe(false);
	});

	it('shows stored amounts back as they would be typed', () => {
		expect(amountForInput(6050, 'EUR')).toBe('60.50');
		expect(amountForInput(45000, 'EUR')).toBe('450');
		expect(amountForInput(19500, 'JPY')).toBe('19500');
		expect(amountForInput(null, 'EUR')).toBe('');
	});
});

describe('garment form', () => {
	it('asks what the garment is when it is something else', () => {
		const parsed = garmentForm.safeParse({ garment: 'other', garmentOther: '', title: 'Waistcoat', styleNotes: '' });
		expect(parsed.error?.issues[0]).toMatchObject({ path: ['garmentOther'] });
	});
});

describe('lead time', () => {
	it('warns, without refusing, when the date is tighter than the usual time for the garment', () => {
		expect(leadTimeWarning('shift-dress', '2027-01-10', '2027-01-01')).toMatch(
			/9 days away; tailors usually need about 21 days/
		);
		expect(leadTimeWarning('shift-dress', '2027-02-10', '2027-01-01')).toBeNull();
	});

	it('reads today in the customer’s time zone', () => {
		const lateEvening = new Date('2027-01-01T23:30:00Z');
		expect(todayIn('Asia/Tokyo', lateEvening)).toBe('2027-01-02');
		expect(todayIn('America/Los_Angeles', lateEvening)).toBe('2027-01-01');
	});
});
