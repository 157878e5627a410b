/** The near-me filters as they stand in a page's address and in its form: strings, empty when unset. */
export type CommissionFilters = {
	radiusKm: string;
	garment: string;
	budgetFrom: string;
	budgetTo: string;
	dateNeededBefore: string;
	fabricSource: string;
	q: string;
	sort: string;
	near: string;
};

export const filterNames = [
	'radiusKm',
	'garment',
	'budgetFrom',
	'budgetTo',
	'dateNeededBefore',
	'fabricSource',
	'q',
	'sort',
	'near'
] as const satisfies readonly (keyof CommissionFilters)[];

/** The page's own address for these filters (only those set), with a cursor when paging on. */
export function pageQuery(filters: CommissionFilters, cursor: string | null = null) {
	const params = new URLSearchParams();
	for (const name of filterNames) if (filters[name].trim()) params.set(name, filters[name].trim());
	if (cursor) params.set('cursor', cursor);
	return params;
}

/** Whole currency units typed on the page to the API's minor units (`12.50` € → 1250). */
function toMinor(amount: string, exponent: number): string | null {
	const value = Number(amount.trim().replace(',', '.'));
	if (!amount.trim() || !Number.isFinite(value) || value < 0) return null;
	return String(Math.round(value * 10 ** exponent));
}

/** The same filters as `GET /api/v1/commissions` reads them. */
export function apiQuery(filters: CommissionFilters, exponent: number, cursor: string | null = null) {
	const params = pageQuery(filters, cursor);
	params.delete('budgetFrom');
	params.delete('budgetTo');
	const min = toMinor(filters.budgetFrom, exponent);
	const max = toMinor(filters.budgetTo, exponent);
	if (min !== null) params.set('budgetMin', min);
	if (max !== null) params.set('budgetMax', max);
	return params;
}
