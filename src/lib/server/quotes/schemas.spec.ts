import { describe, expect, it } from 'vitest';
import { quoteCreate, quoteForm, quotePatch } from './schemas';

function form(fields: Record<string, string>) {
	return quoteForm('EUR').safeParse({
		price: '85.50',
		deliveryDate: '2027-03-01',
		fittings: '2',
		message: 'Lined.',
		validUntil: '2027-02-01',
		...fields
	});
}

describe('the quote form', () => {
	it('reads a typed price in major units into minor units of the commission currency', () => {
		const parsed = form({ fabricIncluded: 'on' });
		expect(parsed.success && parsed.data).toEqual({
			priceMinor: 8550,
			currency: 'EUR',
			deliveryDate: '2027-03-01',
			fittings: 2,
			fabricIncluded: true,
			message: 'Lined.',
			validUntil: new Date('2027-02-01T23:59:59.999Z'),
			advanceMinor: 0
		});
		const unticked = form({});
		expect(unticked.success && unticked.data.fabricIncluded).toBe(false);
	});

	it('names the field that is wrong', () => {
		const paths = (fields: Record<string, string>) => {
			const parsed = form(fields);
			return parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'));
		};
		expect(paths({ price: '85.555' })).toEqual(['price']);
		expect(paths({ price: '0' })).toEqual(['price']);
		expect(paths({ price: '' })).toEqual(['price']);
		expect(paths({ fittings: '11' })).toEqual(['fittings']);
		expect(paths({ fittings: '1.5' })).toEqual(['fittings']);
		expect(paths({ validUntil: '2027-02-30' })).toEqual(['validUntil']);
		expect(paths({ message: 'x'.repeat(4001) })).toEqual(['message']);
	});
});

describe('the API bodies', () => {
	const body = {
		priceMinor: 8550,
		currency: 'eur',
		deliveryDate: '2027-03-01',
		fittings: 0,
		fabricIncluded: false,
		validUntil: '2027-02-01T18:00:00+01:00'
	};

	it('accepts a moment with its offset or a plain date for validUntil, and upper-cases the currency', () => {
		const parsed = quoteCreate.parse(body);
		expect(parsed.currency).toBe('EUR');
		expect(parsed.message).toBe('');
		expect(parsed.validUntil).toEqual(new Date('2027-02-01T17:00:00Z'));
		expect(quoteCreate.parse({ ...body, validUntil: '2027-02-01' }).validUntil).toEqual(
			new Date('2027-02-01T23:59:59.999Z')
		);
	});

	it('refuses unknown fields and an empty change', () => {
		expect(quoteCreate.safeParse({ ...body, discount: 5 }).success).toBe(false);
		expect(quotePatch.safeParse({}).success).toBe(false);
		expect(quotePatch.safeParse({ status: 'accepted' }).success).toBe(false);
		expect(quotePatch.parse({ fittings: 3 })).toEqual({ fittings: 3 });
	});
});

describe('the fabric advance', () => {
	const body = {
		priceMinor: 20_000,
		currency: 'EUR',
		deliveryDate: '2027-03-01',
		fittings: 1,
		fabricIncluded: true,
		validUntil: '2027-02-01'
	};
	const issues = (parsed: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
		parsed.success ? [] : parsed.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);

	it('is none unless asked for, and at most 30 % of the price when the tailor sources the fabric', () => {
		expect(quoteCreate.parse(body).advanceMinor).toBe(0);
		expect(quoteCreate.parse({ ...body, advanceMinor: 6_000 }).advanceMinor).toBe(6_000);
		expect(issues(quoteCreate.safeParse({ ...body, advanceMinor: 6_001 }))).toEqual([
			'advanceMinor: The advance can be at most 30 % of the price: €60 here.'
		]);
		expect(issues(quoteCreate.safeParse({ ...body, fabricIncluded: false, advanceMinor: 100 }))).toEqual([
			'advanceMinor: An advance for materials is possible only when you source the fabric (fabric included in the price).'
		]);
		expect(quoteCreate.safeParse({ ...body, fabricIncluded: false, advanceMinor: 0 }).success).toBe(true);
	});

	it('checks a change when the change carries what the rule needs, and leaves the rest to the quote’s terms', () => {
		expect(issues(quotePatch.safeParse({ fabricIncluded: false, advanceMinor: 100 }))).toHaveLength(1);
		expect(
			issues(quotePatch.safeParse({ priceMinor: 1_000, currency: 'EUR', fabricIncluded: true, advanceMinor: 301 }))
		).toHaveLength(1);
		expect(quotePatch.parse({ advanceMinor: 500 })).toEqual({ advanceMinor: 500 });
		expect(quotePatch.safeParse({ advanceMinor: -1 }).success).toBe(false);
	});

	it('is typed in the form in major units, shown only with the fabric included', () => {
		const parsed = form({ fabricIncluded: 'on', advance: '25.65' });
		expect(parsed.success && parsed.data.advanceMinor).toBe(2_565);
		const over = form({ fabricIncluded: 'on', advance: '25.66' });
		expect(over.success ? [] : over.error.issues.map((i) => i.path.join('.'))).toEqual(['advance']);
		const hidden = form({ advance: '25' });
		expect(hidden.success && hidden.data.advanceMinor).toBe(0);
		const typo = form({ fabricIncluded: 'on', advance: 'twenty' });
		expect(typo.success ? [] : typo.error.issues.map((i) => i.path.join('.'))).toEqual(['advance']);
	});
});
