import { minorUnitExponent } from '$lib/drafting';
import { apiQuery, filterNames, type CommissionFilters } from '$lib/components/search/query';
import { requireRole } from '$lib/server/auth/guard';
import { parseQuery } from '$lib/server/http/respond';
import * as search from '$lib/server/search';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

type Issue = { path: string; message: string };

/**
 * The tailor's open commissions near them. The filters are a plain GET form (so the page works without
 * JavaScript); with it, the page asks `GET /api/v1/commissions` with the same query as filters change.
 */
export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireRole('tailor');
	const own = await workrooms.listOrigin(locals.db, { tailorId: user.id });
	const currency = own?.currency ?? 'EUR';
	const exponent = minorUnitExponent(currency);
	const filters = Object.fromEntries(
		filterNames.map((name) => [name, (url.searchParams.get(name) ?? '').slice(0, 200)])
	) as CommissionFilters;
	const cursor = url.searchParams.get('cursor');

	let query = new URL(`http://page.invalid/?${apiQuery(filters, exponent, cursor).toString()}`);
	let parsed = parseQuery(query, search.schemas.nearbyCommissionsQuery);
	let issues: Issue[] = [];
	if (!parsed.ok) {
		// Show what could not be read, and the list without those filters.
		const body = (await parsed.response.json()) as { error: { issues: Issue[] } };
		issues = body.error.issues;
		for (const issue of issues) query.searchParams.delete(issue.path);
		query = new URL(query);
		parsed = parseQuery(query, search.schemas.nearbyCommissionsQuery);
	}
	const list = parsed.ok
		? await search.browseForTailor(locals.db, { tailorId: user.id, query: parsed.data, workroom: own })
		: null;
	return {
		filters,
		issues,
		currency,
		exponent,
		paged: Boolean(cursor) && !issues.some((issue) => issue.path === 'cursor'),
		hasPlace: Boolean(list?.ok),
		origin: list?.ok
			? { radiusKm: list.origin.radiusKm, fromWorkroom: list.origin.fromWorkroom, town: list.origin.town }
			: null,
		items: list?.ok ? list.items.map((item) => search.commissionItem(item, user.units)) : [],
		nextCursor: list?.ok ? list.nextCursor : null
	};
};
