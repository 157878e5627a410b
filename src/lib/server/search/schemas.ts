import { z } from 'zod';
import { garmentIds } from '$lib/drafting';
import { decodeCursor } from './cursor';

/** Farthest a near-me list reaches, in kilometres. */
export const maxRadiusKm = 200;
export const defaultPageSize = 20;
export const maxPageSize = 50;

/** `near=LAT,LNG` in decimal degrees. */
export const nearParam = z
	.string()
	.trim()
	.regex(/^-?\d{1,2}(\.\d+)?,\s*-?\d{1,3}(\.\d+)?$/, 'Give a point as latitude,longitude, such as 51.5,-0.12.')
	.transform((value) => {
		const [lat, lng] = value.split(',').map(Number);
		return { lat, lng };
	})
	.refine(({ lat, lng }) => Math.abs(lat) <= 90 && Math.abs(lng) <= 180, 'Latitude runs to ±90, longitude to ±180.');

const radiusKm = z.coerce
	.number({ error: 'Give the radius in kilometres.' })
	.positive('The radius must be more than 0 km.')
	.max(maxRadiusKm, `The radius can be at most ${maxRadiusKm} km.`)
	.transform((km) => Math.round(km * 10) / 10);

const cursor = z
	.string()
	.max(200)
	.transform((value, context) => {
		const key = decodeCursor(value);
		if (!key) {
			context.addIssue({ code: 'custom', message: 'This cursor is not one a list gave out.' });
			return z.NEVER;
		}
		return key;
	});

const limit = z.coerce
	.number()
	.int('The limit is a whole number.')
	.min(1, 'The limit is at least 1.')
	.max(maxPageSize, `The limit is at most ${maxPageSize}.`)
	.default(defaultPageSize);

const words = z
	.string()
	.trim()
	.max(100, 'Search with at most 100 characters.')
	.transform((value) => value || undefined);

const amountMinor = z.coerce
	.number({ error: 'Give an amount in minor units (pence, cents).' })
	.int('Give an amount in minor units (pence, cents).')
	.nonnegative('Amounts are not negative.')
	.max(100_000_000);

const isoDate = z.iso.date('Give a date as YYYY-MM-DD.');

/** Query parameters of `GET /api/v1/commissions` (a tailor's open commissions near them). */
export const nearbyCommissionsQuery = z
	.object({
		near: nearParam.optional().meta({ description: 'LAT,LNG to search around; the workroom’s place when left out.' }),
		radiusKm: radiusKm
			.optional()
			.meta({ description: 'How far to reach, in km; the workroom’s service radius when left out.' }),
		garment: z.enum([...garmentIds, 'other'], { error: 'Choose a garment from the list.' }).optional(),
		budgetMin: amountMinor.optional().meta({ description: 'Only budgets reaching at least this, in minor units.' }),
		budgetMax: amountMinor.optional().meta({ description: 'Only budgets starting at most at this, in minor units.' }),
		dateNeededBefore: isoDate.optional().meta({ description: 'Only commissions needed by this day (YYYY-MM-DD).' }),
		fabricSource: z
			.enum(['customer_supplies', 'tailor_sources'], { error: 'Fabric is customer_supplies or tailor_sources.' })
			.optional(),
		q: words.optional(),
		sort: z.enum(['distance', 'newest'], { error: 'Sort by distance or newest.' }).default('distance'),
		cursor: cursor.optional(),
		limit
	})

	.refine(
		(query) => query.budgetMin === undefined || query.budgetMax === undefined || query.budgetMin <= query.budgetMax,
		{
			path: ['budgetMax'],
			message: 'The highest budget must not be below the lowest.'
		}
	)
	.refine((query) => !query.cursor || 'distanceM' in query.cursor === (query.sort === 'distance'), {
		path: ['cursor'],
		message: 'This cursor belongs to a list in another order.'
	});
export type NearbyCommissionsQuery = z.output<typeof nearbyCommissionsQuery>;

/** Query parameters of `GET /api/v1/tailors` (workrooms near a point). */
export const nearbyWorkroomsQuery = z.object({
	near: nearParam.meta({ description: 'LAT,LNG to search around.' }),
	radiusKm: radiusKm.default(25).meta({ description: 'How far to reach, in km (25 when left out).' }),
	garment: z.enum(garmentIds, { error: 'Choose a garment from the list.' }).optional(),
	q: words.optional(),
	cursor: cursor.refine((key) => 'distanceM' in key, 'This cursor belongs to a list in another order.').optional(),
	limit
});
export type NearbyWorkroomsQuery = z.output<typeof nearbyWorkroomsQuery>;
