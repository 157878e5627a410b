import { z } from 'zod';

/** `GET /api/v1/places`: towns by name (optionally in one country), or the town nearest a point. */
export const placesQuery = z
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
			.optional()
			.meta({ description: '`latitude,longitude` in decimal degrees.' }),
		limit: z.coerce.number().int().min(1).max(20).default(8)
	})
	.refine((v) => v.q !== undefined || v.near !== undefined, { message: 'Give q (a name) or near (a point).' });

export const placeResponse = z
	.object({
		id: z.string().meta({ description: '`geonames:<id>` or `local:<id>`; what `location.placeId` takes.' }),
		name: z.string(),
		admin: z.string().meta({ description: 'The town of a district, or the region code.' }),
		country: z.string().length(2),
		lat: z.number(),
		lng: z.number(),
		population: z.int()
	})
	.meta({ id: 'Place' });

export const placeListResponse = z.object({ items: z.array(placeResponse) });
