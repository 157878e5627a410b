import { describe, expect, it } from 'vitest';
import { apiQuery, pageQuery, type CommissionFilters } from './query';

const none: CommissionFilters = {
	radiusKm: '',
	garment: '',
	budgetFrom: '',
	budgetTo: '',
	dateNeededBefore: '',
	fabricSource: '',
	q: '',
	sort: '',
	near: ''
};

describe('near-me filter addresses', () => {
	it('keeps only the filters that are set', () => {
		expect(pageQuery({ ...none, garment: 'tunic', q: ' linen ' }).toString()).toBe('garment=tunic&q=linen');
		expect(pageQuery(none, 'abc').toString()).toBe('cursor=abc');
	});

	it('turns whole currency amounts into minor units for the API', () => {
		const query = apiQuery({ ...none, budgetFrom: '80', budgetTo: '120,50' }, 2);
		expect(query.get('budgetMin')).toBe('8000');
		expect(query.get('budgetMax')).toBe('12050');
		expect(query.has('budgetFrom')).toBe(false);
		expect(apiQuery({ ...none, budgetFrom: '5000' }, 0).get('budgetMin')).toBe('5000');
	});

	it('leaves out an amount that is not one', () => {
		expect(apiQuery({ ...none, budgetFrom: 'lots' }, 2).has('budgetMin')).toBe(false);
	});
});
