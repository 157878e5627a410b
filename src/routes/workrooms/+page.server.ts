import { z } from 'zod';
import { garmentIds } from '$lib/drafting';
import * as commissions from '$lib/server/commissions';
import { text } from '$lib/server/forms';
import { parseQuery } from '$lib/server/http/respond';
import { countries } from '$lib/server/places';
import { placeFields, placeFromPoint, resolveFormPlace } from '$lib/server/places/form';
import * as search from '$lib/server/search';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

// A filter that does not parse is dropped rather than refused: the directory still shows.
const filters = z.object({
	town: text({ min: 1, max: 120 }).optional().catch(undefined),
	garment: z.enum(garmentIds).optional().catch(undefined),
	after: z
		.string()
		.regex(/^[a-z0-9-]{1,80}$/)
		.optional()
		.catch(undefined)
});

type Point = { lat: number; lng: number };

/** Where to search from: a place typed or chosen, a point in the address, or the customer's own place. */
async function origin(
	db: App.Locals['db'],
	url: URL,
	user: App.Locals['user']
): Promise<{ point: Point | null; message: string | null }> {
	const fields = placeFields.safeParse(Object.fromEntries(url.searchParams));
	if (fields.success && (fields.data.place_query || fields.data.place_id)) {
		const place = await resolveFormPlace(db, fields.data);
		return place.ok ? { point: place.place, message: null } : { point: null, message: place.message };
	}
	// A place typed or chosen wins over the point the list was centred on before.
	const near = search.schemas.nearParam.safeParse(url.searchParams.get('near') ?? undefined);
	if (near.success) return { point: near.data, message: null };
	if (user?.role === 'customer' && url.searchParams.get('all') !== '1') {
		const own = await commissions.searchDocuments.latestPlaceOf(db, user.id);
		if (own) return { point: own, message: null };
	}
	return { point: null, message: null };
}

export const load: PageServerLoad = async ({ locals, url }) => {
	const [from, places] = await Promise.all([origin(locals.db, url, locals.user), countries(locals.db)]);
	if (from.point) {
		const query = new URL(url);
		query.searchParams.set('near', `${from.point.lat},${from.point.lng}`);
		for (const key of ['place_id', 'place_query', 'place_country', 'place_lat', 'place_lng', 'all', 'town', 'after'])
			query.searchParams.delete(key);
		for (const [key, value] of [...query.searchParams]) if (!value) query.searchParams.delete(key);
		let parsed = parseQuery(query, search.schemas.nearbyWorkroomsQuery);
		const problems: string[] = [];
		if (!parsed.ok) {
			const body = (await parsed.response.json()) as { error: { issues: { path: string; message: string }[] } };
			for (const issue of body.error.issues) {
				problems.push(issue.message);
				query.searchParams.delete(issue.path);
			}
			parsed = parseQuery(query, search.schemas.nearbyWorkroomsQuery);
		}
		if (parsed.ok) {
			const { near, radiusKm, garment, q, cursor, limit } = parsed.data;
			const [list, named] = await Promise.all([
				search.nearbyWorkrooms(locals.db, { near, radiusKm, filters: { specialty: garment, q }, after: cursor, limit }),
				placeFromPoint(locals.db, near)
			]);
			return {
				mode: 'near' as const,
				near: `${near.lat},${near.lng}`,
				placeName: named.ok ? named.place.name : null,
				radiusKm,
				garment: garment ?? '',
				q: q ?? '',
				items: list.items.map(search.workroomItem),
				nextCursor: list.nextCursor,
				paged: Boolean(cursor),
				problems,
				countries: places
			};
		}
	}
	const { town, garment, after } = filters.parse(Object.fromEntries(url.searchParams));
	const [page, towns] = await Promise.all([
		workrooms.listDirectory(locals.db, { town, specialty: garment, after }),
		workrooms.listTowns(locals.db)
	]);
	return {
		mode: 'directory' as const,
		...page,
		towns,
		countries: places,
		placeMessage: from.message,
		filters: { town: town ?? '', garment: garment ?? '' },
		paged: Boolean(after)
	};
};
