import { z } from 'zod';
import { budgetSchema, sizeBandRangeSchema } from '../commissions/response-schemas';

/* The JSON answers of GET /api/v1/commissions and GET /api/v1/tailors, as `commissionItem` and `workroomItem` build them. */

const distanceKm = z.number().meta({ description: 'From the search point, in kilometres (rounded).' });
const nextCursor = z
	.string()
	.nullable()
	.meta({ description: 'Pass as `cursor` for the next page; null on the last page.' });
const point = z.object({ lat: z.number(), lng: z.number() }).meta({ id: 'Point', description: 'Decimal degrees.' });

/** One open commission in a tailor's near-me list (`commissionItem`). */
export const nearbyCommissionResponse = z
	.object({
		id: z.uuid(),
		title: z.string(),
		garment: z.string().meta({ description: 'A garment id, or `other` (then see `garmentOther`).' }),
		garmentOther: z.string(),
		sizeBand: z.array(sizeBandRangeSchema),
		sizeBandText: z.string().nullable().meta({ description: 'The size band in the caller’s unit.' }),
		budget: budgetSchema.nullable(),
		dateNeeded: z.iso.date().nullable(),
		fabricSource: z.enum(['customer_supplies', 'tailor_sources']),
		handover: z.enum(['pickup', 'delivery']),
		town: z.string().nullable(),
		district: z.string().nullable(),
		publishedAt: z.iso.datetime().nullable(),
		photo: z
			.object({ thumbUrl: z.string().meta({ description: 'The first photo’s thumbnail path.' }), altText: z.string() })
			.nullable(),
		distanceKm
	})
	.meta({ id: 'NearbyCommission', description: 'An open commission as a tailor’s near-me list shows it.' });

/** `GET /api/v1/commissions` → 200. */
export const nearbyCommissionPage = z
	.object({
		items: z.array(nearbyCommissionResponse),
		nextCursor,
		near: point.meta({ description: 'Where the list is centred: the `near` asked for, or the workroom’s place.' }),
		radiusKm: z.number().meta({ description: 'How far the list reaches, in kilometres.' })
	})
	.meta({ id: 'NearbyCommissionPage' });

/** One workroom in a near-me list (`workroomItem`). */
export const nearbyWorkroomResponse = z
	.object({
		id: z.uuid(),
		slug: z.string(),
		name: z.string(),
		town: z.string(),
		district: z.string().nullable(),
		specialties: z.array(z.string()).meta({ description: 'Garment ids.' }),
		serviceRadiusKm: z.number(),
		servesYou: z.boolean().meta({ description: 'Whether the search point lies within the workroom’s service radius.' }),
		coverThumbUrl: z.string().nullable().meta({ description: 'The portfolio cover’s thumbnail path.' }),
		reviews: z.object({
			count: z.int(),
			averageHundredths: z.int().nullable().meta({ description: 'The average rating times 100 (450 is 4.5).' })
		}),
		distanceKm
	})
	.meta({ id: 'NearbyWorkroom', description: 'A workroom taking work, as a near-me list shows it.' });

/** `GET /api/v1/tailors` → 200. */
export const nearbyWorkroomPage = z
	.object({ items: z.array(nearbyWorkroomResponse), nextCursor })
	.meta({ id: 'NearbyWorkroomPage' });
