import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { coarsen } from '$lib/geo/coarsen';
import { parseQuery } from '$lib/server/http/respond';
import * as places from '$lib/server/places';
import type { RequestHandler } from './$types';

const query = z
	.object({
		q: z.string().trim().min(1, 'Type at least one letter.').max(100).optional(),
		country: z
			.string()
			.trim()
			.toUpperCase()
			.regex(/^[A-Z]{2}$/, 'A country is its two-letter ISO 3166-1 code.')
			.optional(),
		near: z
			.string()
			.regex(/^-?\d{1,2}(\.\d+)?,-?\d{1,3}(\.\d+)?$/, 'near is "latitude,longitude" in decimal degrees.')
			.transform((text) => text.split(',').map(Number) as [number, number])
			.refine(([lat, lng]) => Math.abs(lat) <= 90 && Math.abs(lng) <= 180, 'near is outside the earth.')
			.optional(),
		limit: z.coerce.number().int().min(1).max(20).default(8)
	})
	.refine((v) => v.q !== undefined || v.near !== undefined, { message: 'Give q (a name) or near (a point).' });

/** Towns by name (with an optional country), or the town nearest a point. Public, like the gazetteer. */
export const GET: RequestHandler = async ({ url, locals }) => {
	const parsed = parseQuery(url, query);
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
