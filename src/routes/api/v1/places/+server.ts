import { json } from '@sveltejs/kit';
import { coarsen } from '$lib/geo/coarsen';
import { parseQuery } from '$lib/server/http/respond';
import * as places from '$lib/server/places';
import { placesQuery } from '$lib/server/places/schemas';
import type { RequestHandler } from './$types';

/** Towns by name (with an optional country), or the town nearest a point. Public, like the gazetteer. */
export const GET: RequestHandler = async ({ url, locals }) => {
	const parsed = parseQuery(url, placesQuery);
	if (!parsed.ok) return parsed.response;
	const { q, country, near, limit } = parsed.data;
	if (near) {
		const [lat, lng] = near;
		const place = await places.nearestPlace(locals.db, coarsen({ lat, lng }));
		return json({ items: place ? [place] : [] });
	}
	return json(
		{ items: await places.searchPlaces(locals.db, { q: q!, country, limit }) },
		{ headers: { 'cache-control': 'public, max-age=3600' } }
	);
};
