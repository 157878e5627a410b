import { json } from '@sveltejs/kit';
import { parseQuery } from '$lib/server/http/respond';
import * as search from '$lib/server/search';
import type { RequestHandler } from './$types';

/** Workrooms taking work near a point, nearest first; public, as each workroom's own page is. */
export const GET: RequestHandler = async ({ url, locals }) => {
	const parsed = parseQuery(url, search.schemas.nearbyWorkroomsQuery);
	if (!parsed.ok) return parsed.response;
	const { near, radiusKm, garment, q, cursor, limit } = parsed.data;
	const list = await search.nearbyWorkrooms(locals.db, {
		near,
		radiusKm,
		filters: { specialty: garment, q },
		after: cursor,
		limit
	});
	return json(
		{ items: list.items.map(search.workroomItem), nextCursor: list.nextCursor },
		{ headers: { 'x-search-source': list.source } }
	);
};
