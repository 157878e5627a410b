import { describe, expect, it } from 'vitest';
import { countAround, warningsFor } from './warnings';

describe('quote warnings', () => {
	const base = { dateNeeded: '2027-05-20', capacity: 2, ordersAround: 0, windowDays: 14 };

	it('warns when delivery comes after the date needed, and not on that date', () => {
		expect(warningsFor({ ...base, deliveryDate: '2027-05-21' }).map((w) => w.code)).toEqual(['after_date_needed']);
		expect(warningsFor({ ...base, deliveryDate: '2027-05-20' })).toEqual([]);
		expect(warningsFor({ ...base, dateNeeded: null, deliveryDate: '2027-09-01' })).toEqual([]);
	});

	it('warns when accepted orders around the date already fill the workroom', () => {
		const full = warningsFor({ ...base, deliveryDate: '2027-05-10', ordersAround: 2 });
		expect(full.map((w) => w.code)).toEqual(['capacity_full']);
		expect(full[0].message).toContain('2 accepted orders');
		expect(warningsFor({ ...base, deliveryDate: '2027-05-10', ordersAround: 1 })).toEqual([]);
	});

	it('gives both warnings at once', () => {
		expect(warningsFor({ ...base, deliveryDate: '2027-06-01', ordersAround: 3 }).map((w) => w.code)).toEqual([
			'after_date_needed',
			'capacity_full'
		]);
	});

	it('counts due dates within the window either side, ends included', () => {
		const due = ['2027-04-25', '2027-04-26', '2027-05-10', '2027-05-24', '2027-05-25'];
		expect(countAround(due, '2027-05-10', 14)).toBe(3);
		expect(countAround(due, 'not a date', 14)).toBe(0);
	});
});
