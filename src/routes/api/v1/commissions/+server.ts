import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { apiError, parseJsonBody, parseQuery } from '$lib/server/http/respond';
import * as search from '$lib/server/search';
import { json } from '@sveltejs/kit';
import { actorOf, answerWith, refused, withTownName } from './respond.server';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request, locals, getClientAddress }) => {
	const user = requireRole('customer');
	const parsed = await parseJsonBody(request, commissions.schemas.apiCreate);
	if (!parsed.ok) return parsed.response;
	const { garmentType, title, ...changes } = await withTownName(
		locals.db,
		commissions.schemas.changesFromApi(parsed.data)
	);
	try {
		const draft = await commissions.createDraft(locals.db, {
			actor: actorOf(user, getClientAddress()),
			changes: { ...changes, garmentType: garmentType!, title: title! }
		});
		return answerWith(locals.db, user, draft.id, 201);
	} catch (error) {
		return refused(error);
	}
};

/** Open commissions near the tailor (their workroom unless `near` is given), by distance or newest, keyset-paged. */
export const GET: RequestHandler = async ({ url, locals }) => {
	const user = requireRole('tailor');
	const parsed = parseQuery(url, search.schemas.nearbyCommissionsQuery);
	if (!parsed.ok) return parsed.response;
	const list = await search.browseForTailor(locals.db, { tailorId: user.id, query: parsed.data });
	if (!list.ok)
		return apiError(400, 'invalid_input', 'Your workroom has no place yet: pass near=LAT,LNG.', [
			{ path: 'near', message: 'Give a point, or set your workroom’s place first.' }
		]);
	return json(
		{
			items: list.items.map((item) => search.commissionItem(item, user.units)),
			nextCursor: list.nextCursor,
			near: list.origin.near,
			radiusKm: list.origin.radiusKm
		},
		{ headers: { 'x-search-source': list.source, 'cache-control': 'private, no-store' } }
	);
};
